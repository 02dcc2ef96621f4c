import 'server-only';
import { getDb } from '@/lib/db';

/** Whether the database answers a trivial query (the health check). */
export async function databaseAnswers(): Promise<boolean> {
  try {
    await getDb().sequelize.query('SELECT 1');
    return true;
  } catch {
    return false;
  }
}
