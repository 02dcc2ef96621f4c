import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { bigSerialId, createdAtOnly } from './columns';

export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare ip: string;
  declare succeeded: boolean;
  declare createdAt: CreationOptional<Date>;
}

export function initSignInAttempt(sequelize: Sequelize) {
  return SignInAttempt.init(
    {
      ...bigSerialId(),
      email: { type: DataTypes.STRING(254), allowNull: false },
      ip: { type: DataTypes.STRING(64), allowNull: false },
      succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
      ...createdAtOnly(),
    },
    { sequelize, modelName: 'SignInAttempt', tableName: 'sign_in_attempts', underscored: true, updatedAt: false },
  );
}
