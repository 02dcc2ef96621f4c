import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { serialId, voidColumns, timestamps } from './columns';
import type { Lot } from './lot';

/** ri: refractive index; scale: a honey refractometer's own % water scale. */
export const MOISTURE_METHODS = ['ri', 'scale'] as const;
export type MoistureMethod = (typeof MOISTURE_METHODS)[number];

export class MoistureReading extends Model<InferAttributes<MoistureReading>, InferCreationAttributes<MoistureReading>> {
  declare id: CreationOptional<number>;
  declare lotId: number;
  declare method: MoistureMethod;
  declare refractiveIndex: CreationOptional<number | null>;
  declare scaleWaterPct: CreationOptional<number | null>;
  declare temperatureC: CreationOptional<number | null>;
  declare waterPct: number;
  declare takenOn: string;
  declare recordedBy: number | null;
  declare voidedAt: CreationOptional<Date | null>;
  declare voidedBy: CreationOptional<number | null>;
  declare voidReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare lot?: NonAttribute<Lot>;
}

export function initMoistureReading(sequelize: Sequelize) {
  return MoistureReading.init(
    {
      ...serialId(),
      lotId: { type: DataTypes.INTEGER, allowNull: false },
      method: { type: DataTypes.STRING(8), allowNull: false, validate: { isIn: [MOISTURE_METHODS] } },
      refractiveIndex: { type: DataTypes.DECIMAL(6, 4), allowNull: true },
      scaleWaterPct: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
      temperatureC: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
      waterPct: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
      takenOn: { type: DataTypes.DATEONLY, allowNull: false },
      recordedBy: { type: DataTypes.INTEGER, allowNull: true },
      ...voidColumns(),
      ...timestamps(),
    },
    { sequelize, modelName: 'MoistureReading', tableName: 'moisture_readings', underscored: true },
  );
}
