import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps, type Timestamps } from './columns';

export interface PasswordToken extends Timestamps {}
export class PasswordToken extends Model<InferAttributes<PasswordToken>, InferCreationAttributes<PasswordToken>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare purpose: 'set' | 'reset';
  /** SHA-256 of the token sent by e-mail; the token itself is never stored. */
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
}

export function initPasswordToken(sequelize: Sequelize) {
  return PasswordToken.init(
    {
      ...serialId(),
      userId: { type: DataTypes.INTEGER, allowNull: false },
      purpose: { type: DataTypes.ENUM('set', 'reset'), allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'PasswordToken', tableName: 'password_tokens', underscored: true },
  );
}
