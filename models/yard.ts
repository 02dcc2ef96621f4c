import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps, type Timestamps } from './columns';
import type { User } from './user';
import type { Colony } from './colony';

export interface Yard extends Timestamps {}
export class Yard extends Model<InferAttributes<Yard>, InferCreationAttributes<Yard>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare place: CreationOptional<string>;
  declare latitude: CreationOptional<number | null>;
  declare longitude: CreationOptional<number | null>;
  declare forageNotes: CreationOptional<string>;
  declare archivedAt: CreationOptional<Date | null>;
  declare keepers?: NonAttribute<User[]>;
  declare colonies?: NonAttribute<Colony[]>;
}

export function initYard(sequelize: Sequelize) {
  return Yard.init(
    {
      ...serialId(),
      name: { type: DataTypes.STRING(80), allowNull: false, unique: true },
      place: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      latitude: { type: DataTypes.DECIMAL(9, 6), allowNull: true },
      longitude: { type: DataTypes.DECIMAL(9, 6), allowNull: true },
      forageNotes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      archivedAt: { type: DataTypes.DATE, allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'Yard', tableName: 'yards', underscored: true },
  );
}
