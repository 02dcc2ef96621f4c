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
import type { SuperPull } from './super-pull';
import type { LotContainer } from './lot-container';
import type { MoistureReading } from './moisture-reading';
import type { LabFile } from './lab-file';
import type { LotParent } from './lot-parent';
import type { JarringRun } from './jarring-run';
import type { StockLevel } from './stock-level';

export const LOT_STAGES = ['gathering', 'extracted', 'released', 'packed_out', 'held'] as const;
export type LotStage = (typeof LOT_STAGES)[number];
export const HONEY_ORIGINS = ['blossom', 'honeydew', 'honeydew-blossom-blend'] as const;
export type HoneyOrigin = (typeof HONEY_ORIGINS)[number];

export interface Lot extends Timestamps {}
export class Lot extends Model<InferAttributes<Lot>, InferCreationAttributes<Lot>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare floralSource: CreationOptional<string>;
  declare heather: CreationOptional<boolean>;
  /** The honey category of 2001/110/EC Annex II (lib/domain/lab-results.ts HoneyCategory). */
  declare honeyOrigin: CreationOptional<HoneyOrigin>;
  declare bakers: CreationOptional<boolean>;
  declare pressed: CreationOptional<boolean>;
  declare tropical: CreationOptional<boolean>;
  declare lowEnzyme: CreationOptional<boolean>;
  declare annexSource: CreationOptional<string | null>;
  declare extractedOn: CreationOptional<string | null>;
  declare stage: CreationOptional<LotStage>;
  declare holdReasons: CreationOptional<string[]>;
  declare isBlend: CreationOptional<boolean>;
  /** Kept up to date in the same transaction as containers, blends and jarring runs. */
  declare netGrams: CreationOptional<number>;
  declare usedGrams: CreationOptional<number>;
  declare cappingsWaxGrams: CreationOptional<number | null>;
  declare bestBeforeOn: CreationOptional<string | null>;
  declare notes: CreationOptional<string>;
  declare createdBy: number | null;
  declare superPulls?: NonAttribute<SuperPull[]>;
  declare containers?: NonAttribute<LotContainer[]>;
  declare readings?: NonAttribute<MoistureReading[]>;
  declare labFiles?: NonAttribute<LabFile[]>;
  declare jarringRuns?: NonAttribute<JarringRun[]>;
  declare stockLevels?: NonAttribute<StockLevel[]>;
  /** Links to the lots this blend was made from (this lot is the child). */
  declare parentLinks?: NonAttribute<LotParent[]>;
  /** Links to the blends made from this lot (this lot is the parent). */
  declare childLinks?: NonAttribute<LotParent[]>;
}

export function initLot(sequelize: Sequelize) {
  return Lot.init(
    {
      ...serialId(),
      code: { type: DataTypes.STRING(20), allowNull: false, unique: true },
      floralSource: { type: DataTypes.STRING(80), allowNull: false, defaultValue: '' },
      heather: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      honeyOrigin: {
        type: DataTypes.STRING(24),
        allowNull: false,
        defaultValue: 'blossom',
        validate: { isIn: [HONEY_ORIGINS] },
      },
      bakers: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      pressed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      tropical: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      lowEnzyme: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      annexSource: { type: DataTypes.STRING(40), allowNull: true },
      extractedOn: { type: DataTypes.DATEONLY, allowNull: true },
      stage: {
        type: DataTypes.STRING(12),
        allowNull: false,
        defaultValue: 'gathering',
        validate: { isIn: [LOT_STAGES] },
      },
      holdReasons: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      isBlend: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      netGrams: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      usedGrams: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      cappingsWaxGrams: { type: DataTypes.INTEGER, allowNull: true },
      bestBeforeOn: { type: DataTypes.DATEONLY, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdBy: { type: DataTypes.INTEGER, allowNull: true },
      ...timestamps(),
    },
    { sequelize, modelName: 'Lot', tableName: 'lots', underscored: true },
  );
}
