import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { listSuperPulls } from '@/lib/data/supers/pulls';
import { listYardChoices } from '@/lib/data/yards/yards';
import { getSettings } from '@/lib/data/settings/settings';
import { pullListQuery } from '@/lib/schemas/supers';
import { queryRecord } from '@/lib/schemas/list-query';
import { PageHeader } from '@/components/ui/page-header';
import { SelectField, namedChoices } from '@/components/ui/select-field';
import { SuperPullTable } from '@/components/supers/super-pull-table';
import { voidSuperPullAction } from './actions';

export const metadata = { title: 'Super pulls' };

export default async function SuperPullsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requirePermission('supers.read', '/admin/supers');
  const params = queryRecord(await searchParams);
  const parsed = pullListQuery.safeParse(params);
  const query = parsed.success ? parsed.data : pullListQuery.parse({});
  const [first, yards, settings] = await Promise.all([
    listSuperPulls(user, { ...query, page: 1, sort: 'pulledOn', dir: 'desc' }),
    listYardChoices(user),
    getSettings(),
  ]);
  // Only the filters go to the client table; it asks /api/super-pulls for other pages and sorts.
  const filters = Object.fromEntries(
    Object.entries({
      yardId: query.yardId,
      flagged: query.flagged,
      voided: query.voided,
      from: query.from,
      to: query.to,
    })
      .filter(([, v]) => v !== undefined)
      .map(([k, v]) => [k, String(v)]),
  );
  return (
    <>
      <PageHeader
        title="Super pulls"
        lead="Supers taken off the colonies. A flagged super was on a colony during sugar feeding or a treatment whose label does not allow honey supers. A pull recorded by mistake is voided with a reason: it stays here, struck through, and no longer counts."
        actions={
          <>
            {can(user.role, 'supers.import') ? (
              <Link href="/admin/supers/import" className="btn-secondary min-h-11">
                Import field sheet
              </Link>
            ) : null}
            {can(user.role, 'superTags.print') ? (
              <Link href="/admin/supers/tags" className="btn-secondary min-h-11">
                Super tags
              </Link>
            ) : null}
          </>
        }
      />
      {!parsed.success ? (
        <p role="alert" className="mb-3 rounded-lg bg-warn-bg px-3 py-2 text-warn-fg">
          Some filters were not valid and were ignored.
        </p>
      ) : null}
      <form
        method="get"
        className="mb-4 grid gap-3 card sm:grid-cols-3 sm:items-end lg:grid-cols-6"
        aria-label="Filter super pulls"
      >
        <SelectField
          id="f-yard"
          name="yardId"
          label="Yard"
          defaultValue={params.yardId ?? ''}
          options={[{ value: '', label: 'All yards' }, ...namedChoices(yards)]}
        />
        <SelectField
          id="f-flag"
          name="flagged"
          label="Conflict check"
          defaultValue={params.flagged ?? ''}
          options={[
            { value: '', label: 'All' },
            { value: 'yes', label: 'Flagged only' },
            { value: 'no', label: 'Clear only' },
          ]}
        />
        <SelectField
          id="f-void"
          name="voided"
          label="Voided pulls"
          defaultValue={params.voided ?? ''}
          options={[
            { value: '', label: 'Shown, struck through' },
            { value: 'no', label: 'Hidden' },
            { value: 'yes', label: 'Voided only' },
          ]}
        />
        <label className="field" htmlFor="f-from">
          <span>From</span>
          <input id="f-from" type="date" name="from" className="input min-h-11" defaultValue={params.from ?? ''} />
        </label>
        <label className="field" htmlFor="f-to">
          <span>To</span>
          <input id="f-to" type="date" name="to" className="input min-h-11" defaultValue={params.to ?? ''} />
        </label>
        <button type="submit" className="btn-secondary min-h-11">
          Filter
        </button>
      </form>
      <SuperPullTable
        initial={first}
        filters={filters}
        weightSystem={settings.weightSystem}
        timeZone={settings.timeZone}
        onVoid={can(user.role, 'supers.write') ? voidSuperPullAction : undefined}
      />
    </>
  );
}
