import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** Last sequence used per prefix and year; the row is locked while a lot code is taken (no gaps, no duplicates). */
export class LotSequence extends Model<InferAttributes<LotSequence>, InferCreationAttributes<LotSequence>> {
  declare prefix: string;
  declare year: number;
  declare lastValue: CreationOptional<number>;
}

export function initLotSequence(sequelize: Sequelize) {
  return LotSequence.init(
    {
      prefix: { type: DataTypes.STRING(6), allowNull: false, primaryKey: true },
      year: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
      lastValue: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    },
    { sequelize, modelName: 'LotSequence', tableName: 'lot_sequences', underscored: true, timestamps: false },
  );
}
