import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { serialId, idempotencyKey, timestamps, type IdempotencyKey, type Timestamps } from './columns';
import type { FillAssessment, RunReferenceTest, assessFillUs } from '@/lib/domain/fill-check';
import type { Lot } from './lot';
import type { Product } from './product';

export const FILL_RULE_SETS = ['oiml', 'nist'] as const;
export type FillRuleSet = (typeof FILL_RULE_SETS)[number];
/**
 * The fill check's result as computed for ruleSet. oiml: the producer's check (assessFill) at the top
 * level and, for runs recorded since it was wired in, the 76/211/EEC Annex II reference test with the
 * jar count as the batch under `reference`. nist: assessFillUs. fillPass is the decision over all.
 */
export type FillReport = (FillAssessment & { reference?: RunReferenceTest }) | ReturnType<typeof assessFillUs>;

/** Jars filled from one lot into one product, with sample fill weights. */
export interface JarringRun extends Timestamps, IdempotencyKey {}
export class JarringRun extends Model<InferAttributes<JarringRun>, InferCreationAttributes<JarringRun>> {
  declare id: CreationOptional<number>;
  declare lotId: number;
  declare productId: number;
  declare jarCount: number;
  declare runOn: string;
  /** Net fill weights of the sampled jars, grams. */
  declare sampleGrams: CreationOptional<number[]>;
  declare ruleSet: FillRuleSet;
  declare fillPass: boolean;
  /** Required although the column defaults to {}: every run is checked, and `{}` is no FillReport. */
  declare fillReport: FillReport;
  declare honeyUsedGrams: number;
  /** A failing run's jars are not stock until the owner overrides with a reason. */
  declare overrideReason: CreationOptional<string | null>;
  declare overrideBy: CreationOptional<number | null>;
  declare createdBy: number | null;
  declare lot?: NonAttribute<Lot>;
  declare product?: NonAttribute<Product>;
}

export function initJarringRun(sequelize: Sequelize) {
  return JarringRun.init(
    {
      ...serialId(),
      lotId: { type: DataTypes.INTEGER, allowNull: false },
      productId: { type: DataTypes.INTEGER, allowNull: false },
      jarCount: { type: DataTypes.INTEGER, allowNull: false },
      runOn: { type: DataTypes.DATEONLY, allowNull: false },
      sampleGrams: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      ruleSet: { type: DataTypes.STRING(8), allowNull: false, validate: { isIn: [FILL_RULE_SETS] } },
      fillPass: { type: DataTypes.BOOLEAN, allowNull: false },
      fillReport: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      honeyUsedGrams: { type: DataTypes.INTEGER, allowNull: false },
      overrideReason: { type: DataTypes.TEXT, allowNull: true },
      overrideBy: { type: DataTypes.INTEGER, allowNull: true },
      createdBy: { type: DataTypes.INTEGER, allowNull: true },
      ...idempotencyKey(),
      ...timestamps(),
    },
    { sequelize, modelName: 'JarringRun', tableName: 'jarring_runs', underscored: true },
  );
}
