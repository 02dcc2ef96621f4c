import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { getSettings } from '@/lib/data/settings/settings';
import { listJarrableLots, listJarringRuns } from '@/lib/data/jarring/read';
import { listProducts } from '@/lib/data/products/products';
import { nominalGrams } from '@/lib/domain/fill-check';
import { formatWeight } from '@/lib/domain/units';
import { declareNetQuantity } from '@/lib/domain/net-quantity';
import { PageHeader } from '@/components/ui/page-header';
import { Caution, INFANT_CAUTION } from '@/components/ui/caution';
import { RunForm } from '@/components/jarring/run-form';
import { RunsTable } from '@/components/jarring/runs-table';
import { jarringRunListQuery } from '@/lib/schemas/jarring';
import { createJarringRunAction } from './actions';

export const metadata = { title: 'Jarring' };

function todayIn(timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(
    new Date(),
  );
}

export default async function JarringPage() {
  const user = await requirePermission('jarring.read', '/admin/jarring');
  const query = jarringRunListQuery.parse({});
  const [settings, lots, products, runs] = await Promise.all([
    getSettings(),
    listJarrableLots(),
    listProducts({ activeOnly: true }),
    listJarringRuns(user, query),
  ]);
  const system = settings.weightSystem;
  const writer = can(user.role, 'jarring.write');
  return (
    <>
      <PageHeader
        title="Jarring"
        lead="Fill jars from a released lot, weigh samples, and the fill check decides whether the jars go into stock."
        actions={
          can(user.role, 'labels.layouts') ? (
            <Link className="btn-secondary" href="/admin/labels">
              Label layouts
            </Link>
          ) : null
        }
      />
      <section className="mb-6 overflow-x-auto card p-0" aria-labelledby="lots-h">
        <h2 id="lots-h" className="px-4 pt-4">
          What the released lots can still fill
        </h2>
        <p className="px-4 hint">Jars after the expected loss of {settings.expectedLossPct} % (Settings).</p>
        <table className="data-table">
          <thead>
            <tr>
              <th scope="col">Lot</th>
              <th scope="col">Floral source</th>
              <th scope="col" className="num">
                Honey left
              </th>
              {products.map((p) => (
                <th key={p.id} scope="col" className="num">
                  {p.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {lots.length === 0 ? (
              <tr>
                <td colSpan={3 + products.length} className="hint">
                  No released lot has honey left.
                </td>
              </tr>
            ) : null}
            {lots.map((l) => (
              <tr key={l.id}>
                <td className="whitespace-nowrap">{l.code}</td>
                <td>{l.floralSource}</td>
                <td className="num whitespace-nowrap">{formatWeight(l.remainingGrams, system)}</td>
                {l.jars.map((j) => (
                  <td key={j.productId} className="num">
                    {j.jars}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      {writer ? (
        <section className="mb-6 card" aria-labelledby="run-h">
          <h2 id="run-h" className="mb-1">
            New jarring run
          </h2>
          <p className="mb-4 hint">
            Fill check:{' '}
            {settings.fillRuleSet === 'oiml'
              ? 'tolerable negative error (OIML R 87 / EU 76/211/EEC)'
              : 'US average and MAV (NIST Handbook 133)'}
            .
          </p>
          <RunForm
            lots={lots
              .filter((l) => l.remainingGrams > 0)
              .map((l) => ({
                id: l.id,
                code: l.code,
                floralSource: l.floralSource,
                remainingText: formatWeight(l.remainingGrams, system),
                jars: l.jars,
              }))}
            products={products.map((p) => ({
              id: p.id,
              name: p.name,
              containerGrams: p.containerGrams,
              nominalGrams: nominalGrams(p),
              netText: declareNetQuantity(p, settings.labelDeclaration),
            }))}
            ruleSet={settings.fillRuleSet}
            today={todayIn(settings.timeZone)}
            onSave={createJarringRunAction}
          />
          <div className="mt-4">
            <Caution title="Glass and food safety">
              Hot jars and broken glass cut: wear gloves, check every jar for chips. Labels carry “{INFANT_CAUTION}”
              Follow your local food, labelling and weights-and-measures law; Combtrace records and warns, it does not
              certify.
            </Caution>
          </div>
        </section>
      ) : null}
      <section aria-labelledby="runs-h">
        <h2 id="runs-h" className="mb-2">
          Recent runs
        </h2>
        <RunsTable initial={runs} system={system} initialSort={{ id: query.sort, desc: query.dir === 'desc' }} />
      </section>
    </>
  );
}
