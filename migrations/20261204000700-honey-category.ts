import type { QueryInterface } from 'sequelize';

// A lot carries its honey category for the composition check of Council Directive 2001/110/EC,
// Annex II (origin, baker's, pressed, declared tropical origin, low natural enzyme content, floral
// source), and a lab report the further Annex II results (sugars, sucrose, conductivity, free acid).
export async function up({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`
    ALTER TABLE lots
      ADD COLUMN honey_origin varchar(24) NOT NULL DEFAULT 'blossom'
        CONSTRAINT lots_honey_origin_ck CHECK (honey_origin IN ('blossom', 'honeydew', 'honeydew-blossom-blend')),
      ADD COLUMN bakers boolean NOT NULL DEFAULT false,
      ADD COLUMN pressed boolean NOT NULL DEFAULT false,
      ADD COLUMN tropical boolean NOT NULL DEFAULT false,
      ADD COLUMN low_enzyme boolean NOT NULL DEFAULT false,
      ADD COLUMN annex_source varchar(40) NULL
  `);
  await q.sequelize.query(`
    ALTER TABLE lab_files
      ADD COLUMN fructose_glucose_g100g numeric(5,1) NULL,
      ADD COLUMN sucrose_g100g numeric(5,1) NULL,
      ADD COLUMN conductivity_ms_cm numeric(5,2) NULL,
      ADD COLUMN free_acid_meq_kg numeric(6,1) NULL
  `);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`
    ALTER TABLE lab_files
      DROP COLUMN fructose_glucose_g100g, DROP COLUMN sucrose_g100g,
      DROP COLUMN conductivity_ms_cm, DROP COLUMN free_acid_meq_kg
  `);
  await q.sequelize.query(`
    ALTER TABLE lots
      DROP COLUMN honey_origin, DROP COLUMN bakers, DROP COLUMN pressed,
      DROP COLUMN tropical, DROP COLUMN low_enzyme, DROP COLUMN annex_source
  `);
}
