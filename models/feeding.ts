import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { colonyRecordColumns, type ColonyRecordFields } from './columns';
import type { FeedingKind } from '@/lib/domain/conflicts';

/** The union lives with the super-conflict rules; re-exported here with its values. */
export type { FeedingKind };
export const FEEDING_KINDS = [
  'sugar_syrup',
  'fondant',
  'pollen_substitute',
  'other',
] as const satisfies readonly FeedingKind[];

export interface Feeding extends ColonyRecordFields {}
export class Feeding extends Model<InferAttributes<Feeding>, InferCreationAttributes<Feeding>> {
  declare kind: FeedingKind;
  declare amount: CreationOptional<string>;
  declare startedOn: string;
  declare endedOn: CreationOptional<string | null>;
}

export function initFeeding(sequelize: Sequelize) {
  return Feeding.init(
    colonyRecordColumns({
      kind: { type: DataTypes.STRING(20), allowNull: false, validate: { isIn: [FEEDING_KINDS] } },
      amount: { type: DataTypes.STRING(60), allowNull: false, defaultValue: '' },
      startedOn: { type: DataTypes.DATEONLY, allowNull: false },
      endedOn: { type: DataTypes.DATEONLY, allowNull: true },
    }),
    { sequelize, modelName: 'Feeding', tableName: 'feedings', underscored: true },
  );
}
