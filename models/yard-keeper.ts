import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { createdAtOnly } from './columns';

/** Which keepers work a yard (join table of Yard ↔ User). */
export class YardKeeper extends Model<InferAttributes<YardKeeper>, InferCreationAttributes<YardKeeper>> {
  declare yardId: number;
  declare userId: number;
  declare createdAt: CreationOptional<Date>;
}

export function initYardKeeper(sequelize: Sequelize) {
  return YardKeeper.init(
    {
      yardId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      ...createdAtOnly(),
    },
    { sequelize, modelName: 'YardKeeper', tableName: 'yard_keepers', underscored: true, updatedAt: false },
  );
}
