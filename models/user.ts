import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps, type Timestamps } from './columns';
import type { Role } from '@/lib/auth/roles';

export interface User extends Timestamps {}
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare passwordHash: string | null;
  declare phone: CreationOptional<string | null>;
  declare disabledAt: CreationOptional<Date | null>;
  declare sessionVersion: CreationOptional<number>;
  declare weightUnit: CreationOptional<'metric' | 'us' | null>;
}

export function initUser(sequelize: Sequelize) {
  return User.init(
    {
      ...serialId(),
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      role: { type: DataTypes.ENUM('owner', 'keeper', 'crew', 'customer'), allowNull: false },
      passwordHash: { type: DataTypes.STRING(200), allowNull: true },
      phone: { type: DataTypes.STRING(40), allowNull: true },
      disabledAt: { type: DataTypes.DATE, allowNull: true },
      sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      weightUnit: { type: DataTypes.ENUM('metric', 'us'), allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'User', tableName: 'users', underscored: true },
  );
}
