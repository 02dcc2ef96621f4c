import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps, type Timestamps } from './columns';

export interface ContainerType extends Timestamps {}
export class ContainerType extends Model<InferAttributes<ContainerType>, InferCreationAttributes<ContainerType>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare usualTareGrams: number;
  declare active: CreationOptional<boolean>;
}

export function initContainerType(sequelize: Sequelize) {
  return ContainerType.init(
    {
      ...serialId(),
      name: { type: DataTypes.STRING(60), allowNull: false, unique: true },
      usualTareGrams: { type: DataTypes.INTEGER, allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'ContainerType', tableName: 'container_types', underscored: true },
  );
}
