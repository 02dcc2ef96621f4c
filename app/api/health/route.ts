import { getDb } from '@/lib/db';

export const dynamic = 'force-dynamic';

/** Load balancers ask this: 200 when the database answers, 503 when it does not. */
export async function GET() {
  try {
    await getDb().sequelize.query('SELECT 1');
    return Response.json({ status: 'ok', database: 'ok' }, { headers: { 'Cache-Control': 'no-store' } });
  } catch {
    return Response.json({ status: 'degraded', database: 'unreachable' }, { status: 503 });
  }
}
