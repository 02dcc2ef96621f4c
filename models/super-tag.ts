import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps, type Timestamps } from './columns';

export const SUPER_DEPTHS = ['deep', 'medium', 'shallow'] as const;
export type SuperDepth = (typeof SUPER_DEPTHS)[number];

/** A physical super box with its printed tag. */
export interface SuperTag extends Timestamps {}
export class SuperTag extends Model<InferAttributes<SuperTag>, InferCreationAttributes<SuperTag>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare depth: SuperDepth;
  declare frameCount: CreationOptional<number>;
  declare retiredAt: CreationOptional<Date | null>;
}

export function initSuperTag(sequelize: Sequelize) {
  return SuperTag.init(
    {
      ...serialId(),
      code: { type: DataTypes.STRING(30), allowNull: false, unique: true },
      depth: { type: DataTypes.STRING(10), allowNull: false, validate: { isIn: [SUPER_DEPTHS] } },
      frameCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 10 },
      retiredAt: { type: DataTypes.DATE, allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'SuperTag', tableName: 'super_tags', underscored: true },
  );
}
