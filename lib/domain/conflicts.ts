/**
 * Super conflicts: a honey super that was on a colony while sugar was fed, or while
 * a treatment whose product label does not allow honey supers was on (its window
 * runs from application to removal plus the label's waiting period). The label
 * governs (US EPA advisory under FIFRA: use a registered product only as its label directs).
 * Dates are 'YYYY-MM-DD' calendar days compared as UTC day numbers; all ranges
 * include both ends. An open end (null) means still ongoing: it runs through the
 * super's pull date.
 */

export type FeedingKind = 'sugar_syrup' | 'fondant' | 'pollen_substitute' | 'other';
export type FeedingRecord = { kind: FeedingKind; startedOn: string; endedOn: string | null };
export type TreatmentRecord = {
  kindName: string;
  productName?: string | null;
  supersAllowed: boolean;
  waitingDays: number;
  appliedOn: string;
  removedOn: string | null;
};
export type SuperConflicts = { flagged: boolean; reasons: string[] };

const DAY_MS = 86_400_000;
const SUGAR_NAMES: Partial<Record<FeedingKind, string>> = { sugar_syrup: 'Sugar syrup', fondant: 'Fondant' };

/** UTC day number of a calendar date; throws on anything but a real YYYY-MM-DD. */
function dayNumber(date: string): number {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  if (!match) throw new RangeError(`Not a YYYY-MM-DD date: ${date}`);
  const [y, m, d] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const ms = Date.UTC(y, m - 1, d);
  const back = new Date(ms);
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== m - 1 || back.getUTCDate() !== d) {
    throw new RangeError(`Not a calendar date: ${date}`);
  }
  return ms / DAY_MS;
}

function isoDate(day: number): string {
  return new Date(day * DAY_MS).toISOString().slice(0, 10);
}

function overlaps(aStart: number, aEnd: number, bStart: number, bEnd: number): boolean {
  return aStart <= bEnd && bStart <= aEnd;
}

function treatmentName(t: TreatmentRecord): string {
  const product = t.productName?.trim();
  return product ? `${t.kindName} (${product})` : t.kindName;
}

/** Whether a super's days on the colony clash with its colony's feedings or treatments. */
export function superConflicts(
  superOnColony: { putOn: string; pulled: string },
  records: { feedings: FeedingRecord[]; treatments: TreatmentRecord[] },
): SuperConflicts {
  const on = dayNumber(superOnColony.putOn);
  const off = dayNumber(superOnColony.pulled);
  if (off < on)
    throw new RangeError(`Super pulled (${superOnColony.pulled}) before it was put on (${superOnColony.putOn})`);
  const reasons: string[] = [];

  for (const f of records.feedings) {
    const name = SUGAR_NAMES[f.kind];
    if (!name) continue;
    const start = dayNumber(f.startedOn);
    const end = f.endedOn === null ? off : dayNumber(f.endedOn);
    if (!overlaps(on, off, start, end)) continue;
    const span = f.endedOn === null ? `from ${f.startedOn} (still ongoing)` : `${f.startedOn} to ${f.endedOn}`;
    reasons.push(`${name} fed ${span} while this super was on`);
  }

  for (const t of records.treatments) {
    if (t.supersAllowed) continue;
    if (!Number.isInteger(t.waitingDays) || t.waitingDays < 0) {
      throw new RangeError(`Waiting days must be a whole number ≥ 0 (${treatmentName(t)})`);
    }
    const start = dayNumber(t.appliedOn);
    const end = t.removedOn === null ? off : dayNumber(t.removedOn) + t.waitingDays;
    if (!overlaps(on, off, start, end)) continue;
    const span =
      t.removedOn === null
        ? `applied ${t.appliedOn} (still on)`
        : `applied ${t.appliedOn}, removed ${t.removedOn}` +
          (t.waitingDays > 0 ? `, waiting period to ${isoDate(end)}` : '');
    reasons.push(`${treatmentName(t)} ${span} while this super was on; its label does not allow honey supers`);
  }

  return { flagged: reasons.length > 0, reasons };
}

/** A super still on the hive (not pulled, not voided). */
export type SuperOnHive = { id: number; tagCode: string | null; depth: string; putOnOn: string | null };
export type SupersAtRisk = { supers: (SuperOnHive & { label: string })[]; reason: string } | null;

/** How a keeper recognises a super on the hive: its tag, or its depth and put-on day. */
export function superLabel(s: Pick<SuperOnHive, 'tagCode' | 'depth' | 'putOnOn'>): string {
  if (s.tagCode) return `super ${s.tagCode}`;
  return `untagged ${s.depth} super put on ${s.putOnOn ?? '(day not recorded)'}`;
}

/**
 * The supers on the hive now that a feeding or treatment being recorded would touch, by the same
 * rule as `superConflicts` (sugar syrup or fondant; a treatment whose label does not allow supers,
 * through its waiting period). A super still on has no pull date yet: it counts when it went on
 * on or before the record's last day (any day, for a record still going on). Null when none.
 */
export function supersAtRisk(
  record: { feeding: FeedingRecord } | { treatment: TreatmentRecord },
  onHive: SuperOnHive[],
): SupersAtRisk {
  let lastDay: number | null;
  let reason: string;
  if ('feeding' in record) {
    const f = record.feeding;
    const name = SUGAR_NAMES[f.kind];
    if (!name) return null;
    dayNumber(f.startedOn);
    lastDay = f.endedOn === null ? null : dayNumber(f.endedOn);
    reason = `${name} fed ${f.endedOn === null ? `from ${f.startedOn} (still ongoing)` : `${f.startedOn} to ${f.endedOn}`} while this super was on`;
  } else {
    const t = record.treatment;
    if (t.supersAllowed) return null;
    if (!Number.isInteger(t.waitingDays) || t.waitingDays < 0)
      throw new RangeError(`Waiting days must be a whole number ≥ 0 (${treatmentName(t)})`);
    dayNumber(t.appliedOn);
    lastDay = t.removedOn === null ? null : dayNumber(t.removedOn) + t.waitingDays;
    reason = `${treatmentName(t)} applied ${t.appliedOn}${t.removedOn === null ? ' (still on)' : `, removed ${t.removedOn}`} while this super was on; its label does not allow honey supers`;
  }
  const hit = onHive.filter((s) => lastDay === null || s.putOnOn === null || dayNumber(s.putOnOn) <= lastDay);
  return hit.length === 0 ? null : { supers: hit.map((s) => ({ ...s, label: superLabel(s) })), reason };
}
