import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { timestamps, type Timestamps } from './columns';
import type { Lot } from './lot';
import type { Product } from './product';

/** On-hand and reserved jars per product per lot; a CHECK keeps reserved ≤ on hand. */
export interface StockLevel extends Timestamps {}
export class StockLevel extends Model<InferAttributes<StockLevel>, InferCreationAttributes<StockLevel>> {
  declare productId: number;
  declare lotId: number;
  declare onHand: CreationOptional<number>;
  declare reserved: CreationOptional<number>;
  declare bestBeforeOn: string;
  declare product?: NonAttribute<Product>;
  declare lot?: NonAttribute<Lot>;
}

export function initStockLevel(sequelize: Sequelize) {
  return StockLevel.init(
    {
      productId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      lotId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      onHand: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      reserved: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      bestBeforeOn: { type: DataTypes.DATEONLY, allowNull: false },
      ...timestamps(),
    },
    { sequelize, modelName: 'StockLevel', tableName: 'stock_levels', underscored: true },
  );
}
