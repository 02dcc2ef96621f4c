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
import type { Colony } from './colony';

export const COLONY_EVENT_KINDS = ['note', 'split', 'move', 'status'] as const;
export type ColonyEventKind = (typeof COLONY_EVENT_KINDS)[number];

/** Timeline entries that are not supers, feedings or treatments: notes, splits, moves, status changes. */
export class ColonyEvent extends Model<InferAttributes<ColonyEvent>, InferCreationAttributes<ColonyEvent>> {
  declare id: CreationOptional<number>;
  declare colonyId: number;
  declare kind: ColonyEventKind;
  declare occurredOn: string;
  declare details: CreationOptional<Record<string, unknown>>;
  declare note: CreationOptional<string>;
  declare recordedBy: number | null;
  declare idempotencyKey: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare colony?: NonAttribute<Colony>;
}

export function initColonyEvent(sequelize: Sequelize) {
  return ColonyEvent.init(
    {
      ...serialId(),
      colonyId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(20), allowNull: false, validate: { isIn: [COLONY_EVENT_KINDS] } },
      occurredOn: { type: DataTypes.DATEONLY, allowNull: false },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      recordedBy: { type: DataTypes.INTEGER, allowNull: true },
      ...idempotencyKey(),
      ...timestamps(),
    },
    { sequelize, modelName: 'ColonyEvent', tableName: 'colony_events', underscored: true },
  );
}
