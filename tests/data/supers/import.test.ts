import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, setRequestHeaders, signInAs } from '@/tests/support/session';
import { yardFixture } from '@/tests/support/yard-fixtures';
import { POST } from '@/app/api/super-pulls/import/route';

afterAll(closeDb);
beforeEach(() => setRequestHeaders({}));

let f: Awaited<ReturnType<typeof yardFixture>>;
beforeAll(async () => {
  f = await yardFixture('IMP');
});

const MAPPING = {
  colonyCode: 'Colony',
  pulledOn: 'Date',
  depth: 'Box',
  fullWeight: 'Weight',
  weightUnit: 'Unit',
  tagCode: 'Tag',
};
function upload(csv: string | Blob, fields: Record<string, string>, name = 'sheet.csv', type = 'text/csv') {
  const form = new FormData();
  form.set('file', new File([csv], name, { type }));
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return POST(new Request('http://127.0.0.1:3100/api/super-pulls/import', { method: 'POST', body: form }));
}

const SHEET = [
  'Colony,Date,Box,Weight,Unit,Tag',
  'IMP-A1,2026-07-01,medium,22.5,kg,IMP-1',
  'imp-a2,2026-07-01,shallow,40,lb,IMP-2',
  'IMP-B1,2026-07-01,medium,20,kg,IMP-3', // keeper B's colony: unknown to keeper A
  'IMP-A3,01/07/2026,medium,20,kg,IMP-4',
  'IMP-A3,2026-07-02,medium,80,kg,IMP-5',
  'IMP-A1,2026-07-01,medium,21,kg,IMP-1',
].join('\n');

describe('field-sheet import', () => {
  it('previews every row with its errors', async () => {
    await signInAs(DEMO.keeper);
    const res = await upload(SHEET, { mode: 'preview', mapping: JSON.stringify(MAPPING) });
    expect(res.status).toBe(200);
    const p = await res.json();
    expect(p.valid.map((r: { row: number }) => r.row)).toEqual([1, 2]);
    expect(p.valid[1]).toMatchObject({ colonyCode: 'IMP-A2', fullGrams: 18144 }); // 40 lb = 18 143.69 g
    const messages = Object.fromEntries(
      p.errors.map((e: { row: number; messages: string[] }) => [e.row, e.messages.join('; ')]),
    );
    expect(messages[3]).toMatch(/Unknown colony "IMP-B1"/);
    expect(messages[4]).toMatch(/not a YYYY-MM-DD date/);
    expect(messages[5]).toMatch(/outside 2–45 kg/);
    expect(messages[6]).toMatch(/Same colony, date and tag as row 1/);
  });

  it('guesses the mapping from the headers when none is given', async () => {
    await signInAs(DEMO.keeper);
    const p = await (await upload(SHEET, { mode: 'preview' })).json();
    expect(p.mapping).toMatchObject({
      colonyCode: 'Colony',
      pulledOn: 'Date',
      depth: 'Box',
      fullWeight: 'Weight',
      tagCode: 'Tag',
    });
    expect(p.valid).toHaveLength(2);
  });

  it('all or nothing: a failure while storing the second row leaves no row stored', async () => {
    await signInAs(DEMO.keeper);
    const { SuperPull } = getDb().models;
    const before = await SuperPull.count();
    const real = SuperPull.create.bind(SuperPull);
    let calls = 0;
    const spy = vi.spyOn(SuperPull, 'create').mockImplementation(((...args: Parameters<typeof real>) => {
      calls++;
      if (calls === 2) return Promise.reject(new Error('disk full (simulated)'));
      return real(...args);
    }) as typeof SuperPull.create);
    const res = await upload(SHEET, { mode: 'commit', mapping: JSON.stringify(MAPPING) });
    spy.mockRestore();
    expect(res.status).toBe(500);
    expect(calls).toBe(2);
    expect(await SuperPull.count()).toBe(before);
  });

  it('imports the valid rows in one go and reports the rejected ones', async () => {
    await signInAs(DEMO.keeper);
    const { SuperPull } = getDb().models;
    const res = await upload(SHEET, { mode: 'commit', mapping: JSON.stringify(MAPPING), expectedValid: '2' });
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({ imported: 2 });
    expect(body.errors).toHaveLength(4);
    const rows = await SuperPull.findAll({ where: { tagCode: ['IMP-1', 'IMP-2'] } });
    expect(rows.map((r) => r.colonyId).sort()).toEqual([f.a1, f.a2].sort());
    // The same sheet again: its tags are now pulled boxes waiting for extraction, so nothing is valid.
    const again = await upload(SHEET, { mode: 'commit', mapping: JSON.stringify(MAPPING) });
    expect(again.status).toBe(422);
    expect(await SuperPull.count({ where: { tagCode: ['IMP-1', 'IMP-2'] } })).toBe(2);
  });

  it('refuses files that are not CSV, or over 5 MB, with a clear message', async () => {
    await signInAs(DEMO.keeper);
    const pdf = await upload('%PDF-1.7', { mode: 'preview' }, 'sheet.pdf', 'application/pdf');
    expect(pdf.status).toBe(415);
    expect((await pdf.json()).error).toMatch(/Only CSV files/);
    const big = await upload(new Blob(['Colony,Date,Box\n', 'x'.repeat(5 * 1024 * 1024)]), { mode: 'preview' });
    expect(big.status).toBe(413);
    expect((await big.json()).error).toMatch(/larger than 5 MB/);
  });

  it('imports 1,000 rows in one transaction (timed)', async () => {
    await signInAs(DEMO.keeper);
    const lines = ['Colony,Date,Box,Weight,Unit,Tag'];
    for (let i = 0; i < 1000; i++)
      lines.push(
        `IMP-A${(i % 3) + 1},2026-0${6 + (i % 3)}-${String((i % 28) + 1).padStart(2, '0')},medium,${18 + (i % 10)},kg,BULK-${i}`,
      );
    const started = performance.now();
    const res = await upload(lines.join('\n'), { mode: 'commit', mapping: JSON.stringify(MAPPING) });
    const ms = Math.round(performance.now() - started);
    console.log(`[measure] 1000-row field-sheet import: ${ms} ms`);
    expect(res.status).toBe(200);
    expect((await res.json()).imported).toBe(1000);
    expect(await getDb().models.SuperPull.count({ where: { colonyId: [f.a1, f.a2, f.a3] } })).toBeGreaterThanOrEqual(
      1000,
    );
  });

  it('crew may not import', async () => {
    await signInAs(DEMO.crew);
    expect((await upload(SHEET, { mode: 'commit', mapping: JSON.stringify(MAPPING) })).status).toBe(403);
  });
});
