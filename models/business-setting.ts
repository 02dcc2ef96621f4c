import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { timestamps, type Timestamps } from './columns';

export type ShippingBand = { upToGrams: number; cents: number };
import type { SuperEstimates } from '@/lib/domain/yield-allocation';
export type { SuperEstimates };

/** The single row (id 1) of the business's own settings. */
export interface BusinessSetting extends Timestamps {}
export class BusinessSetting extends Model<InferAttributes<BusinessSetting>, InferCreationAttributes<BusinessSetting>> {
  declare id: number;
  declare businessName: string;
  declare address: CreationOptional<string>;
  declare region: CreationOptional<string>;
  declare contactEmail: CreationOptional<string>;
  declare story: CreationOptional<string>;
  declare publicLotNote: CreationOptional<string>;
  declare timeZone: CreationOptional<string>;
  declare currency: CreationOptional<string>;
  declare weightSystem: CreationOptional<'metric' | 'us'>;
  declare gs1CompanyPrefix: CreationOptional<string>;
  declare lotCodePrefix: CreationOptional<string>;
  declare moistureLimitPct: CreationOptional<number>;
  declare moistureLimitHeatherPct: CreationOptional<number>;
  declare moistureGradeAPct: CreationOptional<number>;
  // The table's hmf_max_mg_kg, diastase_min_schade and insoluble_max_g100g columns are unused and
  // not mapped: release follows the lot's honey category (2001/110/EC Annex II), not owner limits.
  declare bestBeforeMonths: CreationOptional<number>;
  /** Whether a super may go on or come off with no tag (else every super carries a printed tag). */
  declare allowUntaggedSupers: CreationOptional<boolean>;
  declare seasonStartMonth: CreationOptional<number>;
  declare expectedLossPct: CreationOptional<number>;
  declare fillRuleSet: CreationOptional<'oiml' | 'nist'>;
  declare labelDeclaration: CreationOptional<'us-dual' | 'metric'>;
  declare barcodeKind: CreationOptional<'gs1-128' | 'gs1datamatrix'>;
  declare shippingBands: CreationOptional<ShippingBand[]>;
  declare superEstimates: CreationOptional<SuperEstimates>;
}

export function initBusinessSetting(sequelize: Sequelize) {
  const dec = (p: number, s: number) => DataTypes.DECIMAL(p, s);
  return BusinessSetting.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true },
      businessName: { type: DataTypes.STRING(120), allowNull: false },
      address: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      region: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
      contactEmail: { type: DataTypes.STRING(254), allowNull: false, defaultValue: '' },
      story: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      publicLotNote: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      timeZone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
      currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'usd' },
      weightSystem: { type: DataTypes.ENUM('metric', 'us'), allowNull: false, defaultValue: 'metric' },
      gs1CompanyPrefix: { type: DataTypes.STRING(12), allowNull: false, defaultValue: '' },
      lotCodePrefix: { type: DataTypes.STRING(6), allowNull: false, defaultValue: 'HH' },
      moistureLimitPct: { type: dec(4, 1), allowNull: false, defaultValue: 20 },
      moistureLimitHeatherPct: { type: dec(4, 1), allowNull: false, defaultValue: 23 },
      moistureGradeAPct: { type: dec(4, 1), allowNull: false, defaultValue: 18.6 },
      bestBeforeMonths: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 24 },
      allowUntaggedSupers: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      seasonStartMonth: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      expectedLossPct: { type: dec(4, 1), allowNull: false, defaultValue: 2 },
      fillRuleSet: { type: DataTypes.ENUM('oiml', 'nist'), allowNull: false, defaultValue: 'oiml' },
      labelDeclaration: { type: DataTypes.ENUM('us-dual', 'metric'), allowNull: false, defaultValue: 'metric' },
      barcodeKind: { type: DataTypes.ENUM('gs1-128', 'gs1datamatrix'), allowNull: false, defaultValue: 'gs1-128' },
      shippingBands: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      superEstimates: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      ...timestamps(),
    },
    { sequelize, modelName: 'BusinessSetting', tableName: 'business_settings', underscored: true },
  );
}
