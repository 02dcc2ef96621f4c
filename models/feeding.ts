import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { serialId, idempotencyKey, timestamps } from './columns';
import type { FeedingKind } from '@/lib/domain/conflicts';
import type { Colony } from './colony';

/** The union lives with the super-conflict rules; re-exported here with its values. */
export type { FeedingKind };
export const FEEDING_KINDS = [
  'sugar_syrup',
  'fondant',
  'pollen_substitute',
  'other',
] as const satisfies readonly FeedingKind[];

export class Feeding extends Model<InferAttributes<Feeding>, InferCreationAttributes<Feeding>> {
  declare id: CreationOptional<number>;
  declare colonyId: number;
  declare kind: FeedingKind;
  declare amount: CreationOptional<string>;
  declare startedOn: string;
  declare endedOn: CreationOptional<string | null>;
  declare note: CreationOptional<string>;
  declare recordedBy: number | null;
  declare idempotencyKey: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare colony?: NonAttribute<Colony>;
}

export function initFeeding(sequelize: Sequelize) {
  return Feeding.init(
    {
      ...serialId(),
      colonyId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(20), allowNull: false, validate: { isIn: [FEEDING_KINDS] } },
      amount: { type: DataTypes.STRING(60), allowNull: false, defaultValue: '' },
      startedOn: { type: DataTypes.DATEONLY, allowNull: false },
      endedOn: { type: DataTypes.DATEONLY, allowNull: true },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      recordedBy: { type: DataTypes.INTEGER, allowNull: true },
      ...idempotencyKey(),
      ...timestamps(),
    },
    { sequelize, modelName: 'Feeding', tableName: 'feedings', underscored: true },
  );
}
