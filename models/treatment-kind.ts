import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps, type Timestamps } from './columns';

/** Owner-editable list of treatments; the real product's label governs, this is only a record of it. */
export interface TreatmentKind extends Timestamps {}
export class TreatmentKind extends Model<InferAttributes<TreatmentKind>, InferCreationAttributes<TreatmentKind>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare supersAllowed: CreationOptional<boolean>;
  declare waitingDays: CreationOptional<number>;
  declare notes: CreationOptional<string>;
  declare active: CreationOptional<boolean>;
}

export function initTreatmentKind(sequelize: Sequelize) {
  return TreatmentKind.init(
    {
      ...serialId(),
      name: { type: DataTypes.STRING(80), allowNull: false, unique: true },
      supersAllowed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      waitingDays: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'TreatmentKind', tableName: 'treatment_kinds', underscored: true },
  );
}
