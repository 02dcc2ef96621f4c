import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { lotRecordColumns, type LotRecordFields } from './columns';

/** ri: refractive index; scale: a honey refractometer's own % water scale. */
export const MOISTURE_METHODS = ['ri', 'scale'] as const;
export type MoistureMethod = (typeof MOISTURE_METHODS)[number];

export interface MoistureReading extends LotRecordFields {}
export class MoistureReading extends Model<InferAttributes<MoistureReading>, InferCreationAttributes<MoistureReading>> {
  declare method: MoistureMethod;
  declare refractiveIndex: CreationOptional<number | null>;
  declare scaleWaterPct: CreationOptional<number | null>;
  declare temperatureC: CreationOptional<number | null>;
  declare waterPct: number;
  declare takenOn: string;
  declare recordedBy: number | null;
}

export function initMoistureReading(sequelize: Sequelize) {
  return MoistureReading.init(
    lotRecordColumns({
      method: { type: DataTypes.STRING(8), allowNull: false, validate: { isIn: [MOISTURE_METHODS] } },
      refractiveIndex: { type: DataTypes.DECIMAL(6, 4), allowNull: true },
      scaleWaterPct: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
      temperatureC: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
      waterPct: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
      takenOn: { type: DataTypes.DATEONLY, allowNull: false },
      recordedBy: { type: DataTypes.INTEGER, allowNull: true },
    }),
    { sequelize, modelName: 'MoistureReading', tableName: 'moisture_readings', underscored: true },
  );
}
