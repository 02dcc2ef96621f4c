import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { listYards } from '@/lib/data/yards/yards';
import { queryRecord } from '@/lib/schemas/list-query';
import { yardListQuery } from '@/lib/schemas/yards';
import { PageHeader } from '@/components/ui/page-header';
import { YardTable } from '@/components/yards/yard-table';

export const metadata = { title: 'Yards' };

export default async function YardsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requirePermission('yards.read', '/admin/yards');
  const parsed = yardListQuery.safeParse(queryRecord(await searchParams));
  const query = parsed.success ? parsed.data : yardListQuery.parse({});
  const first = await listYards(user, query);
  const manage = can(user.role, 'yards.manage');
  const keeper = user.role === 'keeper';
  return (
    <>
      <PageHeader
        title={keeper ? 'My yards' : 'Yards'}
        lead={
          keeper
            ? 'Tap a yard to see its colonies and record supers pulled.'
            : 'Apiary sites, their keepers and colonies.'
        }
        actions={
          <>
            {manage ? (
              <Link href="/admin/yards/new" className="btn-primary min-h-11">
                New yard
              </Link>
            ) : null}
            {manage ? (
              <Link href="/admin/treatment-kinds" className="btn-secondary min-h-11">
                Treatment kinds
              </Link>
            ) : null}
          </>
        }
      />
      <YardTable
        initial={first}
        filters={query.q ? { q: query.q } : {}}
        initialSort={{ id: query.sort, desc: query.dir === 'desc' }}
        caption={keeper ? 'My yards' : 'Yards'}
        empty={keeper ? 'No yards are assigned to you yet. Ask the owner to add you to a yard.' : 'No yards yet.'}
      />
    </>
  );
}
