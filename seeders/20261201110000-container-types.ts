import type { QueryInterface } from 'sequelize';

// Usual container kinds of a honey house with a typical empty weight (editable by the owner).
const TYPES = [
  { name: 'Bucket 30 lb', usual_tare_grams: 900 },
  { name: 'Pail 60 lb', usual_tare_grams: 1600 },
  { name: 'Drum 55 gal', usual_tare_grams: 22000 },
  { name: 'Settling tank', usual_tare_grams: 0 },
];

export async function up({ context: q }: { context: QueryInterface }) {
  for (const t of TYPES) {
    // Another seeder may already have made some; names are unique.
    await q.sequelize.query(
      `INSERT INTO container_types (name, usual_tare_grams, active, created_at, updated_at) VALUES (:name, :tare, true, now(), now()) ON CONFLICT (name) DO NOTHING`,
      { replacements: { name: t.name, tare: t.usual_tare_grams } },
    );
  }
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.bulkDelete('container_types', { name: TYPES.map((t) => t.name) });
}
