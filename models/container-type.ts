import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class ContainerType extends Model<InferAttributes<ContainerType>, InferCreationAttributes<ContainerType>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare usualTareGrams: number;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initContainerType(sequelize: Sequelize) {
  return ContainerType.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(60), allowNull: false, unique: true },
      usualTareGrams: { type: DataTypes.INTEGER, allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'ContainerType', tableName: 'container_types', underscored: true },
  );
}
