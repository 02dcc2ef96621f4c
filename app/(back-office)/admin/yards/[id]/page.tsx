import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { getYard } from '@/lib/data/yards/yards';
import { listColonies } from '@/lib/data/colonies/read';
import { colonyListQuery } from '@/lib/schemas/colonies';
import { PageHeader } from '@/components/ui/page-header';
import { ColonyTable } from '@/components/colonies/colony-table';

export const metadata = { title: 'Yard' };

export default async function YardPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission('yards.read', `/admin/yards/${id}`);
  const yard = await getYard(user, Number(id));
  if (!yard) notFound();
  const first = await listColonies(user, colonyListQuery.parse({ yardId: yard.id }));
  const write = can(user.role, 'colonies.write');
  return (
    <>
      <PageHeader
        title={yard.name}
        lead={[
          yard.place,
          yard.keepers.length ? `Keepers: ${yard.keepers.map((k) => k.name).join(', ')}` : 'No keeper assigned',
        ]
          .filter(Boolean)
          .join(' · ')}
        actions={
          <>
            {can(user.role, 'supers.write') ? (
              <Link href={`/admin/yards/${yard.id}/pulls`} className="btn-primary min-h-11">
                Record pulls
              </Link>
            ) : null}
            {write ? (
              <Link href={`/admin/colonies/new?yardId=${yard.id}`} className="btn-secondary min-h-11">
                New colony
              </Link>
            ) : null}
            {can(user.role, 'yards.manage') ? (
              <Link href={`/admin/yards/${yard.id}/edit`} className="btn-secondary min-h-11">
                Edit yard
              </Link>
            ) : null}
          </>
        }
      />
      {yard.forageNotes ? <p className="mb-4 max-w-2xl text-sm text-ink-soft">Forage: {yard.forageNotes}</p> : null}
      {yard.latitude != null && yard.longitude != null ? (
        <p className="mb-4 text-sm text-ink-soft">
          Location: {yard.latitude}, {yard.longitude}
        </p>
      ) : null}
      <ColonyTable initial={first} filters={{ yardId: String(yard.id) }} caption={`Colonies in ${yard.name}`} />
    </>
  );
}
