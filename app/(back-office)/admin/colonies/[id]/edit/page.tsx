import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { getYard } from '@/lib/data/yards/yards';
import { getColony, listColonies } from '@/lib/data/colonies/read';
import { PageHeader } from '@/components/ui/page-header';
import { ColonyForm } from '@/components/colonies/colony-form';
import type { ColonyInput } from '@/lib/schemas/colonies';
import { updateColonyAction } from '../../actions';

export const metadata = { title: 'Edit colony' };

export default async function EditColonyPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission('colonies.write', `/admin/colonies/${id}/edit`);
  const colony = await getColony(user, Number(id));
  if (!colony) notFound();
  const yard = await getYard(user, colony.yardId);
  const parents = (await listColonies(user, { page: 1, pageSize: 100, sort: 'code', dir: 'asc' })).rows.filter(
    (c) => c.id !== colony.id,
  );
  async function save(v: ColonyInput) {
    'use server';
    return updateColonyAction({ ...v, colonyId: colony!.id });
  }
  return (
    <>
      <PageHeader
        title={`Edit colony ${colony.code}`}
        lead="To move it to another yard or change its status, use the colony page: those keep a dated record."
      />
      <ColonyForm
        initial={{
          code: colony.code,
          yardId: colony.yardId,
          keeperId: colony.keeperId,
          origin: colony.origin,
          parentColonyId: colony.parent?.id ?? '',
          queenYear: colony.queenYear ?? '',
          startedOn: colony.startedOn ?? '',
          notes: colony.notes,
        }}
        keepers={user.role === 'owner' && yard ? yard.keepers : null}
        parents={parents.map((p) => ({ id: p.id, code: p.code }))}
        onSave={save}
        submitLabel="Save colony"
      />
    </>
  );
}
