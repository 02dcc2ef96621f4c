import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { getSeasonHistory, getSeasonReport } from '@/lib/data/reports/yield-report';
import { reportFilterChoices } from '@/lib/data/reports/scope';
import { getSettings } from '@/lib/data/settings/settings';
import { formatMoney, formatWeight, gramsToKg, gramsToLb } from '@/lib/domain/units';
import { seasonLabel } from '@/lib/domain/season';
import { seasonTables, type TableKey } from '@/lib/reports/season-tables';
import { parseReportQuery } from '@/lib/schemas/reports';
import { PageHeader } from '@/components/ui/page-header';
import { SelectField, namedChoices } from '@/components/ui/select-field';
import { ReportTableView } from '@/components/reports/report-table';
import { SeasonBars, YardBars } from '@/components/reports/yield-charts';
import { SendReports } from '@/components/reports/send-reports';
import { seasonRecipientsAction, sendKeeperReportAction } from './actions';

export const metadata = { title: 'Yield reports' };

export default async function ReportsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requirePermission('reports.read', '/admin/reports');
  const filter = parseReportQuery(await searchParams);
  const [report, history, choices, settings] = await Promise.all([
    getSeasonReport(user, filter),
    getSeasonHistory(user, filter),
    reportFilterChoices(user),
    getSettings(),
  ]);
  if (!report || !history) notFound();
  const units = { weightSystem: settings.weightSystem, currency: settings.currency };
  const label = (season: number) => seasonLabel(season, settings.seasonStartMonth);
  const tables = seasonTables(report, units);
  const w = (g: number) => formatWeight(g, units.weightSystem);
  const unit = units.weightSystem === 'us' ? 'lb' : 'kg';
  const chartNumber = (g: number) => Math.round((units.weightSystem === 'us' ? gramsToLb(g) : gramsToKg(g)) * 10) / 10;

  const query = (extra: Record<string, string | number>) => {
    const q = new URLSearchParams();
    q.set('season', String(report.season));
    if (filter.yardId) q.set('yard', String(filter.yardId));
    if (filter.keeperId && user.role === 'owner') q.set('keeper', String(filter.keeperId));
    for (const [k, v] of Object.entries(extra)) q.set(k, String(v));
    return q.toString();
  };
  const csv = (table: TableKey) => `/api/reports/csv?${query({ table })}`;

  const byYard = new Map<string, { colony: string; honey: number }[]>();
  for (const c of report.colonies)
    byYard.set(c.yardName, [...(byYard.get(c.yardName) ?? []), { colony: c.code, honey: chartNumber(c.honeyGrams) }]);
  const historyYards = [...new Set(history.map((h) => h.yardName))];
  const historyData = [...new Set(history.map((h) => h.season))].map((season) => ({
    season: label(season),
    ...Object.fromEntries(
      historyYards.map((y) => [
        y,
        chartNumber(history.find((h) => h.season === season && h.yardName === y)?.honeyGrams ?? 0),
      ]),
    ),
  }));
  const keeperLinks = user.role === 'owner' ? choices.keepers : [{ id: user.id, name: user.name }];

  return (
    <>
      <PageHeader
        title={`Season ${label(report.season)} yield`}
        lead="Each lot's net weight is shared back to the supers that made it: by measured honey (full minus empty), or by an estimate from box depth and capped frames where a super was not weighed. Blends pass their weight back through their parent lots; revenue of sold jars is shared the same way."
      />
      <form method="get" className="mb-6 flex flex-wrap items-end gap-4 card" aria-label="Filter the report">
        <SelectField
          label="Season"
          name="season"
          defaultValue={report.season}
          options={(report.seasons.length ? report.seasons : [report.season]).map((s) => ({
            value: s,
            label: label(s),
          }))}
        />
        <SelectField
          label="Yard"
          name="yard"
          defaultValue={filter.yardId ?? ''}
          options={[{ value: '', label: 'All yards' }, ...namedChoices(choices.yards)]}
        />
        {user.role === 'owner' ? (
          <SelectField
            label="Keeper"
            name="keeper"
            defaultValue={filter.keeperId ?? ''}
            options={[{ value: '', label: 'All keepers' }, ...namedChoices(choices.keepers)]}
          />
        ) : null}
        <button type="submit" className="btn-secondary min-h-11">
          Show
        </button>
      </form>

      <dl className="mb-6 grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <div className="card">
          <dt className="hint">Honey traced to colonies</dt>
          <dd className="text-2xl font-semibold tabular-nums" data-testid="total-honey">
            {w(report.totals.honeyGrams)}
          </dd>
        </div>
        <div className="card">
          <dt className="hint">Revenue shared back</dt>
          <dd className="text-2xl font-semibold tabular-nums">
            {formatMoney(report.totals.revenueCents, units.currency)}
          </dd>
        </div>
        <div className="card">
          <dt className="hint">Colonies</dt>
          <dd className="text-2xl font-semibold tabular-nums">
            {report.colonies.length} <span className="text-base font-normal">({report.nothing.length} made none)</span>
          </dd>
        </div>
        <div className="card">
          <dt className="hint">Not traced to a super</dt>
          <dd className="text-2xl font-semibold tabular-nums">{w(report.totals.unattributedGrams)}</dd>
        </div>
      </dl>

      <div className="flex flex-col gap-8">
        <section aria-labelledby="charts" className="flex flex-col gap-3">
          <h2 id="charts">Honey per colony, by yard</h2>
          <div className="grid gap-4 xl:grid-cols-2">
            {[...byYard].map(([yard, data]) => (
              <YardBars key={yard} yard={yard} unit={unit} data={data} />
            ))}
          </div>
          {historyData.length > 0 ? <SeasonBars unit={unit} yards={historyYards} data={historyData} /> : null}
        </section>

        <ReportTableView table={tables.colonies} csvHref={csv('colonies')} empty="No colonies in this season." />
        <ReportTableView table={tables.yards} csvHref={csv('yards')} />
        {user.role === 'owner' ? <ReportTableView table={tables.keepers} csvHref={csv('keepers')} /> : null}
        <ReportTableView table={tables.lines} csvHref={csv('lines')} empty="No colony has a parent or splits." />
        <ReportTableView table={tables.nothing} csvHref={csv('nothing')} empty="Every colony made honey." />
        <ReportTableView table={tables.lots} csvHref={csv('lots')} empty="No lots in this season." />
        <ReportTableView table={tables.shares} csvHref={csv('shares')} folded />

        <section aria-labelledby="keeper-reports" className="flex flex-col gap-3 card">
          <h2 id="keeper-reports">Keeper reports</h2>
          <ul className="flex flex-wrap gap-2">
            {keeperLinks.map((k) => (
              <li key={k.id}>
                <a
                  className="btn-secondary min-h-11"
                  href={`/api/reports/keeper-pdf?keeper=${k.id}&season=${report.season}`}
                  download
                >
                  PDF: {k.name}
                </a>
              </li>
            ))}
          </ul>
          {can(user.role, 'reports.send') ? (
            <SendReports season={report.season} onList={seasonRecipientsAction} onSend={sendKeeperReportAction} />
          ) : null}
        </section>
      </div>
    </>
  );
}
