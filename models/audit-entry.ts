import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { bigSerialId, createdAtOnly } from './columns';

/** Who changed what and when; written in the same transaction as the change. Never updated. */
export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare actorUserId: number | null;
  declare action: string;
  declare entityType: string;
  declare entityId: string;
  declare before: CreationOptional<Record<string, unknown> | null>;
  declare after: CreationOptional<Record<string, unknown> | null>;
  declare reason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initAuditEntry(sequelize: Sequelize) {
  return AuditEntry.init(
    {
      ...bigSerialId(),
      actorUserId: { type: DataTypes.INTEGER, allowNull: true },
      action: { type: DataTypes.STRING(60), allowNull: false },
      entityType: { type: DataTypes.STRING(40), allowNull: false },
      entityId: { type: DataTypes.STRING(40), allowNull: false },
      before: { type: DataTypes.JSONB, allowNull: true },
      after: { type: DataTypes.JSONB, allowNull: true },
      reason: { type: DataTypes.TEXT, allowNull: true },
      ...createdAtOnly(),
    },
    { sequelize, modelName: 'AuditEntry', tableName: 'audit_entries', underscored: true, updatedAt: false },
  );
}
