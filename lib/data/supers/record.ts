import 'server-only';
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { getDb } from '@/lib/db/index';
import type { SessionUser } from '@/lib/auth/session';
import type { SuperDepth } from '@/models/super-tag';
import { toGrams } from '@/lib/domain/units';
import { ConflictError, DomainError, InvalidError } from '@/lib/domain/errors';
import { writableColony } from '@/lib/data/colonies/write';
import { getSettings } from '@/lib/data/settings/settings';
import { canonicalTag } from '@/lib/schemas/fields';
import { flagsForPull } from './flags';

/** The schemas' one spelling of a tag code (`canonicalTag`), for any caller that did not pass through them; blank is no tag. */
export function canonicalTagCode(code: string | null | undefined): string | null {
  return (code && canonicalTag(code)) || null;
}

/** The open (on the hive, not voided) record of a tag, whatever case it was stored in. */
function openWithTag(tagCode: string, t: Transaction) {
  const { sequelize, models } = getDb();
  return models.SuperPull.findOne({
    where: {
      [Op.and]: [
        sequelize.where(sequelize.fn('upper', sequelize.col('tag_code')), tagCode),
        { pulledOn: null, voidedAt: null },
      ],
    },
    include: [{ association: 'colony', attributes: ['code'] }],
    order: [['id', 'ASC']],
    transaction: t,
  });
}

/**
 * A super on or a pull names a tag from the printed tag list (super_tags), or no tag at all when the
 * owner allows untagged supers (Settings). Refuses with a sentence a keeper can act on.
 */
async function checkTag(tagCode: string | null, what: 'on' | 'pull', t: Transaction): Promise<void> {
  if (tagCode === null) {
    if ((await getSettings()).allowUntaggedSupers) return;
    throw new InvalidError(
      what === 'on'
        ? 'Every super goes on with its tag here: scan the tag or pick it from the list. (The owner can allow untagged supers in Settings.)'
        : 'Every pull names its super’s tag here: scan the tag or pick it from the list. (The owner can allow untagged supers in Settings.)',
    );
  }
  const tag = await getDb().models.SuperTag.findOne({ where: { code: tagCode }, transaction: t });
  if (!tag)
    throw new InvalidError(
      `Tag ${tagCode} is not on your tag list. Check the code on the box, or print the tag on the Supers › Tags page first.`,
    );
  if (tag.retiredAt) throw new InvalidError(`Tag ${tagCode} was retired. Use the box’s new tag.`);
}

/** A phone's entry key names one record: the row a put-on or a pull created, or the pull that closed it. */
const byEntryKey = (key: string) => ({ [Op.or]: [{ idempotencyKey: key }, { pullKey: key }] });

async function idempotent<T>(
  find: () => Promise<T | null>,
  run: () => Promise<T>,
): Promise<{ value: T; created: boolean }> {
  const existing = await find();
  if (existing) return { value: existing, created: false };
  try {
    return { value: await run(), created: true };
  } catch (err) {
    if (!(err instanceof UniqueConstraintError)) throw err;
    // Two copies of the same entry raced: the unique index on idempotency_key let only one through.
    const again = await find();
    if (again) return { value: again, created: false };
    throw new ConflictError('That tag is already on a hive; pull it there first, or check the tag code.');
  }
}

export async function putSuperOn(
  user: SessionUser,
  input: {
    colonyId: number;
    depth: SuperDepth;
    frameCount: number;
    tagCode: string | null;
    putOnOn: string;
    idempotencyKey: string;
  },
): Promise<number> {
  const { sequelize, models } = getDb();
  const tagCode = canonicalTagCode(input.tagCode);
  const { value } = await idempotent(
    () => models.SuperPull.findOne({ where: byEntryKey(input.idempotencyKey) }),
    () =>
      sequelize.transaction(async (t) => {
        const colony = await writableColony(user, input.colonyId, t);
        await checkTag(tagCode, 'on', t);
        if (tagCode) {
          const on = await openWithTag(tagCode, t);
          if (on)
            throw new ConflictError(
              on.colonyId === colony.id
                ? `Tag ${tagCode} is already on this hive (put on ${on.putOnOn ?? 'on a day not recorded'}).`
                : `Tag ${tagCode} is already on hive ${on.colony?.code ?? `#${on.colonyId}`} (put on ${on.putOnOn ?? 'on a day not recorded'}). Pull it there first, or check the tag code.`,
            );
        }
        return models.SuperPull.create(
          { ...input, tagCode, colonyId: colony.id, putOnBy: user.id },
          { transaction: t },
        );
      }),
  );
  return value.id;
}

export type PullInput = {
  colonyId: number;
  pulledOn: string;
  depth: SuperDepth;
  frameCount: number;
  weight: number | null;
  weightUnit: 'kg' | 'lb';
  cappedFrames: number | null;
  tagCode: string | null;
  idempotencyKey: string;
};
export type PullResult = { id: number; colonyId: number; created: boolean; flagged: boolean; flagReasons: string[] };

/**
 * Records one super pulled. If the colony has a super still on (the same tag, or else the
 * oldest one put on; a put-on voided as a mistake is not on), that super is closed; otherwise a pulled super is recorded with no
 * put-on date. A tagged pull always closes its tag's put-on: a tag that is on another hive, or went
 * on after the pull date, is refused rather than recorded as a second box. The conflict flag is computed from the colony's feedings and treatments in
 * the same transaction. A repeated idempotency key returns the first result, never a second row.
 */
export async function recordPull(user: SessionUser, input: PullInput, outer?: Transaction): Promise<PullResult> {
  const { sequelize, models } = getDb();
  const fullGrams = input.weight === null ? null : toGrams(input.weight, input.weightUnit);
  const tagCode = canonicalTagCode(input.tagCode);
  const find = () => models.SuperPull.findOne({ where: byEntryKey(input.idempotencyKey), transaction: outer });
  const work = async (t: Transaction) => {
    const colony = await writableColony(user, input.colonyId, t);
    await checkTag(tagCode, 'pull', t);
    if (tagCode) {
      const on = await openWithTag(tagCode, t);
      if (on && on.colonyId !== colony.id)
        throw new ConflictError(
          `Tag ${tagCode} is on hive ${on.colony?.code ?? `#${on.colonyId}`}, not this one. Record the pull on that hive, or check the tag code.`,
        );
      if (on?.putOnOn && on.putOnOn > input.pulledOn)
        throw new InvalidError(`Tag ${tagCode} went on on ${on.putOnOn}, after this pull date (${input.pulledOn}).`);
    }
    const open = await models.SuperPull.findAll({
      where: {
        [Op.and]: [
          { colonyId: colony.id, pulledOn: null, voidedAt: null },
          ...(tagCode ? [sequelize.where(sequelize.fn('upper', sequelize.col('tag_code')), tagCode)] : []),
        ],
      },
      order: [
        ['putOnOn', 'ASC NULLS LAST'],
        ['id', 'ASC'],
      ],
      limit: 1,
      transaction: t,
      lock: t.LOCK.UPDATE,
    });
    const onHive = open[0] && (!open[0].putOnOn || open[0].putOnOn <= input.pulledOn) ? open[0] : null;
    const flags = await flagsForPull(
      colony.id,
      { id: onHive?.id, pulledOn: input.pulledOn, putOnOn: onHive?.putOnOn ?? null },
      t,
    );
    const fields = {
      depth: input.depth,
      frameCount: input.frameCount,
      pulledOn: input.pulledOn,
      fullGrams,
      cappedFrames: input.cappedFrames,
      tagCode: tagCode ?? onHive?.tagCode ?? null,
      pulledBy: user.id,
      pullKey: input.idempotencyKey,
      ...flags,
    };
    // Closing a super that went on keeps the put-on's key, so a late retry of that put-on still finds it.
    if (onHive) return onHive.update(fields, { transaction: t });
    return models.SuperPull.create(
      { ...fields, idempotencyKey: input.idempotencyKey, colonyId: colony.id },
      { transaction: t },
    );
  };
  const { value, created } = await idempotent(find, () => (outer ? work(outer) : sequelize.transaction(work)));
  if (!created && value.colonyId !== input.colonyId)
    throw new ConflictError('This entry key was already used for another colony.');
  return { id: value.id, colonyId: value.colonyId, created, flagged: value.flagged, flagReasons: value.flagReasons };
}

/** Several colonies in one pass: each entry stands alone (one failing entry does not undo the others). */
export async function recordPulls(
  user: SessionUser,
  entries: PullInput[],
): Promise<
  (({ ok: true; key: string } & PullResult) | { ok: false; key: string; colonyId: number; message: string })[]
> {
  const out = [];
  for (const entry of entries) {
    try {
      out.push({ ok: true as const, key: entry.idempotencyKey, ...(await recordPull(user, entry)) });
    } catch (err) {
      if (!(err instanceof DomainError)) throw err;
      out.push({ ok: false as const, key: entry.idempotencyKey, colonyId: entry.colonyId, message: err.message });
    }
  }
  return out;
}
