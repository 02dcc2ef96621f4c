import { seasonBounds, seasonOf } from './season';

/**
 * The days a pulled super is taken to have been on its colony, for the conflict check.
 * When the put-on date was recorded, that is the start. When it was not (a pull entered
 * straight from the yard or a field sheet), we cannot know, so the window is widened on
 * the safe side: it starts the day after the colony's previous pull, whatever the year (a
 * pull on 15 January after one on 20 December is checked from 21 December), or, when the
 * colony has no earlier pull, on the first day of the season the pull is in (the owner's
 * season start month). Widening can only add flags, never hide one: a super flagged wrongly
 * can be cleared by the owner with a reason; honey fed with syrup cannot be unmixed from a lot.
 */
export type PullWindow = { putOn: string; pulled: string; putOnKnown: boolean };

function nextDay(date: string): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + 1);
  return d.toISOString().slice(0, 10);
}

export function pullWindow(
  pulledOn: string,
  putOnOn: string | null,
  previousPulls: string[],
  seasonStartMonth = 1,
): PullWindow {
  if (putOnOn) {
    if (putOnOn > pulledOn) throw new RangeError(`Super pulled (${pulledOn}) before it was put on (${putOnOn})`);
    return { putOn: putOnOn, pulled: pulledOn, putOnKnown: true };
  }
  const earlier = previousPulls.filter((d) => d < pulledOn).sort();
  const start =
    earlier.length > 0
      ? nextDay(earlier[earlier.length - 1])
      : seasonBounds(seasonOf(pulledOn, seasonStartMonth), seasonStartMonth).from;
  return { putOn: start, pulled: pulledOn, putOnKnown: false };
}

/** Reasons to store with the super: the conflict reasons, plus a note when the window was assumed. */
export function flagReasons(window: PullWindow, reasons: string[]): string[] {
  if (reasons.length === 0 || window.putOnKnown) return reasons;
  return [...reasons, `Put-on date not recorded: checked from ${window.putOn}`];
}
