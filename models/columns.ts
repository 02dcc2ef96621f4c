import { DataTypes } from 'sequelize';

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
