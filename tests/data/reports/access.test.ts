import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { closeDb, getDb } from '@/lib/db/index';
import { getSeasonReport } from '@/lib/data/reports/yield-report';
import { getRecallList, traceInput } from '@/lib/data/trace/trace';
import { gs1RawElementString } from '@/lib/domain/gs1';
import { GET as csvGET } from '@/app/api/reports/csv/route';
import { GET as pdfGET } from '@/app/api/reports/keeper-pdf/route';
import { GET as recallGET } from '@/app/api/trace/recall/route';
import { seasonRecipientsAction, sendKeeperReportAction } from '@/app/(back-office)/admin/reports/actions';
import type { SessionUser } from '@/lib/auth/session';
import { DEMO, signInAs } from '@/tests/support/session';
import { buildFixture, type Fixture } from '@/tests/support/report-fixtures';

const SEASON = 2032;
let fx: Fixture;
const as = (id: number, role: SessionUser['role']): SessionUser => ({
  id,
  name: 'x',
  email: 'x@hollowmere.test',
  role,
});
const pdfReq = (keeperId: number) =>
  pdfGET(new Request(`http://127.0.0.1/api/reports/keeper-pdf?keeper=${keeperId}&season=${SEASON}`));

beforeAll(async () => {
  fx = await buildFixture(SEASON, 'RA');
});
afterAll(closeDb);

describe('a keeper sees only their own colonies', () => {
  it("page data: own colonies only; another keeper's report is null (404)", async () => {
    const mine = (await getSeasonReport(as(fx.keeper, 'keeper'), { season: SEASON }))!;
    expect(
      mine.colonies
        .map((c) => c.code)
        .filter((c) => c.startsWith('RA-'))
        .sort(),
    ).toEqual(['RA-A1', 'RA-A2']);
    expect(mine.colonies.every((c) => c.keeperId === fx.keeper)).toBe(true);
    expect(await getSeasonReport(as(fx.keeper, 'keeper'), { season: SEASON, keeperId: fx.keeper2 })).toBeNull();
    expect(await getSeasonReport(as(fx.owner, 'crew'), { season: SEASON })).toBeNull();
    const all = (await getSeasonReport(as(fx.owner, 'owner'), { season: SEASON, keeperId: fx.keeper2 }))!;
    expect(
      all.colonies
        .map((c) => c.code)
        .filter((c) => c.startsWith('RA-'))
        .sort(),
    ).toEqual(['RA-B1', 'RA-B2']);
    expect(all.colonies.every((c) => c.keeperId === fx.keeper2)).toBe(true);
  });

  it('CSV route: a keeper gets their own rows; asking for another keeper is a 404; crew is refused', async () => {
    await signInAs(DEMO.keeper);
    const own = await csvGET(new Request(`http://127.0.0.1/api/reports/csv?table=colonies&season=${SEASON}`));
    expect(own.status).toBe(200);
    const text = await own.text();
    expect(text).toContain('RA-A1');
    expect(text).not.toContain('RA-B1');
    const other = await csvGET(
      new Request(`http://127.0.0.1/api/reports/csv?table=colonies&season=${SEASON}&keeper=${fx.keeper2}`),
    );
    expect(other.status).toBe(404);
    const bad = await csvGET(new Request(`http://127.0.0.1/api/reports/csv?table=secrets&season=${SEASON}`));
    expect(bad.status).toBe(400);
    await signInAs(DEMO.crew);
    expect((await csvGET(new Request(`http://127.0.0.1/api/reports/csv?season=${SEASON}`))).status).toBe(403);
  });

  it("PDF route: own report is a PDF, another keeper's is a 404; the owner may read any", async () => {
    await signInAs(DEMO.keeper);
    const own = await pdfReq(fx.keeper);
    expect(own.status).toBe(200);
    expect(own.headers.get('content-type')).toBe('application/pdf');
    expect(
      Buffer.from(await own.arrayBuffer())
        .subarray(0, 5)
        .toString(),
    ).toBe('%PDF-');
    expect((await pdfReq(fx.keeper2)).status).toBe(404);
    await signInAs(DEMO.owner);
    expect((await pdfReq(fx.keeper2)).status).toBe(200);
    expect((await pdfGET(new Request(`http://127.0.0.1/api/reports/keeper-pdf?season=${SEASON}`))).status).toBe(400);
    expect((await pdfReq(fx.cust1)).status).toBe(404); // not a keeper
    await signInAs(null);
    expect((await pdfReq(fx.keeper)).status).toBe(401);
  });
});

describe('recall list', () => {
  it('lists exactly the customers whose orders were allocated (sold) to the lot', async () => {
    // Lot B: customer two bought 2 of its jars; customer one 1 jar of the blend C made from it.
    const rows = await getRecallList(fx.lotB);
    expect(rows.map((r) => [r.email, r.lotCode, r.jars])).toEqual([
      ['ra-one@example.test', 'RA-003', 1],
      ['ra-two@example.test', 'RA-002', 2],
    ]);
    // Lot A: customer one (3 jars of A, and 1 of blend C made from A); customer three only reserved, not sold.
    const a = await getRecallList(fx.lotA);
    expect(new Set(a.map((r) => r.email))).toEqual(new Set(['ra-one@example.test']));
    expect(a.map((r) => [r.lotCode, r.jars]).sort()).toEqual([
      ['RA-001', 3],
      ['RA-003', 1],
    ]);
    expect(a[0].address).toContain('Mill Lane');
    expect(await getRecallList(fx.lotD)).toEqual([]);
  });

  it('for a demo lot with sales, lists exactly the customers of its sold allocations', async () => {
    const { sequelize } = getDb();
    const [lot] = await sequelize.query<{ id: number }>(
      `SELECT oa.lot_id AS id FROM order_allocations oa WHERE oa.state = 'sold'
         AND NOT EXISTS (SELECT 1 FROM lot_parents lp WHERE lp.parent_lot_id = oa.lot_id)
       GROUP BY oa.lot_id ORDER BY COUNT(*) DESC LIMIT 1`,
      { type: QueryTypes.SELECT },
    );
    const expected = await sequelize.query<{ email: string; jars: number }>(
      `SELECT o.email, SUM(oa.quantity)::int AS jars FROM order_allocations oa JOIN order_lines ol ON ol.id = oa.order_line_id
       JOIN orders o ON o.id = ol.order_id WHERE oa.lot_id = :id AND oa.state = 'sold' GROUP BY o.email ORDER BY o.email`,
      { type: QueryTypes.SELECT, replacements: { id: lot.id } },
    );
    expect(expected.length).toBeGreaterThan(0);
    const rows = await getRecallList(lot.id);
    const got = new Map<string, number>();
    for (const r of rows) got.set(r.email, (got.get(r.email) ?? 0) + r.jars);
    expect([...got].sort()).toEqual(expected.map((e) => [e.email, e.jars]));
  });

  it('recall CSV and PDF routes for the crew; keepers are refused', async () => {
    await signInAs(DEMO.crew);
    const csv = await recallGET(new Request(`http://127.0.0.1/api/trace/recall?lot=${fx.lotB}&format=csv`));
    expect(csv.status).toBe(200);
    const lines = (await csv.text()).trim().split('\r\n');
    expect(lines).toHaveLength(3);
    expect(lines[2]).toContain('ra-two@example.test');
    const pdf = await recallGET(new Request(`http://127.0.0.1/api/trace/recall?lot=${fx.lotB}&format=pdf`));
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect((await recallGET(new Request('http://127.0.0.1/api/trace/recall?lot=99999999'))).status).toBe(404);
    expect((await recallGET(new Request('http://127.0.0.1/api/trace/recall?lot=abc'))).status).toBe(400);
    await signInAs(DEMO.keeper);
    expect((await recallGET(new Request(`http://127.0.0.1/api/trace/recall?lot=${fx.lotB}`))).status).toBe(403);
  });
});

describe('trace input', () => {
  it('reads a jar barcode (bracketed or raw scan), a lot code, a super tag and an order number', async () => {
    const bracketed = `(01)09506000134352(15)331231(10)RA-002`;
    for (const input of [bracketed, `]C1${gs1RawElementString(bracketed)}`, 'ra-002']) {
      const r = await traceInput(input);
      expect(r.lots.map((l) => l.lot.code)).toEqual(['RA-002']);
      expect(r.lots[0].colonies.map((c) => c.code).sort()).toEqual(['RA-A2', 'RA-B1']);
      expect(r.lots[0].children.map((c) => c.code)).toEqual(['RA-003']);
      expect(r.lots[0].recall.map((x) => x.email)).toEqual(['ra-one@example.test', 'ra-two@example.test']);
      expect(r.ms).toBeGreaterThan(0);
    }
    expect((await traceInput(bracketed)).match?.kind).toBe('jar');
    const order = await traceInput('RA-1');
    expect(order.match?.kind).toBe('order');
    expect(order.lots.map((l) => l.lot.code).sort()).toEqual(['RA-001', 'RA-003']);
    const blend = order.lots.find((l) => l.lot.code === 'RA-003')!;
    expect(blend.parents.map((p) => p.code)).toEqual(['RA-001', 'RA-002']);
    expect((await traceInput('no-such-thing')).match).toBeNull();
  });

  it('a super tag leads to its colony and lot, with feedings and treatments while it was on', async () => {
    const { sequelize } = getDb();
    await sequelize.query(`UPDATE super_pulls SET tag_code = 'RA-T1' WHERE id = :id`, { replacements: { id: fx.s4 } });
    const [{ id: kind }] = await sequelize.query<{ id: number }>(
      `INSERT INTO treatment_kinds (name, supers_allowed, waiting_days, created_at, updated_at) VALUES ('RA strip', false, 14, NOW(), NOW()) RETURNING id`,
      { type: QueryTypes.SELECT },
    );
    await sequelize.query(
      `INSERT INTO treatments (colony_id, treatment_kind_id, applied_on, removed_on, supers_allowed, waiting_days, created_at, updated_at)
      VALUES (:c, :k, '${SEASON}-04-01', '${SEASON}-04-25', false, 14, NOW(), NOW()), (:c, :k, '${SEASON}-09-01', NULL, false, 14, NOW(), NOW())`,
      { replacements: { c: fx.c3, k: kind } },
    );
    await sequelize.query(
      `INSERT INTO feedings (colony_id, kind, started_on, ended_on, created_at, updated_at) VALUES (:c, 'sugar_syrup', '${SEASON}-06-01', '${SEASON}-06-03', NOW(), NOW())`,
      { replacements: { c: fx.c3 } },
    );
    const r = await traceInput('ra-t1');
    expect(r.match?.kind).toBe('super');
    expect(r.lots.map((l) => l.lot.code)).toEqual(['RA-002']);
    const events = r.lots[0].events.filter((e) => e.colonyCode === 'RA-B1');
    // The April treatment's window runs to 25 April + 14 days = 9 May, past put-on (1 May); the September one started after the pull.
    expect(events.map((e) => [e.kind, e.fromOn]).sort()).toEqual([
      ['feeding', `${SEASON}-06-01`],
      ['treatment', `${SEASON}-04-01`],
    ]);
  });
});

describe('sending season reports', () => {
  it('lists keepers with colonies that season and enqueues one mail per keeper, once', async () => {
    await signInAs(DEMO.owner);
    const list = await seasonRecipientsAction({ season: SEASON });
    expect(list.ok && list.data.map((k) => k.id).sort()).toEqual([fx.keeper, fx.keeper2].sort());
    const first = await sendKeeperReportAction({ season: SEASON, keeperId: fx.keeper });
    expect(first).toMatchObject({ ok: true, data: { queued: true } });
    const again = await sendKeeperReportAction({ season: SEASON, keeperId: fx.keeper });
    expect(again).toMatchObject({ ok: true, data: { queued: false } });
    const rows = await getDb().models.OutboxMessage.findAll({
      where: { dedupeKey: `season-report-${SEASON}-${fx.keeper}` },
    });
    expect(rows).toHaveLength(1);
    expect(rows[0].toAddress).toBe(DEMO.keeper);
    expect(rows[0].attachments[0].contentType).toBe('application/pdf');
    expect(Buffer.from(rows[0].attachments[0].base64, 'base64').subarray(0, 5).toString()).toBe('%PDF-');
    // A season with no colonies sends nothing; keepers may not send.
    const empty = await seasonRecipientsAction({ season: 2099 });
    expect(empty.ok && empty.data).toEqual([]);
    expect(await sendKeeperReportAction({ season: 2099, keeperId: fx.keeper })).toMatchObject({ ok: false });
    await signInAs(DEMO.keeper);
    expect(await sendKeeperReportAction({ season: SEASON, keeperId: fx.keeper2 })).toMatchObject({ ok: false });
  });
});
