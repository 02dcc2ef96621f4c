import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps, type Timestamps } from './columns';
import type { Lot } from './lot';

/** Blends: grams of a parent lot that went into a child lot. */
export interface LotParent extends Timestamps {}
export class LotParent extends Model<InferAttributes<LotParent>, InferCreationAttributes<LotParent>> {
  declare id: CreationOptional<number>;
  declare childLotId: number;
  declare parentLotId: number;
  declare grams: number;
  declare parent?: NonAttribute<Lot>;
  declare child?: NonAttribute<Lot>;
}

export function initLotParent(sequelize: Sequelize) {
  return LotParent.init(
    {
      ...serialId(),
      childLotId: { type: DataTypes.INTEGER, allowNull: false },
      parentLotId: { type: DataTypes.INTEGER, allowNull: false },
      grams: { type: DataTypes.INTEGER, allowNull: false },
      ...timestamps(),
    },
    { sequelize, modelName: 'LotParent', tableName: 'lot_parents', underscored: true },
  );
}
