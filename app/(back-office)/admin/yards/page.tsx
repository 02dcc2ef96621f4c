import Link from 'next/link';
import { MapPin } from 'lucide-react';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { listYards } from '@/lib/data/yards/yards';
import { queryRecord } from '@/lib/schemas/list-query';
import { yardListQuery } from '@/lib/schemas/yards';
import { PageHeader } from '@/components/ui/page-header';
import { Pager } from '@/components/yards/pager';

export const metadata = { title: 'Yards' };

export default async function YardsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePermission('yards.read', '/admin/yards');
  const params = queryRecord(await searchParams);
  const parsed = yardListQuery.safeParse(params);
  const query = parsed.success ? parsed.data : yardListQuery.parse({});
  const { rows, total, page, pageSize } = await listYards(user, query);
  const manage = can(user.role, 'yards.manage');
  return (
    <>
      <PageHeader
        title={user.role === 'keeper' ? 'My yards' : 'Yards'}
        lead={user.role === 'keeper' ? 'Tap a yard to see its colonies and record supers pulled.' : 'Apiary sites, their keepers and colonies.'}
        actions={<>
          {manage ? <Link href="/admin/yards/new" className="btn-primary min-h-11">New yard</Link> : null}
          {manage ? <Link href="/admin/treatment-kinds" className="btn-secondary min-h-11">Treatment kinds</Link> : null}
        </>}
      />
      {rows.length === 0 ? <p className="card">{user.role === 'keeper' ? 'No yards are assigned to you yet. Ask the owner to add you to a yard.' : 'No yards yet.'}</p> : null}
      <ul className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
        {rows.map((y) => (
          <li key={y.id}>
            <Link href={`/admin/yards/${y.id}`} className="card block min-h-11 no-underline hover:border-forest-700">
              <span className="flex items-center gap-2 font-heading text-lg font-bold text-forest-800"><MapPin aria-hidden className="h-5 w-5" />{y.name}</span>
              {y.place ? <span className="mt-1 block text-sm text-ink-soft">{y.place}</span> : null}
              <span className="mt-2 block text-sm text-ink">{y.activeColonies} active {y.activeColonies === 1 ? 'colony' : 'colonies'} · {y.keepers.map((k) => k.name).join(', ') || 'no keeper assigned'}</span>
            </Link>
          </li>
        ))}
      </ul>
      <Pager path="/admin/yards" params={params} page={page} pageSize={pageSize} total={total} />
    </>
  );
}
