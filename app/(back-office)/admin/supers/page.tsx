import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { listSuperPulls } from '@/lib/data/super-pulls';
import { listYardChoices } from '@/lib/data/yards';
import { getSettings } from '@/lib/data/settings';
import { formatWeight } from '@/lib/domain/units';
import { pullListQuery, queryRecord } from '@/lib/schemas/harvest';
import { PageHeader } from '@/components/ui/page-header';
import { Chip } from '@/components/ui/chip';
import { FlagCell } from '@/components/harvest/chips';
import { Pager } from '@/components/harvest/pager';

export const metadata = { title: 'Super pulls' };

export default async function SuperPullsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePermission('supers.read', '/admin/supers');
  const params = queryRecord(await searchParams);
  const parsed = pullListQuery.safeParse(params);
  const query = parsed.success ? parsed.data : pullListQuery.parse({});
  const [{ rows, total, page, pageSize }, yards, settings] = await Promise.all([listSuperPulls(user, query), listYardChoices(user), getSettings()]);
  const sortLink = (sort: string) => `/admin/supers?${new URLSearchParams({ ...params, sort, dir: query.sort === sort && query.dir === 'desc' ? 'asc' : 'desc', page: '1' })}`;
  return (
    <>
      <PageHeader
        title="Super pulls"
        lead="Supers taken off the colonies. A flagged super was on a colony during sugar feeding or a treatment whose label does not allow honey supers."
        actions={<>
          {can(user.role, 'supers.import') ? <Link href="/admin/supers/import" className="btn-secondary min-h-11">Import field sheet</Link> : null}
          {can(user.role, 'superTags.print') ? <Link href="/admin/supers/tags" className="btn-secondary min-h-11">Super tags</Link> : null}
        </>}
      />
      {!parsed.success ? <p role="alert" className="mb-3 rounded-lg bg-warn-bg px-3 py-2 text-warn-fg">Some filters were not valid and were ignored.</p> : null}
      <form method="get" className="card mb-4 grid gap-3 sm:grid-cols-5 sm:items-end" aria-label="Filter super pulls">
        <label className="field" htmlFor="f-yard"><span>Yard</span>
          <select id="f-yard" name="yardId" className="input min-h-11" defaultValue={params.yardId ?? ''}>
            <option value="">All yards</option>{yards.map((y) => <option key={y.id} value={y.id}>{y.name}</option>)}
          </select>
        </label>
        <label className="field" htmlFor="f-flag"><span>Conflict check</span>
          <select id="f-flag" name="flagged" className="input min-h-11" defaultValue={params.flagged ?? ''}>
            <option value="">All</option><option value="yes">Flagged only</option><option value="no">Clear only</option>
          </select>
        </label>
        <label className="field" htmlFor="f-from"><span>From</span><input id="f-from" type="date" name="from" className="input min-h-11" defaultValue={params.from ?? ''} /></label>
        <label className="field" htmlFor="f-to"><span>To</span><input id="f-to" type="date" name="to" className="input min-h-11" defaultValue={params.to ?? ''} /></label>
        <button type="submit" className="btn-secondary min-h-11">Filter</button>
      </form>
      <div className="card overflow-x-auto p-0">
        <table className="data-table">
          <caption className="sr-only">Super pulls</caption>
          <thead>
            <tr>
              <th scope="col"><Link href={sortLink('pulledOn')}>Pulled</Link></th>
              <th scope="col"><Link href={sortLink('colony')}>Colony</Link></th>
              <th scope="col">Yard</th><th scope="col">Box</th><th scope="col">Tag</th>
              <th scope="col" className="num"><Link href={sortLink('fullGrams')}>Full weight</Link></th>
              <th scope="col">Conflict check</th><th scope="col">Lot</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((p) => (
              <tr key={p.id} className={p.flagged ? 'bg-bad-bg/40' : undefined}>
                <td className="num">{p.pulledOn}</td>
                <td><Link href={`/admin/colonies/${p.colonyId}`}>{p.colonyCode}</Link></td>
                <td>{p.yardName}</td>
                <td>{p.depth}, {p.frameCount} fr.</td>
                <td>{p.tagCode ?? '—'}</td>
                <td className="num">{p.fullGrams ? formatWeight(p.fullGrams, settings.weightSystem) : p.cappedFrames != null ? `~${p.cappedFrames} capped fr.` : '—'}</td>
                <td><FlagCell flagged={p.flagged} reasons={p.flagReasons} /></td>
                <td>{p.inLot ? <Chip tone="info">in a lot</Chip> : <Chip>waiting</Chip>}</td>
              </tr>
            ))}
            {rows.length === 0 ? <tr><td colSpan={8}>No super pulls match.</td></tr> : null}
          </tbody>
        </table>
      </div>
      <Pager path="/admin/supers" params={params} page={page} pageSize={pageSize} total={total} />
    </>
  );
}
