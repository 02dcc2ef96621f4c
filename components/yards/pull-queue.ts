import type { PullEntry } from '@/lib/schemas/supers';

/**
 * The pull pass's waiting entries: every tap the server has not yet answered is kept in this
 * browser (localStorage), one list per signed-in user, until the server saves it or refuses it.
 * Each entry keeps its idempotency key, so sending it again never records a second super.
 * Pure list helpers plus a thin storage wrapper; no React.
 */
/** A pull entry as the pass makes it: colony, date and key always set. */
export type StoredEntry = PullEntry & { colonyId: number; pulledOn: string; idempotencyKey: string };
export type WaitingPull = {
  entry: StoredEntry;
  colonyCode: string;
  yardName: string;
  savedAt: string;
  /** The server's refusal; a refused entry is never sent again and stays until the keeper dismisses it. */
  refused?: string;
};

type Store = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

/** Different people on one phone never see or send each other's entries. */
export const waitingKey = (userId: number | string) => `combtrace.pull.waiting.v1.${userId}`;

const isKey = (v: unknown): v is string => typeof v === 'string' && v.length >= 8 && v.length <= 80;
function isWaiting(v: unknown): v is WaitingPull {
  if (!v || typeof v !== 'object') return false;
  const w = v as Record<string, unknown>;
  const e = w.entry as Record<string, unknown> | null | undefined;
  return (
    !!e &&
    typeof e === 'object' &&
    isKey(e.idempotencyKey) &&
    Number.isInteger(e.colonyId) &&
    (e.colonyId as number) > 0 &&
    typeof e.pulledOn === 'string' &&
    typeof w.colonyCode === 'string' &&
    typeof w.yardName === 'string' &&
    typeof w.savedAt === 'string' &&
    (w.refused === undefined || typeof w.refused === 'string')
  );
}

/** The stored list; anything unreadable (old format, hand edits) is skipped rather than breaking the pass. */
export function parseWaiting(raw: string | null): WaitingPull[] {
  if (!raw) return [];
  let data: unknown;
  try {
    data = JSON.parse(raw);
  } catch {
    return [];
  }
  if (!Array.isArray(data)) return [];
  const seen = new Set<string>();
  return data
    .filter(isWaiting)
    .filter((w) => (seen.has(w.entry.idempotencyKey) ? false : (seen.add(w.entry.idempotencyKey), true)));
}

/** Adds an entry, or replaces the one with the same key (a key is one super, never two). */
export function withWaiting(list: WaitingPull[], item: WaitingPull): WaitingPull[] {
  const i = list.findIndex((w) => w.entry.idempotencyKey === item.entry.idempotencyKey);
  return i === -1 ? [...list, item] : list.map((w, j) => (j === i ? item : w));
}

export function withoutWaiting(list: WaitingPull[], keys: Iterable<string>): WaitingPull[] {
  const drop = new Set(keys);
  return list.filter((w) => !drop.has(w.entry.idempotencyKey));
}

export function markRefused(list: WaitingPull[], key: string, message: string): WaitingPull[] {
  return list.map((w) => (w.entry.idempotencyKey === key ? { ...w, refused: message } : w));
}

/** Entries still to send: not refused, not already on their way. */
export function toSend(list: WaitingPull[], inFlight: ReadonlySet<string> = new Set()): WaitingPull[] {
  return list.filter((w) => w.refused === undefined && !inFlight.has(w.entry.idempotencyKey));
}

/** Stored entries the page does not show yet (restored on load, or added by another tab), oldest first. */
export function notShown(list: WaitingPull[], shownKeys: ReadonlySet<string>): WaitingPull[] {
  return list.filter((w) => !shownKeys.has(w.entry.idempotencyKey));
}

/** Reads the user's list; a browser that blocks storage gives an empty list. */
export function readWaiting(store: Store, key: string): WaitingPull[] {
  try {
    return parseWaiting(store.getItem(key));
  } catch {
    return [];
  }
}

/**
 * Read, change, write in one step, so two open tabs do not overwrite each other's new entries.
 * Returns false when the browser would not keep it (storage full or disabled).
 */
export function changeWaiting(store: Store, key: string, change: (list: WaitingPull[]) => WaitingPull[]): boolean {
  try {
    const next = change(readWaiting(store, key));
    if (next.length === 0) store.removeItem(key);
    else store.setItem(key, JSON.stringify(next));
    return true;
  } catch {
    return false;
  }
}

const FIELD_NAMES: Record<string, string> = {
  weight: 'Full weight',
  weightUnit: 'Unit',
  cappedFrames: 'Capped frames',
  tagCode: 'Tag code',
  frameCount: 'Frames per super',
  pulledOn: 'Pulled on',
  depth: 'Box depth',
  colonyId: 'Colony',
  idempotencyKey: 'Entry key',
};

/** "entries.0.weight: More than 0" → "Full weight: More than 0". */
function fieldMessage(fieldErrors: Record<string, string>): string {
  return Object.entries(fieldErrors)
    .map(([path, msg]) => {
      const field = path.split('.').pop() ?? path;
      return FIELD_NAMES[field] ? `${FIELD_NAMES[field]}: ${msg}` : msg;
    })
    .join('; ');
}

export type PullOutcome =
  | { kind: 'saved'; flagged: boolean; flagReasons: string[] }
  | { kind: 'refused'; message: string }
  | { kind: 'waiting'; message?: string };

/** What the pull action answers (lib/schemas/result ActionResult, loosely typed for the client). */
export type PullReply =
  { ok: true; data?: unknown } | { ok: false; message?: string; fieldErrors?: Record<string, string> };
type EntryResult =
  { ok: true; key: string; flagged: boolean; flagReasons: string[] } | { ok: false; key: string; message: string };

/**
 * What one send attempt means for a stored entry:
 * - saved: the server recorded it (now or on an earlier copy with the same key) → forget it;
 * - refused: the server read it and said no (no such colony, a tag already on a hive, an invalid
 *   weight) → sending again would give the same answer, so keep it only to show the keeper;
 * - waiting: no answer (no connection, an error page, signed out) → keep it and send it later.
 * `reply` is undefined when the call threw (the network failed or the server broke).
 */
export function pullOutcome(key: string, reply: PullReply | undefined): PullOutcome {
  if (!reply) return { kind: 'waiting' };
  if (!reply.ok) {
    if (reply.fieldErrors && Object.keys(reply.fieldErrors).length)
      return { kind: 'refused', message: fieldMessage(reply.fieldErrors) };
    // Signed out, session ended or not allowed: the entry itself is fine; it waits for a new sign-in.
    return { kind: 'waiting', message: reply.message ?? 'Not sent yet.' };
  }
  const results = (reply.data as { results?: EntryResult[] } | undefined)?.results;
  const mine = Array.isArray(results) ? results.find((r) => r.key === key) : undefined;
  if (!mine) return { kind: 'waiting', message: 'The server did not answer for this entry; it will be sent again.' };
  if (!mine.ok) return { kind: 'refused', message: mine.message };
  return { kind: 'saved', flagged: mine.flagged, flagReasons: mine.flagReasons ?? [] };
}

/** How long a send may go unanswered before the entry is left waiting (a field signal can stall for minutes). */
export const ANSWER_WITHIN_MS = 20_000;

export class NoAnswer extends Error {
  constructor() {
    super('No answer from the server yet.');
  }
}

/** `promise`, or a NoAnswer rejection once `ms` have passed without it settling. */
export function answerWithin<T>(promise: Promise<T>, ms: number): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const timer = setTimeout(() => reject(new NoAnswer()), ms);
    promise.then(
      (v) => {
        clearTimeout(timer);
        resolve(v);
      },
      (e: unknown) => {
        clearTimeout(timer);
        reject(e);
      },
    );
  });
}
