import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { colonyRecordColumns, type ColonyRecordFields } from './columns';
import type { TreatmentKind } from './treatment-kind';

export interface Treatment extends ColonyRecordFields {}
export class Treatment extends Model<InferAttributes<Treatment>, InferCreationAttributes<Treatment>> {
  declare treatmentKindId: number;
  declare productName: CreationOptional<string>;
  declare appliedOn: string;
  declare removedOn: CreationOptional<string | null>;
  /** Copied from the kind when recorded, so a later edit of the list does not rewrite history. */
  declare supersAllowed: boolean;
  declare waitingDays: number;
  declare kind?: NonAttribute<TreatmentKind>;
}

export function initTreatment(sequelize: Sequelize) {
  return Treatment.init(
    colonyRecordColumns({
      treatmentKindId: { type: DataTypes.INTEGER, allowNull: false },
      productName: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
      appliedOn: { type: DataTypes.DATEONLY, allowNull: false },
      removedOn: { type: DataTypes.DATEONLY, allowNull: true },
      supersAllowed: { type: DataTypes.BOOLEAN, allowNull: false },
      waitingDays: { type: DataTypes.INTEGER, allowNull: false },
    }),
    { sequelize, modelName: 'Treatment', tableName: 'treatments', underscored: true },
  );
}
