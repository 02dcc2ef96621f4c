import { getDb } from '@/lib/db/index';
import { saveYard } from '@/lib/data/yards/yards';
import { createColony } from '@/lib/data/colonies/write';
import { DEMO } from './session';

/** Own yards and colonies per test file, with unique names, so files do not depend on each other. */
export async function yardFixture(tag: string) {
  const { User, TreatmentKind } = getDb().models;
  const [owner, keeperA, keeperB] = await Promise.all(
    [DEMO.owner, DEMO.keeper, DEMO.keeper2].map((email) => User.findOne({ where: { email } })),
  );
  if (!owner || !keeperA || !keeperB) throw new Error('demo users missing');
  const yardA = await saveYard(owner.id, null, {
    name: `Test A ${tag}`,
    place: '',
    latitude: null,
    longitude: null,
    forageNotes: '',
    keeperIds: [keeperA.id],
  });
  const yardB = await saveYard(owner.id, null, {
    name: `Test B ${tag}`,
    place: '',
    latitude: null,
    longitude: null,
    forageNotes: '',
    keeperIds: [keeperB.id],
  });
  const colony = (code: string, yardId: number, keeperId: number) =>
    createColony(owner, {
      code,
      yardId,
      keeperId,
      origin: 'nucleus',
      parentColonyId: null,
      queenYear: 2025,
      startedOn: '2026-04-01',
      notes: '',
    });
  // The owner assigns colonies to keepers of the yard: they must be assigned first.
  const a1 = await colony(`${tag}-A1`, yardA, keeperA.id);
  const a2 = await colony(`${tag}-A2`, yardA, keeperA.id);
  const a3 = await colony(`${tag}-A3`, yardA, keeperA.id);
  const b1 = await colony(`${tag}-B1`, yardB, keeperB.id);
  const [noSupers] = await TreatmentKind.findOrCreate({
    where: { name: `No supers ${tag}` },
    defaults: { name: `No supers ${tag}`, supersAllowed: false, waitingDays: 7 },
  });
  return { owner, keeperA, keeperB, yardA, yardB, a1, a2, a3, b1, noSupersKindId: noSupers.id };
}

export const key = () => crypto.randomUUID();

/** Printed tags (super_tags rows) for the codes a test puts on or pulls; a tag must exist to be used. */
export async function printTags(...codes: string[]) {
  const { SuperTag } = getDb().models;
  for (const code of codes) await SuperTag.findOrCreate({ where: { code }, defaults: { code, depth: 'medium' } });
}
