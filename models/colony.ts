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
import type { Yard } from './yard';
import type { ColonyEvent } from './colony-event';
import type { Feeding } from './feeding';
import type { Treatment } from './treatment';
import type { SuperPull } from './super-pull';

export const COLONY_ORIGINS = ['package', 'nucleus', 'swarm', 'purchased', 'split'] as const;
export type ColonyOrigin = (typeof COLONY_ORIGINS)[number];
export const COLONY_STATUSES = ['active', 'dead_out', 'combined', 'sold'] as const;
export type ColonyStatus = (typeof COLONY_STATUSES)[number];

export interface Colony extends Timestamps {}
export class Colony extends Model<InferAttributes<Colony>, InferCreationAttributes<Colony>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare yardId: number;
  declare keeperId: number;
  declare origin: ColonyOrigin;
  declare parentColonyId: CreationOptional<number | null>;
  declare queenYear: CreationOptional<number | null>;
  declare status: CreationOptional<ColonyStatus>;
  declare combinedIntoId: CreationOptional<number | null>;
  declare startedOn: CreationOptional<string | null>;
  declare notes: CreationOptional<string>;
  declare yard?: NonAttribute<Yard>;
  declare keeper?: NonAttribute<User>;
  declare parent?: NonAttribute<Colony | null>;
  declare splits?: NonAttribute<Colony[]>;
  declare combinedInto?: NonAttribute<Colony | null>;
  declare events?: NonAttribute<ColonyEvent[]>;
  declare feedings?: NonAttribute<Feeding[]>;
  declare treatments?: NonAttribute<Treatment[]>;
  declare superPulls?: NonAttribute<SuperPull[]>;
}

export function initColony(sequelize: Sequelize) {
  return Colony.init(
    {
      ...serialId(),
      code: { type: DataTypes.STRING(30), allowNull: false, unique: true },
      yardId: { type: DataTypes.INTEGER, allowNull: false },
      keeperId: { type: DataTypes.INTEGER, allowNull: false },
      origin: { type: DataTypes.STRING(20), allowNull: false, validate: { isIn: [COLONY_ORIGINS] } },
      parentColonyId: { type: DataTypes.INTEGER, allowNull: true },
      queenYear: { type: DataTypes.INTEGER, allowNull: true },
      status: {
        type: DataTypes.STRING(20),
        allowNull: false,
        defaultValue: 'active',
        validate: { isIn: [COLONY_STATUSES] },
      },
      combinedIntoId: { type: DataTypes.INTEGER, allowNull: true },
      startedOn: { type: DataTypes.DATEONLY, allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      ...timestamps(),
    },
    { sequelize, modelName: 'Colony', tableName: 'colonies', underscored: true },
  );
}
