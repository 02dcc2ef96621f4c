import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { colonyRecordColumns, type ColonyRecordFields } from './columns';

export const COLONY_EVENT_KINDS = ['note', 'split', 'move', 'status'] as const;
export type ColonyEventKind = (typeof COLONY_EVENT_KINDS)[number];

/** Timeline entries that are not supers, feedings or treatments: notes, splits, moves, status changes. */
export interface ColonyEvent extends ColonyRecordFields {}
export class ColonyEvent extends Model<InferAttributes<ColonyEvent>, InferCreationAttributes<ColonyEvent>> {
  declare kind: ColonyEventKind;
  declare occurredOn: string;
  declare details: CreationOptional<Record<string, unknown>>;
}

export function initColonyEvent(sequelize: Sequelize) {
  return ColonyEvent.init(
    colonyRecordColumns({
      kind: { type: DataTypes.STRING(20), allowNull: false, validate: { isIn: [COLONY_EVENT_KINDS] } },
      occurredOn: { type: DataTypes.DATEONLY, allowNull: false },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    }),
    { sequelize, modelName: 'ColonyEvent', tableName: 'colony_events', underscored: true },
  );
}
