import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { getYard } from '@/lib/data/yards/yards';
import { listColonies } from '@/lib/data/colonies/read';
import { PageHeader } from '@/components/ui/page-header';
import { ColonyForm } from '@/components/colonies/colony-form';
import { createColonyAction } from '../actions';

export const metadata = { title: 'New colony' };

export default async function NewColonyPage({ searchParams }: { searchParams: Promise<{ yardId?: string }> }) {
  const { yardId } = await searchParams;
  const user = await requirePermission('colonies.write', '/admin/yards');
  const yard = await getYard(user, Number(yardId));
  if (!yard) notFound();
  const parents = (await listColonies(user, { page: 1, pageSize: 100, sort: 'code', dir: 'asc', yardId: yard.id }))
    .rows;
  const keepers = user.role === 'owner' ? yard.keepers : null;
  return (
    <>
      <PageHeader title={`New colony in ${yard.name}`} />
      <ColonyForm
        initial={{
          code: '',
          yardId: yard.id,
          keeperId: keepers?.[0]?.id ?? user.id,
          origin: 'nucleus',
          parentColonyId: '',
          queenYear: '',
          startedOn: '',
          notes: '',
        }}
        keepers={keepers && keepers.length ? keepers : null}
        parents={parents.map((p) => ({ id: p.id, code: p.code }))}
        onSave={createColonyAction}
        submitLabel="Add colony"
      />
    </>
  );
}
