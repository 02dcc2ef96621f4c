import type { QueryInterface } from 'sequelize';
import { superConflicts, type FeedingRecord, type TreatmentRecord } from '../lib/domain/conflicts';
import { refractiveIndexFromWater, waterFromRefractiveIndex } from '../lib/domain/moisture';
import { lotCode } from '../lib/domain/lot-code';
import { assessFill } from '../lib/domain/fill-check';
import { bestBeforeDate, honeyUsedByRun } from '../lib/domain/jars';
import { makeGtin } from '../lib/domain/gs1';
import { DEFAULT_SUPER_ESTIMATES } from '../lib/domain/yield-allocation';

/**
 * One invented season of Hollowmere Apiaries (the demo business; all of it made up): four yards, about forty
 * colonies with a few splits and a dead-out, super pulls (two of them flagged, one voided as entered twice), feedings, treatments,
 * lots (a blend, one held for high moisture), products, jarring runs, stock and paid orders.
 * Deterministic: the same data on every machine. Derived values use the same domain functions as the app.
 */

const YEAR = 2026;
const now = new Date('2026-11-30T12:00:00Z');
const ts = { created_at: now, updated_at: now };

// Small deterministic PRNG (mulberry32) so the demo is identical everywhere.
function rng(seed: number) {
  return () => {
    seed |= 0;
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const rand = rng(20260601);
const between = (lo: number, hi: number) => Math.round(lo + rand() * (hi - lo));

type Row = Record<string, unknown>;
async function insert(q: QueryInterface, table: string, rows: Row[]): Promise<Row[]> {
  if (rows.length === 0) return [];
  const out = await q.bulkInsert(table, rows, { returning: true } as object);
  return out as unknown as Row[];
}
async function userId(q: QueryInterface, email: string): Promise<number> {
  const [rows] = await q.sequelize.query(`SELECT id FROM users WHERE email = :email`, { replacements: { email } });
  return (rows as { id: number }[])[0].id;
}

const YARDS = [
  {
    name: 'Orchard Terrace',
    prefix: 'OT',
    keeper: 'keeper@hollowmere.test',
    place: 'Terraced apple and pear orchard above the mill road',
    forage: 'Apple, pear and cherry blossom in spring; clover below the terraces.',
  },
  {
    name: 'Linden Row',
    prefix: 'LR',
    keeper: 'keeper@hollowmere.test',
    place: 'Old lime avenue behind the chapel',
    forage: 'Linden (lime) flow in early July; hawthorn in May.',
  },
  {
    name: 'Quarry Meadow',
    prefix: 'QM',
    keeper: 'keeper2@hollowmere.test',
    place: 'Wildflower meadow on the old quarry floor',
    forage: 'Knapweed, bramble and wild marjoram through late summer.',
  },
  {
    name: 'Fernbank',
    prefix: 'FB',
    keeper: 'keeper2@hollowmere.test',
    place: 'Woodland edge by the river fern banks',
    forage: 'Bramble, willowherb and late ivy; damp site.',
  },
];

const TREATMENT_KINDS = [
  {
    name: 'Oxalic acid, trickled',
    supers_allowed: false,
    waiting_days: 0,
    notes: 'Editable default. The product label governs.',
  },
  {
    name: 'Oxalic acid, vaporised',
    supers_allowed: false,
    waiting_days: 0,
    notes: 'Editable default. The product label governs.',
  },
  { name: 'Thymol gel', supers_allowed: false, waiting_days: 0, notes: 'Editable default. The product label governs.' },
  {
    name: 'Formic acid pads',
    supers_allowed: true,
    waiting_days: 0,
    notes: 'Some labels allow supers on; check yours. Editable default.',
  },
  {
    name: 'Amitraz strips',
    supers_allowed: false,
    waiting_days: 14,
    notes: 'Editable default. The product label governs.',
  },
  { name: 'Drone brood removal', supers_allowed: true, waiting_days: 0, notes: 'Management method, no product.' },
];

const ORIGINS = ['package', 'nucleus', 'swarm', 'purchased', 'nucleus'] as const;

type PullPlan = {
  colony: string;
  putOn: string;
  pulled: string | null;
  depth: 'deep' | 'medium' | 'shallow';
  weighed: boolean;
  lotKey: string | null;
};

export async function up({ context: q }: { context: QueryInterface }) {
  await q.sequelize.query(`UPDATE business_settings SET super_estimates = :est WHERE id = 1`, {
    replacements: { est: JSON.stringify(DEFAULT_SUPER_ESTIMATES) },
  });
  const owner = await userId(q, 'owner@hollowmere.test');
  const crew = await userId(q, 'crew@hollowmere.test');
  const keepers: Record<string, number> = {
    'keeper@hollowmere.test': await userId(q, 'keeper@hollowmere.test'),
    'keeper2@hollowmere.test': await userId(q, 'keeper2@hollowmere.test'),
  };

  // Yards and their keepers.
  const yards = await insert(
    q,
    'yards',
    YARDS.map((y) => ({ name: y.name, place: y.place, forage_notes: y.forage, ...ts })),
  );
  const yardId = Object.fromEntries(yards.map((y) => [y.name as string, y.id as number]));
  await insert(
    q,
    'yard_keepers',
    YARDS.map((y) => ({ yard_id: yardId[y.name], user_id: keepers[y.keeper], created_at: now })),
  );

  const kinds = await insert(
    q,
    'treatment_kinds',
    TREATMENT_KINDS.map((k) => ({ ...k, active: true, ...ts })),
  );
  const kindBy = Object.fromEntries(kinds.map((k) => [k.name as string, k]));

  // Colonies: ten per yard, then three splits made in May.
  const colonyRows = YARDS.flatMap((y) =>
    Array.from({ length: 10 }, (_, i) => ({
      code: `${y.prefix}-${String(i + 1).padStart(2, '0')}`,
      yard_id: yardId[y.name],
      keeper_id: keepers[y.keeper],
      origin: ORIGINS[i % ORIGINS.length],
      queen_year: YEAR - (i % 4),
      status: y.prefix === 'QM' && i === 6 ? 'dead_out' : 'active',
      started_on: `${YEAR - 1 - (i % 3)}-05-${String(10 + i).padStart(2, '0')}`,
      notes: '',
      ...ts,
    })),
  );
  const colonies = await insert(q, 'colonies', colonyRows);
  const colonyBy = Object.fromEntries(colonies.map((c) => [c.code as string, c]));
  const splits = [
    { parent: 'OT-03', code: 'OT-11', on: `${YEAR}-05-20` },
    { parent: 'LR-02', code: 'LR-11', on: `${YEAR}-05-22` },
    { parent: 'FB-05', code: 'FB-11', on: `${YEAR}-06-04` },
  ];
  for (const s of splits) {
    const parent = colonyBy[s.parent];
    const [child] = await insert(q, 'colonies', [
      {
        code: s.code,
        yard_id: parent.yard_id,
        keeper_id: parent.keeper_id,
        origin: 'split',
        parent_colony_id: parent.id,
        queen_year: YEAR,
        status: 'active',
        started_on: s.on,
        notes: `Split from ${s.parent}.`,
        ...ts,
      },
    ]);
    colonyBy[s.code] = child;
    await insert(q, 'colony_events', [
      {
        colony_id: parent.id,
        kind: 'split',
        occurred_on: s.on,
        details: JSON.stringify({ childCode: s.code }),
        note: `Split into ${s.code}.`,
        recorded_by: parent.keeper_id,
        ...ts,
      },
    ]);
  }
  await insert(q, 'colony_events', [
    {
      colony_id: colonyBy['QM-07'].id,
      kind: 'status',
      occurred_on: `${YEAR}-03-18`,
      details: JSON.stringify({ from: 'active', to: 'dead_out' }),
      note: 'Found dead after the cold snap; no stores left near the cluster.',
      recorded_by: keepers['keeper2@hollowmere.test'],
      ...ts,
    },
    {
      colony_id: colonyBy['OT-01'].id,
      kind: 'note',
      occurred_on: `${YEAR}-04-12`,
      details: '{}',
      note: 'Strong and calm; eight frames of brood.',
      recorded_by: keepers['keeper@hollowmere.test'],
      ...ts,
    },
  ]);

  // Feedings and treatments. Spring ones end before supers go on; two overlap a super and flag it.
  const activeCodes = Object.keys(colonyBy).filter((c) => colonyBy[c].status === 'active');
  const feedings: Row[] = [];
  const treatments: Row[] = [];
  for (const code of activeCodes) {
    const c = colonyBy[code];
    if (rand() < 0.4)
      feedings.push({
        colony_id: c.id,
        kind: 'sugar_syrup',
        amount: '4 L of 1:1 syrup',
        started_on: `${YEAR}-03-20`,
        ended_on: `${YEAR}-04-05`,
        note: '',
        recorded_by: c.keeper_id,
        ...ts,
      });
    const oxalic = kindBy['Oxalic acid, trickled'];
    treatments.push({
      colony_id: c.id,
      treatment_kind_id: oxalic.id,
      product_name: 'Oxalic acid dihydrate solution',
      applied_on: `${YEAR}-01-08`,
      removed_on: `${YEAR}-01-08`,
      supers_allowed: false,
      waiting_days: 0,
      note: 'Broodless winter treatment.',
      recorded_by: c.keeper_id,
      ...ts,
    });
    const thymol = kindBy['Thymol gel'];
    treatments.push({
      colony_id: c.id,
      treatment_kind_id: thymol.id,
      product_name: 'Thymol gel trays',
      applied_on: `${YEAR}-09-25`,
      removed_on: `${YEAR}-10-20`,
      supers_allowed: false,
      waiting_days: 0,
      note: 'After the last supers came off.',
      recorded_by: c.keeper_id,
      ...ts,
    });
  }
  // The two conflicts of the season (flagged supers):
  feedings.push({
    colony_id: colonyBy['LR-04'].id,
    kind: 'sugar_syrup',
    amount: '2 L of 1:1 syrup',
    started_on: `${YEAR}-05-10`,
    ended_on: `${YEAR}-05-17`,
    note: 'Fed during a cold wet spell; super was left on by mistake.',
    recorded_by: colonyBy['LR-04'].keeper_id,
    ...ts,
  });
  const amitraz = kindBy['Amitraz strips'];
  treatments.push({
    colony_id: colonyBy['FB-03'].id,
    treatment_kind_id: amitraz.id,
    product_name: 'Amitraz strips',
    applied_on: `${YEAR}-07-20`,
    removed_on: `${YEAR}-08-10`,
    supers_allowed: false,
    waiting_days: 14,
    note: 'Heavy mite drop; treated early.',
    recorded_by: colonyBy['FB-03'].keeper_id,
    ...ts,
  });
  await insert(q, 'feedings', feedings);
  await insert(q, 'treatments', treatments);

  // Super pulls through the season; lot keys say which lot each pulled super went into.
  const plans: PullPlan[] = [];
  for (const code of activeCodes) {
    const yard = code.slice(0, 2);
    const depth = rand() < 0.15 ? 'deep' : rand() < 0.2 ? 'shallow' : 'medium';
    if (yard === 'OT' || yard === 'LR') {
      plans.push({
        colony: code,
        putOn: `${YEAR}-04-20`,
        pulled: `${YEAR}-05-28`,
        depth,
        weighed: rand() < 0.85,
        lotKey: 'spring',
      });
      plans.push({
        colony: code,
        putOn: `${YEAR}-06-05`,
        pulled: `${YEAR}-07-08`,
        depth: 'medium',
        weighed: rand() < 0.85,
        lotKey: 'linden',
      });
      if (rand() < 0.5)
        plans.push({
          colony: code,
          putOn: `${YEAR}-06-05`,
          pulled: `${YEAR}-07-08`,
          depth: 'medium',
          weighed: true,
          lotKey: 'linden',
        });
    } else {
      plans.push({
        colony: code,
        putOn: `${YEAR}-06-15`,
        pulled: `${YEAR}-08-25`,
        depth,
        weighed: rand() < 0.8,
        lotKey: yard === 'QM' ? 'wildflower' : 'fernbank',
      });
      if (rand() < 0.6)
        plans.push({
          colony: code,
          putOn: `${YEAR}-07-01`,
          pulled: `${YEAR}-08-25`,
          depth: 'medium',
          weighed: true,
          lotKey: yard === 'QM' ? 'wildflower' : 'fernbank',
        });
    }
  }
  // Pulled late in September and waiting in the honey house for the next extraction.
  for (const code of ['OT-02', 'OT-05', 'LR-03', 'LR-07', 'QM-02', 'QM-04'])
    plans.push({
      colony: code,
      putOn: `${YEAR}-08-01`,
      pulled: `${YEAR}-09-20`,
      depth: 'medium',
      weighed: true,
      lotKey: null,
    });
  // Two supers still on hives.
  for (const code of ['FB-08', 'QM-09'])
    plans.push({ colony: code, putOn: `${YEAR}-09-01`, pulled: null, depth: 'medium', weighed: false, lotKey: null });

  const feedingsBy = (id: unknown): FeedingRecord[] =>
    feedings
      .filter((f) => f.colony_id === id)
      .map((f) => ({
        kind: f.kind as FeedingRecord['kind'],
        startedOn: f.started_on as string,
        endedOn: (f.ended_on as string) ?? null,
      }));
  const treatmentsBy = (id: unknown): TreatmentRecord[] =>
    treatments
      .filter((t) => t.colony_id === id)
      .map((t) => ({
        kindName: TREATMENT_KINDS.find((k) => kindBy[k.name].id === t.treatment_kind_id)!.name,
        productName: t.product_name as string,
        supersAllowed: t.supers_allowed as boolean,
        waitingDays: t.waiting_days as number,
        appliedOn: t.applied_on as string,
        removedOn: (t.removed_on as string) ?? null,
      }));

  const FRAMES = { deep: 10, medium: 10, shallow: 10 } as const;
  const FULL_RANGE = { deep: [38_000, 46_000], medium: [22_000, 28_500], shallow: [15_500, 19_000] } as const;
  const EMPTY_RANGE = { deep: [8_500, 9_500], medium: [6_200, 7_000], shallow: [4_600, 5_200] } as const;
  const tagCodes: Row[] = [];
  const pullRows: Row[] = plans.map((p, i) => {
    const colony = colonyBy[p.colony];
    const tag = `S-${String(i + 1).padStart(4, '0')}`;
    tagCodes.push({ code: tag, depth: p.depth, frame_count: FRAMES[p.depth], ...ts });
    const conflict = p.pulled
      ? superConflicts(
          { putOn: p.putOn, pulled: p.pulled },
          { feedings: feedingsBy(colony.id), treatments: treatmentsBy(colony.id) },
        )
      : { flagged: false, reasons: [] };
    const range = FULL_RANGE[p.depth];
    const full = p.pulled && p.weighed ? between(range[0], range[1]) : null;
    return {
      colony_id: colony.id,
      tag_code: tag,
      depth: p.depth,
      frame_count: FRAMES[p.depth],
      put_on_on: p.putOn,
      pulled_on: p.pulled,
      full_grams: full,
      capped_frames: p.pulled && !p.weighed ? between(6, 10) : null,
      empty_grams: null,
      flagged: conflict.flagged,
      flag_reasons: JSON.stringify(conflict.reasons),
      put_on_by: colony.keeper_id,
      pulled_by: p.pulled ? colony.keeper_id : null,
      note: '',
      ...ts,
    };
  });
  await insert(q, 'super_tags', tagCodes);
  const pulls = await insert(q, 'super_pulls', pullRows);

  // One pull entered twice by mistake (once with its tag, once without) and voided by its keeper the
  // same evening: it stays on record with who, when and why, and counts for nothing. Fixed values, no
  // draw from the PRNG, so every other demo figure stays the same.
  const twice = pulls[plans.findIndex((p) => p.colony === 'LR-03' && p.pulled === `${YEAR}-09-20`)];
  const lr03 = colonyBy['LR-03'];
  const voidedAt = new Date(`${YEAR}-09-20T18:10:00Z`);
  const voidReason = `Entered twice: the same box was already recorded with its tag ${twice.tag_code}.`;
  const [voidedPull] = await insert(q, 'super_pulls', [
    {
      colony_id: lr03.id,
      tag_code: null,
      depth: 'medium',
      frame_count: 10,
      put_on_on: null,
      pulled_on: `${YEAR}-09-20`,
      full_grams: twice.full_grams,
      capped_frames: null,
      empty_grams: null,
      flagged: false,
      flag_reasons: JSON.stringify([]),
      put_on_by: null,
      pulled_by: lr03.keeper_id,
      note: '',
      voided_at: voidedAt,
      voided_by_user_id: lr03.keeper_id,
      void_reason: voidReason,
      created_at: new Date(`${YEAR}-09-20T16:45:00Z`),
      updated_at: voidedAt,
    },
  ]);
  await insert(q, 'audit_entries', [
    {
      actor_user_id: lr03.keeper_id,
      action: 'super.void',
      entity_type: 'super_pull',
      entity_id: String(voidedPull.id),
      before: JSON.stringify({ voidedAt: null }),
      after: JSON.stringify({
        colonyId: lr03.id,
        colonyCode: 'LR-03',
        tagCode: null,
        pulledOn: `${YEAR}-09-20`,
        voidedAt: voidedAt.toISOString(),
        reflaggedNeighbours: 0,
      }),
      reason: voidReason,
      created_at: voidedAt,
    },
  ]);

  // Container types (owner-editable; usual tare).
  const ctypes = await insert(q, 'container_types', [
    { name: 'Bucket 15 kg', usual_tare_grams: 700, active: true, ...ts },
    { name: 'Pail 30 kg', usual_tare_grams: 1_100, active: true, ...ts },
    { name: 'Drum 300 kg', usual_tare_grams: 17_000, active: true, ...ts },
  ]);
  const pail = ctypes[1];

  // Lots. Flagged supers stay out of food lots (no override was given).
  const lotSpecs = [
    { key: 'spring', floral: 'Spring blossom', extracted: `${YEAR}-06-02`, water: 17.6, stage: 'released' },
    { key: 'linden', floral: 'Linden', extracted: `${YEAR}-07-12`, water: 17.2, stage: 'released' },
    { key: 'wildflower', floral: 'Late-summer wildflower', extracted: `${YEAR}-08-29`, water: 18.1, stage: 'released' },
    { key: 'fernbank', floral: 'Woodland bramble', extracted: `${YEAR}-09-14`, water: 20.6, stage: 'held' },
  ];
  const lotByKey: Record<string, Row> = {};
  let seq = 0;
  for (const spec of lotSpecs) {
    seq += 1;
    const members = pulls.filter((p, i) => plans[i].lotKey === spec.key && !p.flagged);
    let honey = 0;
    for (const m of members) {
      if (m.full_grams) {
        const depth = m.depth as keyof typeof EMPTY_RANGE;
        m.empty_grams = between(EMPTY_RANGE[depth][0], EMPTY_RANGE[depth][1]);
        honey += (m.full_grams as number) - (m.empty_grams as number);
      } else {
        const est = DEFAULT_SUPER_ESTIMATES[m.depth as keyof typeof DEFAULT_SUPER_ESTIMATES];
        honey += Math.round((est.gramsPerBox / est.framesPerBox) * Number(m.capped_frames));
      }
    }
    // Containers hold about 94 % of the supers' honey (the rest stays on combs and in cappings).
    const net = Math.round(honey * 0.94);
    const containers: Row[] = [];
    let left = net;
    let n = 0;
    while (left > 0) {
      const fill = Math.min(left, 29_000);
      const tare = 1_100 + between(-30, 30);
      containers.push({
        container_type_id: pail.id,
        label: `P${++n}`,
        gross_grams: fill + tare,
        tare_grams: tare,
        recorded_by: crew,
        ...ts,
      });
      left -= fill;
    }
    const holdReasons = spec.stage === 'held' ? [`Moisture ${spec.water.toFixed(1)} % is over the 20.0 % limit.`] : [];
    const [lot] = await insert(q, 'lots', [
      {
        code: lotCode('HH', YEAR, seq),
        floral_source: spec.floral,
        heather: false,
        extracted_on: spec.extracted,
        stage: spec.stage,
        hold_reasons: JSON.stringify(holdReasons),
        is_blend: false,
        net_grams: net,
        used_grams: 0,
        cappings_wax_grams: Math.round(net * 0.015),
        best_before_on: bestBeforeDate(spec.extracted, 24),
        notes: '',
        created_by: crew,
        ...ts,
      },
    ]);
    lotByKey[spec.key] = lot;
    await insert(
      q,
      'lot_containers',
      containers.map((c) => ({ ...c, lot_id: lot.id })),
    );
    for (const m of members) {
      await q.sequelize.query(`UPDATE super_pulls SET lot_id = :lot, empty_grams = :empty WHERE id = :id`, {
        replacements: { lot: lot.id, empty: m.empty_grams ?? null, id: m.id },
      });
    }
    // Two readings per lot: refractive index at the bench temperature, and a honey-refractometer scale reading.
    const ri = refractiveIndexFromWater(spec.water) - 0.00023 * 2; // read at 22 °C
    await insert(q, 'moisture_readings', [
      {
        lot_id: lot.id,
        method: 'ri',
        refractive_index: ri.toFixed(4),
        temperature_c: 22,
        water_pct: waterFromRefractiveIndex(Number(ri.toFixed(4)), 22).toFixed(2),
        taken_on: spec.extracted,
        recorded_by: crew,
        ...ts,
      },
      {
        lot_id: lot.id,
        method: 'scale',
        scale_water_pct: (spec.water + 0.2).toFixed(1),
        water_pct: (spec.water + 0.2).toFixed(2),
        taken_on: spec.extracted,
        recorded_by: crew,
        ...ts,
      },
    ]);
    await insert(q, 'audit_entries', [
      {
        actor_user_id: crew,
        action: 'lot.create',
        entity_type: 'lot',
        entity_id: String(lot.id),
        after: JSON.stringify({ code: lot.code }),
        created_at: now,
      },
    ]);
    if (spec.stage === 'held') {
      await insert(q, 'audit_entries', [
        {
          actor_user_id: crew,
          action: 'lot.stage',
          entity_type: 'lot',
          entity_id: String(lot.id),
          before: JSON.stringify({ stage: 'extracted' }),
          after: JSON.stringify({ stage: 'held', holdReasons }),
          created_at: now,
        },
      ]);
    }
  }
  await q.sequelize.query(`INSERT INTO lot_sequences (prefix, year, last_value) VALUES ('HH', ${YEAR}, ${seq + 1})`);

  // A blend of spring blossom and wildflower.
  const blendParts = [
    { lot: lotByKey.spring, grams: 40_000 },
    { lot: lotByKey.wildflower, grams: 60_000 },
  ];
  const [blend] = await insert(q, 'lots', [
    {
      code: lotCode('HH', YEAR, seq + 1),
      floral_source: 'Marrow Valley blend',
      heather: false,
      extracted_on: `${YEAR}-09-02`,
      stage: 'released',
      hold_reasons: '[]',
      is_blend: true,
      net_grams: 100_000,
      used_grams: 0,
      cappings_wax_grams: null,
      best_before_on: bestBeforeDate(`${YEAR}-09-02`, 24),
      notes: 'Blended 40 kg spring blossom with 60 kg late-summer wildflower.',
      created_by: crew,
      ...ts,
    },
  ]);
  await insert(
    q,
    'lot_parents',
    blendParts.map((p) => ({ child_lot_id: blend.id, parent_lot_id: p.lot.id, grams: p.grams, ...ts })),
  );
  for (const p of blendParts)
    await q.sequelize.query(`UPDATE lots SET used_grams = used_grams + ${p.grams} WHERE id = ${p.lot.id}`);
  lotByKey.blend = blend;

  // Products: three jar sizes and a comb-honey box. GTINs from the GS1 example company prefix 0614141.
  const products = await insert(q, 'products', [
    {
      slug: 'honey-227g',
      name: 'Raw honey, small jar',
      description: 'A small glass jar: right for a picnic basket or a gift.',
      net_grams: 227,
      declared_unit: 'oz',
      declared_amount: 8,
      container_kind: 'Glass jar 8 oz',
      container_grams: 150,
      price_cents: 750,
      gtin: makeGtin('0614141', '10227'),
      active: true,
      sort_order: 1,
      ...ts,
    },
    {
      slug: 'honey-340g',
      name: 'Raw honey, jar',
      description: 'Our everyday jar, strained once and never heated.',
      net_grams: 340,
      declared_unit: 'oz',
      declared_amount: 12,
      container_kind: 'Glass jar 12 oz',
      container_grams: 190,
      price_cents: 1050,
      gtin: makeGtin('0614141', '10340'),
      active: true,
      sort_order: 2,
      ...ts,
    },
    {
      slug: 'honey-454g',
      name: 'Raw honey, large jar',
      description: 'A pound of honey for the kitchen shelf.',
      net_grams: 454,
      declared_unit: 'oz',
      declared_amount: 16,
      container_kind: 'Glass jar 16 oz',
      container_grams: 240,
      price_cents: 1350,
      gtin: makeGtin('0614141', '10454'),
      active: true,
      sort_order: 3,
      ...ts,
    },
    {
      slug: 'comb-honey-box',
      name: 'Comb honey box',
      description: 'A square of capped comb, cut from a shallow frame.',
      net_grams: 340,
      declared_unit: 'g',
      declared_amount: 340,
      container_kind: 'Clear comb box',
      container_grams: 30,
      price_cents: 1600,
      gtin: makeGtin('0614141', '10999'),
      active: true,
      sort_order: 4,
      ...ts,
    },
  ]);
  const product = Object.fromEntries(products.map((p) => [p.slug as string, p]));

  // Jarring runs. One under-filled run failed its fill check and never became stock.
  const runs = [
    {
      lot: lotByKey.spring,
      product: product['honey-340g'],
      jars: 120,
      on: `${YEAR}-06-10`,
      samples: [342, 344, 341, 345, 343],
    },
    {
      lot: lotByKey.spring,
      product: product['honey-454g'],
      jars: 40,
      on: `${YEAR}-06-10`,
      samples: [456, 458, 455, 457, 459],
    },
    {
      lot: lotByKey.linden,
      product: product['honey-227g'],
      jars: 150,
      on: `${YEAR}-07-18`,
      samples: [229, 230, 228, 231, 229],
    },
    {
      lot: lotByKey.linden,
      product: product['honey-454g'],
      jars: 60,
      on: `${YEAR}-07-18`,
      samples: [456, 455, 457, 458, 456],
    },
    {
      lot: lotByKey.wildflower,
      product: product['honey-340g'],
      jars: 90,
      on: `${YEAR}-09-05`,
      samples: [343, 342, 344, 341, 342],
    },
    {
      lot: lotByKey.wildflower,
      product: product['honey-227g'],
      jars: 30,
      on: `${YEAR}-09-05`,
      samples: [219, 216, 226, 224, 218],
    },
    {
      lot: lotByKey.blend,
      product: product['honey-340g'],
      jars: 80,
      on: `${YEAR}-09-08`,
      samples: [342, 343, 341, 344, 342],
    },
    {
      lot: lotByKey.spring,
      product: product['comb-honey-box'],
      jars: 12,
      on: `${YEAR}-06-03`,
      samples: [348, 352, 345, 350, 349],
    },
  ];
  const stock = new Map<string, { productId: number; lotId: number; onHand: number; bestBefore: string }>();
  for (const r of runs) {
    const fill = assessFill(Number(r.product.net_grams), r.samples);
    const used = honeyUsedByRun(r.jars, Number(r.product.net_grams), r.samples);
    const [run] = await insert(q, 'jarring_runs', [
      {
        lot_id: r.lot.id,
        product_id: r.product.id,
        jar_count: r.jars,
        run_on: r.on,
        sample_grams: JSON.stringify(r.samples),
        rule_set: 'oiml',
        fill_pass: fill.pass,
        fill_report: JSON.stringify(fill),
        honey_used_grams: used,
        created_by: crew,
        ...ts,
      },
    ]);
    await q.sequelize.query(`UPDATE lots SET used_grams = used_grams + ${used} WHERE id = ${r.lot.id}`);
    if (!fill.pass) continue;
    await insert(q, 'stock_entries', [
      {
        product_id: r.product.id,
        lot_id: r.lot.id,
        delta: r.jars,
        kind: 'jarring',
        reason: '',
        jarring_run_id: run.id,
        created_by: crew,
        created_at: now,
      },
    ]);
    const key = `${r.product.id}:${r.lot.id}`;
    const s = stock.get(key) ?? {
      productId: r.product.id as number,
      lotId: r.lot.id as number,
      onHand: 0,
      bestBefore: r.lot.best_before_on as string,
    };
    s.onHand += r.jars;
    stock.set(key, s);
  }

  // Paid orders, allocated oldest best-before first, as the shop does.
  const customers = {
    pella: { id: await userId(q, 'customer@hollowmere.test'), email: 'customer@hollowmere.test', name: 'Pella Quist' },
    corin: { id: await userId(q, 'corin@hollowmere.test'), email: 'corin@hollowmere.test', name: 'Corin Bask' },
    lio: { id: await userId(q, 'lio@hollowmere.test'), email: 'lio@hollowmere.test', name: 'Lio Fenwick' },
  };
  const orders = [
    {
      who: customers.pella,
      status: 'picked_up',
      fulfilment: 'pickup',
      on: `${YEAR}-07-02`,
      lines: [
        ['honey-340g', 2],
        ['comb-honey-box', 1],
      ],
    },
    { who: customers.corin, status: 'shipped', fulfilment: 'ship', on: `${YEAR}-08-14`, lines: [['honey-454g', 3]] },
    {
      who: customers.lio,
      status: 'picked_up',
      fulfilment: 'pickup',
      on: `${YEAR}-09-12`,
      lines: [
        ['honey-227g', 4],
        ['honey-340g', 1],
      ],
    },
    { who: customers.pella, status: 'paid', fulfilment: 'pickup', on: `${YEAR}-11-20`, lines: [['honey-340g', 3]] },
    {
      who: { id: null, email: 'rue.hadley@example.test', name: 'Rue Hadley' },
      status: 'packed',
      fulfilment: 'ship',
      on: `${YEAR}-11-25`,
      lines: [
        ['honey-454g', 1],
        ['honey-227g', 2],
      ],
    },
    { who: customers.corin, status: 'paid', fulfilment: 'pickup', on: `${YEAR}-11-28`, lines: [['comb-honey-box', 2]] },
  ] as const;
  for (const o of orders) {
    const paidAt = new Date(`${o.on}T10:00:00Z`);
    const lineRows = o.lines.map(([slug, qty]) => ({ product: product[slug], qty }));
    const subtotal = lineRows.reduce((sum, l) => sum + Number(l.product.price_cents) * l.qty, 0);
    const shipping = o.fulfilment === 'ship' ? 895 : 0;
    const [{ nextval }] = (await q.sequelize.query(`SELECT nextval('order_number_seq')::int AS nextval`))[0] as {
      nextval: number;
    }[];
    const [order] = await insert(q, 'orders', [
      {
        number: `C-${nextval}`,
        customer_id: o.who.id,
        email: o.who.email,
        name: o.who.name,
        phone: '',
        status: o.status,
        fulfilment: o.fulfilment,
        shipping_address:
          o.fulfilment === 'ship'
            ? JSON.stringify({
                name: o.who.name,
                line1: '12 Weir Cottages',
                line2: '',
                city: 'Marrow Valley',
                region: '',
                postalCode: 'MV2 4QT',
                country: 'GB',
              })
            : null,
        subtotal_cents: subtotal,
        shipping_cents: shipping,
        total_cents: subtotal + shipping,
        refunded_cents: 0,
        currency: 'usd',
        stripe_session_id: `cs_test_demo_${nextval}`,
        payment_intent_id: `pi_demo_${nextval}`,
        paid_at: paidAt,
        picked_up_at: o.status === 'picked_up' ? paidAt : null,
        shipped_at: o.status === 'shipped' ? paidAt : null,
        packed_at: o.status === 'packed' || o.status === 'shipped' ? paidAt : null,
        tracking: o.status === 'shipped' ? 'Valley Post MV-204-118' : null,
        created_at: paidAt,
        updated_at: paidAt,
      },
    ]);
    for (const l of lineRows) {
      const [line] = await insert(q, 'order_lines', [
        {
          order_id: order.id,
          product_id: l.product.id,
          product_name: l.product.name,
          quantity: l.qty,
          unit_price_cents: l.product.price_cents,
          created_at: paidAt,
          updated_at: paidAt,
        },
      ]);
      let need: number = l.qty;
      const candidates = [...stock.values()]
        .filter((s) => s.productId === l.product.id && s.onHand > 0)
        .sort((a, b) => a.bestBefore.localeCompare(b.bestBefore) || a.lotId - b.lotId);
      for (const s of candidates) {
        if (need === 0) break;
        const take = Math.min(need, s.onHand);
        s.onHand -= take;
        need -= take;
        await insert(q, 'order_allocations', [
          {
            order_line_id: line.id,
            lot_id: s.lotId,
            quantity: take,
            state: 'sold',
            created_at: paidAt,
            updated_at: paidAt,
          },
        ]);
        await insert(q, 'stock_entries', [
          {
            product_id: s.productId,
            lot_id: s.lotId,
            delta: -take,
            kind: 'order',
            reason: '',
            order_id: order.id,
            created_at: paidAt,
          },
        ]);
      }
      if (need > 0) throw new Error(`Demo stock too small for ${l.product.slug}`);
    }
  }
  await insert(
    q,
    'stock_levels',
    [...stock.values()].map((s) => ({
      product_id: s.productId,
      lot_id: s.lotId,
      on_hand: s.onHand,
      reserved: 0,
      best_before_on: s.bestBefore,
      ...ts,
    })),
  );
  await insert(q, 'label_layouts', [
    {
      name: 'A4, 3 × 7 (63.5 × 38.1 mm)',
      layout: JSON.stringify({
        name: 'A4, 3 × 7 (63.5 × 38.1 mm)',
        paper: 'a4',
        labelWidthMm: 63.5,
        labelHeightMm: 38.1,
        columns: 3,
        rows: 7,
        marginTopMm: 15.15,
        marginLeftMm: 7.25,
        gapXMm: 2.5,
        gapYMm: 0,
        offsetXMm: 0,
        offsetYMm: 0,
      }),
      ...ts,
    },
  ]);
  void owner;
}

export async function down({ context: q }: { context: QueryInterface }) {
  // Removing demo data is the one time records are deleted: skip the append-only triggers (superuser only).
  await q.sequelize.query(`SET session_replication_role = replica`);
  for (const t of [
    'order_allocations',
    'order_lines',
    'refunds',
    'orders',
    'stock_entries',
    'stock_levels',
    'jarring_runs',
    'label_layouts',
    'products',
    'lot_parents',
    'moisture_readings',
    'lab_files',
    'lot_containers',
  ])
    await q.sequelize.query(`DELETE FROM ${t}`);
  await q.sequelize.query(`UPDATE super_pulls SET lot_id = NULL`);
  for (const t of [
    'lots',
    'lot_sequences',
    'container_types',
    'super_pulls',
    'super_tags',
    'treatments',
    'feedings',
    'colony_events',
    'colonies',
    'treatment_kinds',
    'yard_keepers',
    'yards',
  ]) {
    await q.sequelize.query(`DELETE FROM ${t}`);
  }
  await q.sequelize.query(`DELETE FROM audit_entries WHERE entity_type IN ('lot', 'super_pull')`);
  await q.sequelize.query(`SET session_replication_role = DEFAULT`);
}
