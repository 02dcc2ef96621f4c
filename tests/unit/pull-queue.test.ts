import { describe, expect, it, vi } from 'vitest';
import {
  NoAnswer,
  answerWithin,
  changeWaiting,
  markRefused,
  notShown,
  parseWaiting,
  pullOutcome,
  readWaiting,
  toSend,
  waitingKey,
  withoutWaiting,
  withWaiting,
  type WaitingPull,
} from '@/components/yards/pull-queue';

const item = (key: string, colonyId = 1, extra: Partial<WaitingPull> = {}): WaitingPull => ({
  entry: {
    colonyId,
    pulledOn: '2026-07-14',
    depth: 'medium',
    frameCount: 10,
    weight: null,
    weightUnit: 'kg',
    cappedFrames: null,
    tagCode: null,
    idempotencyKey: key,
  },
  colonyCode: `QT-${colonyId}`,
  yardName: 'Test yard',
  savedAt: '2026-07-14T09:00:00.000Z',
  ...extra,
});
const keys = (list: WaitingPull[]) => list.map((w) => w.entry.idempotencyKey);

/** A Storage stand-in; `full` makes setItem throw like a full or disabled localStorage. */
function memoryStore(full = false) {
  const data = new Map<string, string>();
  return {
    data,
    getItem: (k: string) => data.get(k) ?? null,
    setItem: (k: string, v: string) => {
      if (full) throw new Error('QuotaExceededError');
      data.set(k, v);
    },
    removeItem: (k: string) => {
      data.delete(k);
    },
  };
}

describe('the list of waiting pulls', () => {
  it('adds a new key at the end and replaces an entry with the same key instead of adding a second', () => {
    let list = withWaiting([], item('key-aaaa-1'));
    list = withWaiting(list, item('key-bbbb-2'));
    list = withWaiting(list, item('key-aaaa-1', 1, { colonyCode: 'QT-RENAMED' }));
    expect(keys(list)).toEqual(['key-aaaa-1', 'key-bbbb-2']);
    expect(list[0].colonyCode).toBe('QT-RENAMED');
  });

  it('removes confirmed keys and leaves the others in order', () => {
    const list = [item('key-aaaa-1'), item('key-bbbb-2'), item('key-cccc-3')];
    expect(keys(withoutWaiting(list, ['key-bbbb-2', 'key-not-there']))).toEqual(['key-aaaa-1', 'key-cccc-3']);
  });

  it('a refused entry is kept with its message but is never sent again; entries on their way are not sent twice', () => {
    const list = markRefused(
      [item('key-aaaa-1'), item('key-bbbb-2'), item('key-cccc-3')],
      'key-bbbb-2',
      'No such colony.',
    );
    expect(list[1].refused).toBe('No such colony.');
    expect(list[0].refused).toBeUndefined();
    expect(keys(toSend(list))).toEqual(['key-aaaa-1', 'key-cccc-3']);
    expect(keys(toSend(list, new Set(['key-aaaa-1'])))).toEqual(['key-cccc-3']);
  });

  it('finds stored entries the page does not show yet (restored after a reload, or added in another tab)', () => {
    const stored = [item('key-aaaa-1'), item('key-bbbb-2'), item('key-cccc-3')];
    expect(keys(notShown(stored, new Set(['key-bbbb-2'])))).toEqual(['key-aaaa-1', 'key-cccc-3']);
    expect(notShown(stored, new Set(keys(stored)))).toEqual([]);
  });

  it('reads back what it wrote, skips malformed items and duplicate keys, and survives garbage', () => {
    const good = item('key-aaaa-1');
    const raw = JSON.stringify([
      good,
      {
        entry: { colonyId: 'x', pulledOn: '2026-07-14', idempotencyKey: 'key-bad-colony' },
        colonyCode: 'A',
        yardName: 'Y',
        savedAt: 's',
      },
      {
        entry: { colonyId: 2, pulledOn: '2026-07-14', idempotencyKey: 'short' },
        colonyCode: 'A',
        yardName: 'Y',
        savedAt: 's',
      },
      { ...item('key-dddd-4'), refused: 42 },
      null,
      { ...good, colonyCode: 'second copy' },
    ]);
    expect(parseWaiting(raw)).toEqual([good]);
    expect(parseWaiting('{not json')).toEqual([]);
    expect(parseWaiting('{"entry":1}')).toEqual([]);
    expect(parseWaiting(null)).toEqual([]);
  });
});

describe('keeping the list in the browser', () => {
  it("keeps one list per user, so two people on one phone never send each other's pulls", () => {
    const store = memoryStore();
    expect(waitingKey(7)).not.toBe(waitingKey(8));
    changeWaiting(store, waitingKey(7), (l) => withWaiting(l, item('key-aaaa-1')));
    changeWaiting(store, waitingKey(8), (l) => withWaiting(l, item('key-bbbb-2')));
    expect(keys(readWaiting(store, waitingKey(7)))).toEqual(['key-aaaa-1']);
    expect(keys(readWaiting(store, waitingKey(8)))).toEqual(['key-bbbb-2']);
  });

  it('changes read the latest stored list, so a tap in another tab is not overwritten; an empty list is removed', () => {
    const store = memoryStore();
    const key = waitingKey(7);
    changeWaiting(store, key, (l) => withWaiting(l, item('key-aaaa-1')));
    // Another tab adds its own entry directly.
    store.setItem(key, JSON.stringify([...readWaiting(store, key), item('key-bbbb-2')]));
    changeWaiting(store, key, (l) => withWaiting(l, item('key-cccc-3')));
    expect(keys(readWaiting(store, key))).toEqual(['key-aaaa-1', 'key-bbbb-2', 'key-cccc-3']);
    changeWaiting(store, key, (l) => withoutWaiting(l, keys(l)));
    expect(store.data.has(key)).toBe(false);
  });

  it('reports a browser that will not store (full or disabled) instead of throwing', () => {
    const store = memoryStore(true);
    expect(changeWaiting(store, waitingKey(7), (l) => withWaiting(l, item('key-aaaa-1')))).toBe(false);
    expect(changeWaiting(memoryStore(), waitingKey(7), (l) => withWaiting(l, item('key-aaaa-1')))).toBe(true);
  });
});

describe('what a send attempt means for a waiting pull', () => {
  const key = 'key-aaaa-1';
  it('no answer at all (no connection, server error) keeps it waiting', () => {
    expect(pullOutcome(key, undefined)).toEqual({ kind: 'waiting' });
  });
  it('signed out or not allowed keeps it waiting with the reason, since the entry itself is fine', () => {
    expect(pullOutcome(key, { ok: false, message: 'Please sign in first.' })).toEqual({
      kind: 'waiting',
      message: 'Please sign in first.',
    });
  });
  it('an invalid entry is refused, with the field named in words', () => {
    expect(
      pullOutcome(key, {
        ok: false,
        message: 'Please fix the marked fields.',
        fieldErrors: { 'entries.0.weight': 'Too heavy for a super' },
      }),
    ).toEqual({ kind: 'refused', message: 'Full weight: Too heavy for a super' });
  });
  it("the server's own refusal for this entry is refused with its message", () => {
    expect(pullOutcome(key, { ok: true, data: { results: [{ ok: false, key, message: 'No such colony.' }] } })).toEqual(
      { kind: 'refused', message: 'No such colony.' },
    );
  });
  it('saved (also when the key was already recorded) carries the flag and its reasons', () => {
    expect(
      pullOutcome(key, {
        ok: true,
        data: { results: [{ ok: true, key, id: 5, flagged: true, flagReasons: ['Sugar syrup fed'] }] },
      }),
    ).toEqual({ kind: 'saved', flagged: true, flagReasons: ['Sugar syrup fed'] });
  });
  it('an answer about another key, or none, is not taken as saved', () => {
    expect(
      pullOutcome(key, {
        ok: true,
        data: { results: [{ ok: true, key: 'key-other-9', flagged: false, flagReasons: [] }] },
      }).kind,
    ).toBe('waiting');
    expect(pullOutcome(key, { ok: true, data: undefined }).kind).toBe('waiting');
  });
});

describe('answerWithin', () => {
  it('passes an answer or a failure through, and gives up with NoAnswer when none comes in time', async () => {
    vi.useFakeTimers();
    try {
      await expect(answerWithin(Promise.resolve('saved'), 1000)).resolves.toBe('saved');
      await expect(answerWithin(Promise.reject(new TypeError('Failed to fetch')), 1000)).rejects.toBeInstanceOf(
        TypeError,
      );
      const outcome = answerWithin(new Promise(() => undefined), 1000).then(
        () => 'answered',
        (e: unknown) => e,
      );
      await vi.advanceTimersByTimeAsync(999);
      expect(await Promise.race([outcome, Promise.resolve('still waiting')])).toBe('still waiting');
      await vi.advanceTimersByTimeAsync(1);
      expect(await outcome).toBeInstanceOf(NoAnswer);
    } finally {
      vi.useRealTimers();
    }
  });
});
