import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { listLots } from '@/lib/data/lots/lots';
import { getSettings } from '@/lib/data/settings/settings';
import { lotListQuery } from '@/lib/schemas/lots';
import { LOT_STAGES } from '@/lib/domain/lot-stage';
import { PageHeader } from '@/components/ui/page-header';
import { SelectField } from '@/components/ui/select-field';
import { STAGE_WORD } from '@/components/lots/stage-chip';
import { LotsTable } from '@/components/lots/lots-table';

export const metadata = { title: 'Lots' };

type Search = Record<string, string | string[] | undefined>;

export default async function LotsPage({ searchParams }: { searchParams: Promise<Search> }) {
  const user = await requirePermission('lots.read', '/admin/lots');
  const params = await searchParams;
  const pick = (k: string) => (typeof params[k] === 'string' && params[k] ? params[k] : undefined);
  const q = lotListQuery.parse({
    pageSize: 25,
    page: 1,
    stage: pick('stage'),
    year: pick('year'),
    floral: pick('floral'),
  });
  const [list, settings] = await Promise.all([listLots(user, q), getSettings()]);
  const filters: Record<string, string> = {};
  if (q.stage) filters.stage = q.stage;
  if (q.year) filters.year = String(q.year);
  if (q.floral) filters.floral = q.floral;
  const writer = can(user.role, 'lots.write');
  return (
    <>
      <PageHeader
        title="Extraction lots"
        lead={
          user.role === 'keeper'
            ? 'Lots holding supers from your colonies.'
            : 'Honey extracted together and kept together: weights, moisture, lab reports and history.'
        }
        actions={
          writer ? (
            <>
              <Link href="/admin/lots/new" className="btn-primary">
                New lot
              </Link>
              <Link href="/admin/lots/blend" className="btn-secondary">
                New blend
              </Link>
              {can(user.role, 'containerTypes.manage') ? (
                <Link href="/admin/lots/container-types" className="btn-quiet">
                  Container types
                </Link>
              ) : null}
            </>
          ) : null
        }
      />
      <form method="get" className="mb-4 grid gap-3 card sm:grid-cols-4 sm:items-end" aria-label="Filter lots">
        <SelectField
          id="stage"
          name="stage"
          label="Stage"
          className="input"
          defaultValue={q.stage ?? ''}
          options={[{ value: '', label: 'Any stage' }, ...LOT_STAGES.map((s) => ({ value: s, label: STAGE_WORD[s] }))]}
        />
        <SelectField
          id="year"
          name="year"
          label="Year"
          className="input"
          defaultValue={q.year ? String(q.year) : ''}
          options={[{ value: '', label: 'Any year' }, ...list.years]}
        />
        <label className="field" htmlFor="floral">
          <span>Floral source</span>
          <input id="floral" name="floral" className="input" defaultValue={q.floral ?? ''} />
        </label>
        <button type="submit" className="btn-secondary">
          Filter
        </button>
      </form>
      <LotsTable initial={list} filters={filters} weightSystem={settings.weightSystem} />
    </>
  );
}
