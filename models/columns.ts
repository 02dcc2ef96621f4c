import { DataTypes, type CreationOptional, type NonAttribute } from 'sequelize';
import type { Colony } from './colony';
import type { Lot } from './lot';

// Columns that many tables share, spread into a model's attributes (`...serialId()`). Each call
// returns fresh objects: Sequelize writes into attribute definitions (field names, references).

/** `id SERIAL PRIMARY KEY`. */
export function serialId() {
  return { id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true } };
}

/** `id BIGSERIAL PRIMARY KEY`, for the tables that only grow (audit, outbox, ledger, sign-in attempts). */
export function bigSerialId() {
  return { id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true } };
}

/** created_at and updated_at, kept by Sequelize. */
export function timestamps() {
  return { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE };
}

/** created_at alone, for rows that are never updated (the model's options say `updatedAt: false`). */
export function createdAtOnly() {
  return { createdAt: DataTypes.DATE };
}

type VoidColumns<By extends string> = {
  voidedAt: { type: typeof DataTypes.DATE; allowNull: true };
  voidReason: { type: typeof DataTypes.TEXT; allowNull: true };
} & Record<By, { type: typeof DataTypes.INTEGER; allowNull: true }>;

/** A row corrected by voiding, never deleted: when, by which user (the `voidedBy` column unless `by` names another), and why. */
export function voidColumns(): VoidColumns<'voidedBy'>;
export function voidColumns<By extends string>(by: By): VoidColumns<By>;
export function voidColumns(by = 'voidedBy') {
  return {
    voidedAt: { type: DataTypes.DATE, allowNull: true },
    [by]: { type: DataTypes.INTEGER, allowNull: true },
    voidReason: { type: DataTypes.TEXT, allowNull: true },
  };
}

/** The client's key for a record sent from a phone, so a retried send is stored once. */
export function idempotencyKey() {
  return { idempotencyKey: { type: DataTypes.STRING(80), allowNull: true, unique: true } };
}

// The declared fields that go with these columns. A model takes them by interface–class declaration
// merging, beside its own `declare`s:
//   export interface Yard extends Timestamps {}
//   export class Yard extends Model<InferAttributes<Yard>, InferCreationAttributes<Yard>> { … }
// An interface only declares, like `declare` does: no class field shadows Sequelize's attribute getters.

/** The fields of `timestamps()`. */
export interface Timestamps {
  createdAt: CreationOptional<Date>;
  updatedAt: CreationOptional<Date>;
}

/** The fields of `voidColumns()` (or `voidColumns(by)`). */
export type VoidFields<By extends string = 'voidedBy'> = {
  voidedAt: CreationOptional<Date | null>;
  voidReason: CreationOptional<string | null>;
} & { [K in By]: CreationOptional<number | null> };

/** The fields of `idempotencyKey()`. */
export interface IdempotencyKey {
  idempotencyKey: CreationOptional<string | null>;
}

/** A feeding, treatment or timeline event of a colony: who recorded it, with a note, sent once from a phone. */
export interface ColonyRecordFields extends Timestamps, IdempotencyKey {
  id: CreationOptional<number>;
  colonyId: number;
  note: CreationOptional<string>;
  recordedBy: number | null;
  colony?: NonAttribute<Colony>;
}

/** A colony record's columns: id and colony, then the record's `own` columns, then note, recorder, key and timestamps. */
export function colonyRecordColumns<Own extends object>(own: Own) {
  return {
    ...serialId(),
    colonyId: { type: DataTypes.INTEGER, allowNull: false },
    ...own,
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    recordedBy: { type: DataTypes.INTEGER, allowNull: true },
    ...idempotencyKey(),
    ...timestamps(),
  };
}

/** A container, moisture reading or lab file of a lot, corrected by voiding. */
export interface LotRecordFields extends Timestamps, VoidFields {
  id: CreationOptional<number>;
  lotId: number;
  lot?: NonAttribute<Lot>;
}

/** A lot record's columns: id and lot, then the record's `own` columns, then the void columns and timestamps. */
export function lotRecordColumns<Own extends object>(own: Own) {
  return {
    ...serialId(),
    lotId: { type: DataTypes.INTEGER, allowNull: false },
    ...own,
    ...voidColumns(),
    ...timestamps(),
  };
}

/** An uploaded file stored in the row (a product photo, a lab report). */
export interface FileFields {
  filename: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  data: Buffer;
}

/** The columns of `FileFields`. */
export function fileColumns() {
  return {
    filename: { type: DataTypes.STRING(200), allowNull: false },
    contentType: { type: DataTypes.STRING(60), allowNull: false },
    sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    data: { type: DataTypes.BLOB, allowNull: false },
  };
}
