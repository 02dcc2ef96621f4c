import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { getYard } from '@/lib/data/yards';
import { listColonies } from '@/lib/data/colonies';
import { colonyListQuery, queryRecord } from '@/lib/schemas/harvest';
import { PageHeader } from '@/components/ui/page-header';
import { Chip } from '@/components/ui/chip';
import { ColonyStatusChip, QueenColour } from '@/components/harvest/chips';
import { Pager } from '@/components/harvest/pager';

export const metadata = { title: 'Yard' };

export default async function YardPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { id } = await params;
  const user = await requirePermission('yards.read', `/admin/yards/${id}`);
  const yard = await getYard(user, Number(id));
  if (!yard) notFound();
  const raw = queryRecord(await searchParams);
  const parsed = colonyListQuery.safeParse({ pageSize: 100, ...raw, yardId: yard.id });
  const query = parsed.success ? parsed.data : colonyListQuery.parse({ pageSize: 100, yardId: yard.id });
  const { rows, total, page, pageSize } = await listColonies(user, query);
  const write = can(user.role, 'colonies.write');
  return (
    <>
      <PageHeader
        title={yard.name}
        lead={[yard.place, yard.keepers.length ? `Keepers: ${yard.keepers.map((k) => k.name).join(', ')}` : 'No keeper assigned'].filter(Boolean).join(' · ')}
        actions={<>
          {can(user.role, 'supers.write') ? <Link href={`/admin/yards/${yard.id}/pulls`} className="btn-primary min-h-11">Record pulls</Link> : null}
          {write ? <Link href={`/admin/colonies/new?yardId=${yard.id}`} className="btn-secondary min-h-11">New colony</Link> : null}
          {can(user.role, 'yards.manage') ? <Link href={`/admin/yards/${yard.id}/edit`} className="btn-secondary min-h-11">Edit yard</Link> : null}
        </>}
      />
      {yard.forageNotes ? <p className="mb-4 max-w-2xl text-sm text-ink-soft">Forage: {yard.forageNotes}</p> : null}
      {yard.latitude != null && yard.longitude != null ? <p className="mb-4 text-sm text-ink-soft">Location: {yard.latitude}, {yard.longitude}</p> : null}
      <div className="card overflow-x-auto p-0">
        <table className="data-table">
          <caption className="sr-only">Colonies in {yard.name}</caption>
          <thead><tr><th scope="col">Colony</th><th scope="col">Status</th><th scope="col">Queen</th><th scope="col">Keeper</th><th scope="col">Last pull</th><th scope="col">Flags</th></tr></thead>
          <tbody>
            {rows.map((c) => (
              <tr key={c.id}>
                <td><Link className="inline-flex min-h-11 items-center font-semibold" href={`/admin/colonies/${c.id}`}>{c.code}</Link></td>
                <td><ColonyStatusChip status={c.status} /></td>
                <td><QueenColour year={c.queenYear} colour={c.queenColour} /></td>
                <td>{c.keeperName}</td>
                <td className="num">{c.lastPulledOn ?? '—'}</td>
                <td>{c.flaggedSupers > 0 ? <Chip tone="bad">{c.flaggedSupers} flagged</Chip> : <span className="hint">none</span>}</td>
              </tr>
            ))}
            {rows.length === 0 ? <tr><td colSpan={6}>No colonies in this yard yet.</td></tr> : null}
          </tbody>
        </table>
      </div>
      <Pager path={`/admin/yards/${yard.id}`} params={raw} page={page} pageSize={pageSize} total={total} />
    </>
  );
}
