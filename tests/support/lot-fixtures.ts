import { randomUUID } from 'node:crypto';
import { getDb } from '@/lib/db';
import { DEMO } from './session';

/** A unique suffix for codes made by one test run. */
export const uid = () => randomUUID().slice(0, 8).toUpperCase();

/** A yard with one colony kept by `keeperEmail`, and `count` pulled supers with unique tag codes. */
export async function makePulledSupers(
  count: number,
  opts: { keeperEmail?: string; flagged?: boolean[]; depth?: 'deep' | 'medium' | 'shallow' } = {},
) {
  const { models } = getDb();
  const keeper = await models.User.findOne({ where: { email: opts.keeperEmail ?? DEMO.keeper } });
  const tag = uid();
  const yard = await models.Yard.create({ name: `Test yard ${tag}` });
  const colony = await models.Colony.create({
    code: `TC-${tag}`,
    yardId: yard.id,
    keeperId: keeper!.id,
    origin: 'package',
  });
  const supers = [];
  for (let i = 0; i < count; i++) {
    const flagged = opts.flagged?.[i] ?? false;
    supers.push(
      await models.SuperPull.create({
        colonyId: colony.id,
        tagCode: `T${tag}${i}`,
        depth: opts.depth ?? 'medium',
        frameCount: 10,
        putOnOn: '2026-06-01',
        pulledOn: '2026-07-20',
        fullGrams: 27_000 + i * 100,
        flagged,
        flagReasons: flagged ? ['Sugar syrup fed while the super was on'] : [],
      }),
    );
  }
  return { yard, colony, supers, tags: supers.map((s) => s.tagCode!) };
}
