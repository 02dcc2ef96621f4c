import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps } from './columns';

/** Uploaded images and other binary files, served by a route handler, never from public/. */
export class StoredFile extends Model<InferAttributes<StoredFile>, InferCreationAttributes<StoredFile>> {
  declare id: CreationOptional<number>;
  declare filename: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare data: Buffer;
  declare uploadedBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initStoredFile(sequelize: Sequelize) {
  return StoredFile.init(
    {
      ...serialId(),
      filename: { type: DataTypes.STRING(200), allowNull: false },
      contentType: { type: DataTypes.STRING(60), allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      data: { type: DataTypes.BLOB, allowNull: false },
      uploadedBy: { type: DataTypes.INTEGER, allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'StoredFile', tableName: 'stored_files', underscored: true },
  );
}
