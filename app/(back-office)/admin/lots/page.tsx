import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { listLots } from '@/lib/data/lots';
import { getSettings } from '@/lib/data/settings';
import { lotListQuery } from '@/lib/schemas/lots';
import { formatWeight } from '@/lib/domain/units';
import { LOT_STAGES } from '@/lib/domain/lot-stage';
import { PageHeader } from '@/components/ui/page-header';
import { StageChip, STAGE_WORD } from '@/components/lots/stage-chip';

export const metadata = { title: 'Lots' };

type Search = Record<string, string | string[] | undefined>;

function pageHref(params: Search, page: number): string {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (typeof v === 'string' && v && k !== 'page') q.set(k, v);
  q.set('page', String(page));
  return `/admin/lots?${q}`;
}

export default async function LotsPage({ searchParams }: { searchParams: Promise<Search> }) {
  const user = await requirePermission('lots.read', '/admin/lots');
  const params = await searchParams;
  const q = lotListQuery.parse(Object.fromEntries(Object.entries(params).filter(([, v]) => typeof v === 'string' && v !== '')));
  const [list, settings] = await Promise.all([listLots(user, q), getSettings()]);
  const pages = Math.max(1, Math.ceil(list.total / list.pageSize));
  const w = (g: number) => formatWeight(g, settings.weightSystem);
  const writer = can(user.role, 'lots.write');
  return (
    <>
      <PageHeader
        title="Extraction lots"
        lead={user.role === 'keeper' ? 'Lots holding supers from your colonies.' : 'Honey extracted together and kept together: weights, moisture, lab reports and history.'}
        actions={writer ? (<>
          <Link href="/admin/lots/new" className="btn-primary">New lot</Link>
          <Link href="/admin/lots/blend" className="btn-secondary">New blend</Link>
          {can(user.role, 'containerTypes.manage') ? <Link href="/admin/lots/container-types" className="btn-quiet">Container types</Link> : null}
        </>) : null}
      />
      <form method="get" className="card mb-4 grid gap-3 sm:grid-cols-4 sm:items-end" aria-label="Filter lots">
        <label className="field" htmlFor="stage"><span>Stage</span>
          <select id="stage" name="stage" className="input" defaultValue={q.stage ?? ''}>
            <option value="">Any stage</option>
            {LOT_STAGES.map((s) => <option key={s} value={s}>{STAGE_WORD[s]}</option>)}
          </select></label>
        <label className="field" htmlFor="year"><span>Year</span>
          <select id="year" name="year" className="input" defaultValue={q.year ? String(q.year) : ''}>
            <option value="">Any year</option>
            {list.years.map((y) => <option key={y} value={y}>{y}</option>)}
          </select></label>
        <label className="field" htmlFor="floral"><span>Floral source</span>
          <input id="floral" name="floral" className="input" defaultValue={q.floral ?? ''} /></label>
        <button type="submit" className="btn-secondary">Filter</button>
      </form>
      <div className="card overflow-x-auto p-0">
        <table className="data-table">
          <caption className="sr-only">Extraction lots, newest first</caption>
          <thead><tr><th scope="col">Lot</th><th scope="col">Floral source</th><th scope="col">Stage</th><th scope="col">Extracted</th><th scope="col" className="num">Supers</th><th scope="col" className="num">Net</th><th scope="col" className="num">Left</th></tr></thead>
          <tbody>
            {list.rows.map((l) => (
              <tr key={l.id}>
                <td><Link href={`/admin/lots/${l.id}`} className="font-mono font-semibold">{l.code}</Link>{l.isBlend ? <span className="hint"> · blend</span> : null}</td>
                <td>{l.floralSource || '—'}</td>
                <td><StageChip stage={l.stage} /></td>
                <td>{l.extractedOn ?? '—'}</td>
                <td className="num">{l.superCount}</td>
                <td className="num">{w(l.netGrams)}</td>
                <td className="num">{w(l.remainingGrams)}</td>
              </tr>
            ))}
            {list.rows.length === 0 ? <tr><td colSpan={7} className="hint">No lots match.</td></tr> : null}
          </tbody>
        </table>
      </div>
      <nav aria-label="Pages" className="mt-4 flex items-center justify-between gap-2 text-sm">
        <span>{list.total} lot{list.total === 1 ? '' : 's'} · page {list.page} of {pages}</span>
        <span className="flex gap-2">
          {list.page > 1 ? <Link className="btn-quiet" href={pageHref(params, list.page - 1)}>Previous</Link> : null}
          {list.page < pages ? <Link className="btn-quiet" href={pageHref(params, list.page + 1)}>Next</Link> : null}
        </span>
      </nav>
    </>
  );
}
