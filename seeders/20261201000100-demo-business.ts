import type { QueryInterface } from 'sequelize';
import { hashPassword } from '../lib/auth/password';
import { DEMO_ACCOUNTS } from './demo-accounts';

// Hollowmere Apiaries in the fictional Marrow Valley: invented for the demo; no real business.
export async function up({ context: q }: { context: QueryInterface }) {
  const now = new Date();
  await q.bulkInsert('business_settings', [
    {
      id: 1,
      business_name: 'Hollowmere Apiaries',
      address: '4 Sedge Lane, Marrow Valley',
      region: 'Marrow Valley',
      contact_email: 'hello@hollowmere.test',
      story:
        'A family honey business in the Marrow Valley. We keep about forty colonies in four yards, pull the supers ourselves and jar every lot by hand, so each jar can be traced back to the hives that made it.',
      public_lot_note:
        'Thank you for buying honey from our own colonies. Raw, strained, never heated above hive temperature.',
      time_zone: 'Europe/London',
      currency: 'usd',
      weight_system: 'metric',
      gs1_company_prefix: '0614141',
      lot_code_prefix: 'HH',
      // The demo keepers also pull straight from the yard without reading tags.
      allow_untagged_supers: true,
      shipping_bands: JSON.stringify([
        { upToGrams: 1000, cents: 595 },
        { upToGrams: 3000, cents: 895 },
        { upToGrams: 10000, cents: 1495 },
      ]),
      super_estimates: JSON.stringify({}),
      created_at: now,
      updated_at: now,
    },
  ]);
  const rows = [];
  for (const a of DEMO_ACCOUNTS) {
    rows.push({
      email: a.email,
      name: a.name,
      role: a.role,
      password_hash: await hashPassword(a.password),
      session_version: 1,
      created_at: now,
      updated_at: now,
    });
  }
  await q.bulkInsert('users', rows);
}

export async function down({ context: q }: { context: QueryInterface }) {
  await q.bulkDelete('users', { email: DEMO_ACCOUNTS.map((a) => a.email) });
  await q.bulkDelete('business_settings', { id: 1 });
}
