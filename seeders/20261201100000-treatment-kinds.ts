import type { QueryInterface } from 'sequelize';

/**
 * A starting list of mite treatment kinds. It is an editable list, not advice: the owner
 * sets "supers allowed" and the waiting period from the label of the product actually used.
 * Defaults are on the cautious side (no supers) except for mechanical methods.
 * ON CONFLICT keeps rows another seeder (or the owner) already made.
 */
const KINDS = [
  { name: 'Oxalic acid', supers_allowed: false, waiting_days: 0 },
  { name: 'Formic acid', supers_allowed: false, waiting_days: 0 },
  { name: 'Thymol', supers_allowed: false, waiting_days: 0 },
  { name: 'Amitraz strips', supers_allowed: false, waiting_days: 14 },
  { name: 'Drone brood removal (mechanical)', supers_allowed: true, waiting_days: 0 },
];
const NOTE = 'Set from the product label you use; local rules apply.';

export async function up({ context: q }: { context: QueryInterface }) {
  for (const k of KINDS) {
    await q.sequelize.query(
      `INSERT INTO treatment_kinds (name, supers_allowed, waiting_days, notes, active, created_at, updated_at)
       VALUES (:name, :supers_allowed, :waiting_days, :notes, true, now(), now()) ON CONFLICT (name) DO NOTHING`,
      { replacements: { ...k, notes: NOTE } },
    );
  }
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`DELETE FROM treatment_kinds t WHERE t.name IN (:names) AND t.notes = :notes AND NOT EXISTS (SELECT 1 FROM treatments x WHERE x.treatment_kind_id = t.id)`, { replacements: { names: KINDS.map((k) => k.name), notes: NOTE } });
}
