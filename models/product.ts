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
import type { StoredFile } from './stored-file';
import type { StockLevel } from './stock-level';

/** The unit the label declares the net quantity in. */
export const DECLARED_UNITS = ['g', 'oz'] as const;
export type DeclaredUnit = (typeof DECLARED_UNITS)[number];

export interface Product extends Timestamps {}
export class Product extends Model<InferAttributes<Product>, InferCreationAttributes<Product>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare name: string;
  declare description: CreationOptional<string>;
  declare netGrams: number;
  declare declaredUnit: CreationOptional<DeclaredUnit>;
  /** The amount in declaredUnit, e.g. 12 (oz). */
  declare declaredAmount: number;
  declare containerKind: string;
  declare containerGrams: number;
  declare priceCents: number;
  declare gtin: CreationOptional<string | null>;
  declare photoId: CreationOptional<number | null>;
  declare active: CreationOptional<boolean>;
  declare sortOrder: CreationOptional<number>;
  declare photo?: NonAttribute<StoredFile | null>;
  declare stockLevels?: NonAttribute<StockLevel[]>;
}

export function initProduct(sequelize: Sequelize) {
  return Product.init(
    {
      ...serialId(),
      slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      netGrams: { type: DataTypes.INTEGER, allowNull: false },
      declaredUnit: {
        type: DataTypes.STRING(2),
        allowNull: false,
        defaultValue: 'g',
        validate: { isIn: [DECLARED_UNITS] },
      },
      declaredAmount: { type: DataTypes.DECIMAL(8, 2), allowNull: false },
      containerKind: { type: DataTypes.STRING(60), allowNull: false },
      containerGrams: { type: DataTypes.INTEGER, allowNull: false },
      priceCents: { type: DataTypes.INTEGER, allowNull: false },
      gtin: { type: DataTypes.STRING(14), allowNull: true, unique: true },
      photoId: { type: DataTypes.INTEGER, allowNull: true },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      sortOrder: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      ...timestamps(),
    },
    { sequelize, modelName: 'Product', tableName: 'products', underscored: true },
  );
}
