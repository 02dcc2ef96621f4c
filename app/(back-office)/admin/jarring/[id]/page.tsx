import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { getSettings } from '@/lib/data/settings/settings';
import { getJarringRun } from '@/lib/data/jarring/read';
import { listLabelLayouts } from '@/lib/data/labels/layouts';
import { labelPositions } from '@/lib/domain/label-layout';
import { formatWeight } from '@/lib/domain/units';
import { PageHeader } from '@/components/ui/page-header';
import { RunStatus } from '@/components/jarring/run-status';
import { OverrideForm } from '@/components/jarring/override-form';
import { LabelPreview } from '@/components/jarring/label-preview';
import { overrideJarringRunAction } from '../actions';

export const metadata = { title: 'Jarring run' };

export default async function JarringRunPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission('jarring.read', `/admin/jarring/${id}`);
  const run = /^\d{1,9}$/.test(id) ? await getJarringRun(user, Number(id)) : null;
  if (!run) notFound();
  const [settings, layouts] = await Promise.all([getSettings(), listLabelLayouts()]);
  const system = settings.weightSystem;
  return (
    <>
      <PageHeader
        title={`Jarring run #${run.id}`}
        lead={
          <>
            {run.jarCount} × {run.productName} from lot {run.lotCode} on {run.runOn}
            {run.byName ? ` by ${run.byName}` : ''}.
          </>
        }
        actions={
          <Link className="btn-secondary" href="/admin/jarring">
            All runs
          </Link>
        }
      />
      <div className="grid gap-6 xl:grid-cols-[22rem_1fr]">
        <section className={`space-y-3 card ${run.pass ? '' : 'border-2 border-bad-fg'}`} aria-labelledby="fill-h">
          <h2 id="fill-h">Fill check</h2>
          <p>
            <RunStatus pass={run.pass} overridden={!!run.overrideReason} />{' '}
            <span className="hint">
              {run.ruleSet === 'oiml'
                ? `EU rules (OIML R 87 / 76/211/EEC); the batch is the run’s ${run.jarCount} jars`
                : 'US rules (NIST Handbook 133); no EU reference test'}
            </span>
          </p>
          <ul className="space-y-2 text-sm" data-testid="fill-checks">
            {run.checks.map((c) => (
              <li key={c.name}>
                <strong>{c.name}:</strong> <span className={c.pass ? '' : 'text-bad-fg'}>{c.summary}</span>
                {!c.pass && c.reasons.length > 0 ? (
                  <ul className="ml-5 list-disc text-bad-fg">
                    {c.reasons.map((r) => (
                      <li key={r}>{r}</li>
                    ))}
                  </ul>
                ) : null}
              </li>
            ))}
          </ul>
          <dl className="grid grid-cols-2 gap-1 text-sm">
            <dt>Mean sample</dt>
            <dd className="num">{run.mean.toFixed(1)} g</dd>
            <dt>Samples</dt>
            <dd className="num">{run.samples.length}</dd>
            <dt>Honey used</dt>
            <dd className="num">{formatWeight(run.honeyUsedGrams, system)}</dd>
          </dl>
          <p className="text-xs text-ink-soft">Samples (net, g): {run.samples.join(', ')}</p>
          {run.overrideReason ? (
            <p className="text-sm">
              <strong>Owner’s override:</strong> {run.overrideReason}
            </p>
          ) : null}
          {!run.pass && !run.overrideReason && can(user.role, 'jarring.override') ? (
            <OverrideForm runId={run.id} onOverride={overrideJarringRunAction} />
          ) : null}
          {!run.pass && !run.overrideReason && !can(user.role, 'jarring.override') ? (
            <p className="text-sm">These jars stay out of stock until the owner reviews the run.</p>
          ) : null}
        </section>
        <section className="card" aria-labelledby="labels-h">
          <h2 id="labels-h" className="mb-3">
            Labels
          </h2>
          {can(user.role, 'labels.print') ? (
            <LabelPreview
              runId={run.id}
              jarCount={run.jarCount}
              layouts={layouts.map((o) => ({
                key: o.key,
                name: o.layout.name,
                roll: o.layout.paper === 'roll',
                slots: labelPositions(o.layout).slots.length,
              }))}
            />
          ) : (
            <p className="hint">The owner and the honey-house crew print labels.</p>
          )}
        </section>
      </div>
    </>
  );
}
