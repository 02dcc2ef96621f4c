import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { bigSerialId, timestamps, type Timestamps } from './columns';

export type OutboxAttachment = { filename: string; contentType: string; base64: string };

export interface OutboxMessage extends Timestamps {}
export class OutboxMessage extends Model<InferAttributes<OutboxMessage>, InferCreationAttributes<OutboxMessage>> {
  declare id: CreationOptional<number>;
  /** Same key, same message: sending twice is harmless. */
  declare dedupeKey: CreationOptional<string | null>;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: CreationOptional<string | null>;
  declare attachments: CreationOptional<OutboxAttachment[]>;
  declare status: CreationOptional<'pending' | 'sent' | 'failed'>;
  declare attempts: CreationOptional<number>;
  declare lastError: CreationOptional<string | null>;
  declare nextAttemptAt: CreationOptional<Date>;
  declare sentAt: CreationOptional<Date | null>;
}

export function initOutboxMessage(sequelize: Sequelize) {
  return OutboxMessage.init(
    {
      ...bigSerialId(),
      dedupeKey: { type: DataTypes.STRING(200), allowNull: true, unique: true },
      toAddress: { type: DataTypes.STRING(254), allowNull: false },
      subject: { type: DataTypes.STRING(250), allowNull: false },
      textBody: { type: DataTypes.TEXT, allowNull: false },
      htmlBody: { type: DataTypes.TEXT, allowNull: true },
      attachments: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      status: { type: DataTypes.ENUM('pending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lastError: { type: DataTypes.TEXT, allowNull: true },
      nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      sentAt: { type: DataTypes.DATE, allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'OutboxMessage', tableName: 'outbox_messages', underscored: true },
  );
}
