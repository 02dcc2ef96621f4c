import 'server-only';
import { getDb } from '@/lib/db/index';
import type { PullVoid } from '@/lib/data/supers/pulls';

export type TimelineEntry = {
  key: string;
  on: string;
  kind: 'super_on' | 'super_pulled' | 'feeding' | 'treatment' | 'split' | 'note' | 'move' | 'status';
  title: string;
  detail: string;
  by: string | null;
  flagged?: boolean;
  flagReasons?: string[];
  /** A super pull (and its put-on) voided as a mistake: shown struck through, with who, when and why. */
  voided?: PullVoid;
  /** A standing pull that may still be voided (not in a lot): its id. */
  voidablePullId?: number;
  /** A super still on the hive (put on, not pulled, not voided) that may be voided as entered by mistake: its id. */
  voidableOnId?: number;
  /** For open feedings/treatments: the id to end them with. */
  openFeedingId?: number;
  openTreatmentId?: number;
  linkColonyId?: number;
};

const FEEDING_NAMES = {
  sugar_syrup: 'Sugar syrup',
  fondant: 'Fondant / candy',
  pollen_substitute: 'Pollen substitute',
  other: 'Other feed',
} as const;
const STATUS_NAMES: Record<string, string> = {
  active: 'active',
  dead_out: 'dead-out',
  combined: 'combined',
  sold: 'sold',
};

/** Every dated record of a colony, newest first, with who recorded it. The caller has checked scope. */
export async function colonyTimeline(colonyId: number, formatGrams: (g: number) => string): Promise<TimelineEntry[]> {
  const { models } = getDb();
  const [pulls, feedings, treatments, events] = await Promise.all([
    models.SuperPull.findAll({ where: { colonyId } }),
    models.Feeding.findAll({ where: { colonyId } }),
    models.Treatment.findAll({ where: { colonyId }, include: [{ association: 'kind', attributes: ['name'] }] }),
    models.ColonyEvent.findAll({ where: { colonyId } }),
  ]);
  const userIds = new Set<number>();
  for (const p of pulls) {
    if (p.putOnBy) userIds.add(p.putOnBy);
    if (p.pulledBy) userIds.add(p.pulledBy);
    if (p.voidedByUserId) userIds.add(p.voidedByUserId);
  }
  for (const r of [...feedings, ...treatments, ...events]) if (r.recordedBy) userIds.add(r.recordedBy);
  const users = await models.User.findAll({ where: { id: [...userIds] }, attributes: ['id', 'name'] });
  const name = (id: number | null | undefined) => (id ? (users.find((u) => u.id === id)?.name ?? null) : null);

  const out: TimelineEntry[] = [];
  for (const p of pulls) {
    const box = `${p.depth}, ${p.frameCount} frames${p.tagCode ? `, tag ${p.tagCode}` : ''}`;
    const voided = p.voidedAt
      ? { at: new Date(p.voidedAt).toISOString(), byName: name(p.voidedByUserId), reason: p.voidReason ?? '' }
      : undefined;
    if (p.putOnOn) {
      out.push({
        key: `on-${p.id}`,
        on: p.putOnOn,
        kind: 'super_on',
        title: 'Super on',
        detail: box,
        by: name(p.putOnBy),
        voided,
        voidableOnId: !voided && !p.pulledOn && p.lotId === null ? p.id : undefined,
      });
    }
    if (p.pulledOn) {
      const weight = p.fullGrams
        ? `full ${formatGrams(p.fullGrams)}`
        : p.cappedFrames != null
          ? `about ${p.cappedFrames} capped frames`
          : 'not weighed';
      out.push({
        key: `pull-${p.id}`,
        on: p.pulledOn,
        kind: 'super_pulled',
        title: 'Super pulled',
        detail: `${box}; ${weight}`,
        by: name(p.pulledBy),
        flagged: p.flagged,
        flagReasons: p.flagReasons,
        voided,
        voidablePullId: !voided && p.lotId === null ? p.id : undefined,
      });
    }
  }
  for (const f of feedings) {
    const span = f.endedOn ? `${f.startedOn} to ${f.endedOn}` : `from ${f.startedOn}, still feeding`;
    out.push({
      key: `feed-${f.id}`,
      on: f.startedOn,
      kind: 'feeding',
      title: `Feeding: ${FEEDING_NAMES[f.kind]}`,
      detail: [f.amount, span, f.note].filter(Boolean).join(' · '),
      by: name(f.recordedBy),
      openFeedingId: f.endedOn ? undefined : f.id,
    });
  }
  for (const x of treatments) {
    const span = x.removedOn ? `on ${x.appliedOn}, off ${x.removedOn}` : `on ${x.appliedOn}, still on`;
    const rule = x.supersAllowed
      ? 'label record: supers allowed'
      : `label record: no honey supers${x.waitingDays ? `, wait ${x.waitingDays} days after removal` : ''}`;
    out.push({
      key: `treat-${x.id}`,
      on: x.appliedOn,
      kind: 'treatment',
      title: `Treatment: ${x.kind?.name ?? ''}${x.productName ? ` (${x.productName})` : ''}`,
      detail: [span, rule, x.note].filter(Boolean).join(' · '),
      by: name(x.recordedBy),
      openTreatmentId: x.removedOn ? undefined : x.id,
    });
  }
  for (const e of events) {
    const d = e.details as Record<string, string | number | undefined>;
    const base = { key: `ev-${e.id}`, on: e.occurredOn, kind: e.kind, by: name(e.recordedBy) } as const;
    if (e.kind === 'split')
      out.push({
        ...base,
        title: 'Split',
        detail: [`new colony ${d.childCode}`, e.note].filter(Boolean).join(' · '),
        linkColonyId: d.childId ? Number(d.childId) : undefined,
      });
    else if (e.kind === 'move')
      out.push({
        ...base,
        title: 'Moved',
        detail: [`from ${d.fromYard} to ${d.toYard}`, e.note].filter(Boolean).join(' · '),
      });
    else if (e.kind === 'status')
      out.push({
        ...base,
        title: `Status: ${STATUS_NAMES[String(d.to)] ?? d.to}`,
        detail: [d.combinedInto ? `combined into ${d.combinedInto}` : '', e.note].filter(Boolean).join(' · '),
      });
    else out.push({ ...base, title: 'Note', detail: e.note });
  }
  return out.sort((a, b) => (a.on === b.on ? b.key.localeCompare(a.key) : b.on.localeCompare(a.on)));
}
