import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { serialId, idempotencyKey, timestamps } from './columns';
import type { Colony } from './colony';
import type { TreatmentKind } from './treatment-kind';

export class Treatment extends Model<InferAttributes<Treatment>, InferCreationAttributes<Treatment>> {
  declare id: CreationOptional<number>;
  declare colonyId: number;
  declare treatmentKindId: number;
  declare productName: CreationOptional<string>;
  declare appliedOn: string;
  declare removedOn: CreationOptional<string | null>;
  /** Copied from the kind when recorded, so a later edit of the list does not rewrite history. */
  declare supersAllowed: boolean;
  declare waitingDays: number;
  declare note: CreationOptional<string>;
  declare recordedBy: number | null;
  declare idempotencyKey: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare colony?: NonAttribute<Colony>;
  declare kind?: NonAttribute<TreatmentKind>;
}

export function initTreatment(sequelize: Sequelize) {
  return Treatment.init(
    {
      ...serialId(),
      colonyId: { type: DataTypes.INTEGER, allowNull: false },
      treatmentKindId: { type: DataTypes.INTEGER, allowNull: false },
      productName: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
      appliedOn: { type: DataTypes.DATEONLY, allowNull: false },
      removedOn: { type: DataTypes.DATEONLY, allowNull: true },
      supersAllowed: { type: DataTypes.BOOLEAN, allowNull: false },
      waitingDays: { type: DataTypes.INTEGER, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      recordedBy: { type: DataTypes.INTEGER, allowNull: true },
      ...idempotencyKey(),
      ...timestamps(),
    },
    { sequelize, modelName: 'Treatment', tableName: 'treatments', underscored: true },
  );
}
