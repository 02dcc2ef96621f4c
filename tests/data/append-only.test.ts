import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db';

afterAll(closeDb);
const q = (sql: string) => getDb().sequelize.query(sql);

describe('append-only records', () => {
  it('the audit log and the stock ledger cannot be changed or deleted', async () => {
    await expect(
      q(`UPDATE audit_entries SET reason = 'rewritten' WHERE id = (SELECT min(id) FROM audit_entries)`),
    ).rejects.toThrow(/append-only/);
    await expect(q(`DELETE FROM audit_entries`)).rejects.toThrow(/append-only/);
    await expect(
      q(`UPDATE stock_entries SET delta = delta + 1 WHERE id = (SELECT min(id) FROM stock_entries)`),
    ).rejects.toThrow(/append-only/);
  });

  it('lots and their readings are voided, never deleted', async () => {
    await expect(q(`DELETE FROM moisture_readings WHERE id = (SELECT min(id) FROM moisture_readings)`)).rejects.toThrow(
      /append-only/,
    );
    await expect(q(`DELETE FROM lot_containers WHERE id = (SELECT min(id) FROM lot_containers)`)).rejects.toThrow(
      /append-only/,
    );
    await expect(q(`DELETE FROM lots WHERE id = (SELECT min(id) FROM lots)`)).rejects.toThrow(/append-only/);
    // Voiding (an update) is how a reading is corrected.
    const [, meta] = await q(
      `UPDATE moisture_readings SET void_reason = void_reason WHERE id = (SELECT min(id) FROM moisture_readings)`,
    );
    expect((meta as { rowCount: number }).rowCount).toBe(1);
  });
});
