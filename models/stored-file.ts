import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { fileColumns, serialId, timestamps, type FileFields, type Timestamps } from './columns';

/** Uploaded images and other binary files, served by a route handler, never from public/. */
export interface StoredFile extends Timestamps, FileFields {}
export class StoredFile extends Model<InferAttributes<StoredFile>, InferCreationAttributes<StoredFile>> {
  declare id: CreationOptional<number>;
  declare uploadedBy: number | null;
}

export function initStoredFile(sequelize: Sequelize) {
  return StoredFile.init(
    {
      ...serialId(),
      ...fileColumns(),
      uploadedBy: { type: DataTypes.INTEGER, allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'StoredFile', tableName: 'stored_files', underscored: true },
  );
}
