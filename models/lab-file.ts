import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { fileColumns, lotRecordColumns, type FileFields, type LotRecordFields } from './columns';

/** A laboratory report of a lot (the file itself) with the results read from it. */
export interface LabFile extends LotRecordFields, FileFields {}
export class LabFile extends Model<InferAttributes<LabFile>, InferCreationAttributes<LabFile>> {
  declare hmfMgKg: CreationOptional<number | null>;
  declare diastaseSchade: CreationOptional<number | null>;
  declare insolubleG100g: CreationOptional<number | null>;
  declare fructoseGlucoseG100g: CreationOptional<number | null>;
  declare sucroseG100g: CreationOptional<number | null>;
  declare conductivityMsCm: CreationOptional<number | null>;
  declare freeAcidMeqKg: CreationOptional<number | null>;
  declare uploadedBy: number | null;
}

export function initLabFile(sequelize: Sequelize) {
  return LabFile.init(
    lotRecordColumns({
      ...fileColumns(),
      hmfMgKg: { type: DataTypes.DECIMAL(6, 1), allowNull: true },
      diastaseSchade: { type: DataTypes.DECIMAL(5, 1), allowNull: true },
      insolubleG100g: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
      fructoseGlucoseG100g: { type: DataTypes.DECIMAL(5, 1), allowNull: true },
      sucroseG100g: { type: DataTypes.DECIMAL(5, 1), allowNull: true },
      conductivityMsCm: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
      freeAcidMeqKg: { type: DataTypes.DECIMAL(6, 1), allowNull: true },
      uploadedBy: { type: DataTypes.INTEGER, allowNull: true },
    }),
    { sequelize, modelName: 'LabFile', tableName: 'lab_files', underscored: true },
  );
}
