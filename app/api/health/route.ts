import { databaseAnswers } from '@/lib/data/health';

export const dynamic = 'force-dynamic';

/** Load balancers ask this: 200 when the database answers, 503 when it does not. */
export async function GET() {
  if (await databaseAnswers())
    return Response.json({ status: 'ok', database: 'ok' }, { headers: { 'Cache-Control': 'no-store' } });
  return Response.json({ status: 'degraded', database: 'unreachable' }, { status: 503 });
}
