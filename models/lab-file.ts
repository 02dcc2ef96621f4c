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

/** A laboratory report of a lot (the file itself) with the results read from it. */
export class LabFile extends Model<InferAttributes<LabFile>, InferCreationAttributes<LabFile>> {
  declare id: CreationOptional<number>;
  declare lotId: number;
  declare filename: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare data: Buffer;
  declare hmfMgKg: CreationOptional<number | null>;
  declare diastaseSchade: CreationOptional<number | null>;
  declare insolubleG100g: CreationOptional<number | null>;
  declare fructoseGlucoseG100g: CreationOptional<number | null>;
  declare sucroseG100g: CreationOptional<number | null>;
  declare conductivityMsCm: CreationOptional<number | null>;
  declare freeAcidMeqKg: CreationOptional<number | null>;
  declare uploadedBy: number | null;
  declare voidedAt: CreationOptional<Date | null>;
  declare voidedBy: CreationOptional<number | null>;
  declare voidReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare lot?: NonAttribute<Lot>;
}

export function initLabFile(sequelize: Sequelize) {
  return LabFile.init(
    {
      ...serialId(),
      lotId: { type: DataTypes.INTEGER, allowNull: false },
      filename: { type: DataTypes.STRING(200), allowNull: false },
      contentType: { type: DataTypes.STRING(60), allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      data: { type: DataTypes.BLOB, allowNull: false },
      hmfMgKg: { type: DataTypes.DECIMAL(6, 1), allowNull: true },
      diastaseSchade: { type: DataTypes.DECIMAL(5, 1), allowNull: true },
      insolubleG100g: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
      fructoseGlucoseG100g: { type: DataTypes.DECIMAL(5, 1), allowNull: true },
      sucroseG100g: { type: DataTypes.DECIMAL(5, 1), allowNull: true },
      conductivityMsCm: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
      freeAcidMeqKg: { type: DataTypes.DECIMAL(6, 1), allowNull: true },
      uploadedBy: { type: DataTypes.INTEGER, allowNull: true },
      ...voidColumns(),
      ...timestamps(),
    },
    { sequelize, modelName: 'LabFile', tableName: 'lab_files', underscored: true },
  );
}
