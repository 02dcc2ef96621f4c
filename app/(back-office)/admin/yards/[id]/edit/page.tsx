import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { getYard, listAssignableKeepers } from '@/lib/data/yards/yards';
import { PageHeader } from '@/components/ui/page-header';
import { YardForm } from '@/components/yards/yard-form';
import type { YardInput } from '@/lib/schemas/yards';
import { updateYardAction } from '../../actions';

export const metadata = { title: 'Edit yard' };

export default async function EditYardPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission('yards.manage', `/admin/yards/${id}/edit`);
  const yard = await getYard(user, Number(id));
  if (!yard) notFound();
  async function save(v: YardInput) {
    'use server';
    return updateYardAction({ ...v, yardId: yard!.id });
  }
  return (
    <>
      <PageHeader title={`Edit ${yard.name}`} lead="Keepers see and record only the yards they are assigned to." />
      <YardForm
        initial={{
          name: yard.name,
          place: yard.place,
          latitude: yard.latitude ?? '',
          longitude: yard.longitude ?? '',
          forageNotes: yard.forageNotes,
          keeperIds: yard.keepers.map((k) => k.id),
        }}
        keepers={await listAssignableKeepers()}
        onSave={save}
      />
    </>
  );
}
