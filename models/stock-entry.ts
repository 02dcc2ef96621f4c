import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { bigSerialId, createdAtOnly } from './columns';
import type { Lot } from './lot';
import type { Product } from './product';
import type { JarringRun } from './jarring-run';
import type { Order } from './order';

export const STOCK_ENTRY_KINDS = ['jarring', 'order', 'breakage', 'adjustment', 'return'] as const;
export type StockEntryKind = (typeof STOCK_ENTRY_KINDS)[number];

/** Every change of on-hand stock, append-only. */
export class StockEntry extends Model<InferAttributes<StockEntry>, InferCreationAttributes<StockEntry>> {
  declare id: CreationOptional<number>;
  declare productId: number;
  declare lotId: number;
  declare delta: number;
  declare kind: StockEntryKind;
  declare reason: CreationOptional<string>;
  declare jarringRunId: CreationOptional<number | null>;
  /** No foreign key in the database (orders are created later in the migrations). */
  declare orderId: CreationOptional<number | null>;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare product?: NonAttribute<Product>;
  declare lot?: NonAttribute<Lot>;
  declare jarringRun?: NonAttribute<JarringRun | null>;
  declare order?: NonAttribute<Order | null>;
}

export function initStockEntry(sequelize: Sequelize) {
  return StockEntry.init(
    {
      ...bigSerialId(),
      productId: { type: DataTypes.INTEGER, allowNull: false },
      lotId: { type: DataTypes.INTEGER, allowNull: false },
      delta: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(12), allowNull: false, validate: { isIn: [STOCK_ENTRY_KINDS] } },
      reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      jarringRunId: { type: DataTypes.INTEGER, allowNull: true },
      orderId: { type: DataTypes.INTEGER, allowNull: true },
      createdBy: { type: DataTypes.INTEGER, allowNull: true },
      ...createdAtOnly(),
    },
    { sequelize, modelName: 'StockEntry', tableName: 'stock_entries', underscored: true, updatedAt: false },
  );
}
