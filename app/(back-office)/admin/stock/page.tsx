import { requirePermission } from '@/lib/auth/session';
import { can } from '@/lib/auth/roles';
import { listLedger, listStockLevels, stockTotals } from '@/lib/data/stock/stock';
import { queryRecord } from '@/lib/schemas/list-query';
import { ledgerListQuery } from '@/lib/schemas/stock';
import { getSettings } from '@/lib/data/settings/settings';
import { todayIn } from '@/lib/domain/local-date';
import { PageHeader } from '@/components/ui/page-header';
import { Chip } from '@/components/ui/chip';
import { AdjustForm } from '@/components/stock/adjust-form';
import { LedgerTable } from '@/components/stock/ledger-table';
import { adjustStockAction } from './actions';
import { TableHead, EmptyRow, num } from '@/components/ui/table-parts';

export const metadata = { title: 'Stock' };

/** Whole calendar months from today's month to the best-before month (the business's today). */
function monthsUntil(iso: string, today: string): number {
  const [y, m] = iso.split('-').map(Number);
  const [ty, tm] = today.split('-').map(Number);
  return (y - ty) * 12 + (m - tm);
}

function BestBefore({ iso, today }: { iso: string; today: string }) {
  const months = monthsUntil(iso, today);
  return (
    <span className="whitespace-nowrap">
      {iso} {iso < today ? <Chip tone="bad">past</Chip> : months < 3 ? <Chip tone="warn">soon</Chip> : null}
    </span>
  );
}

export default async function StockPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requirePermission('stock.read', '/admin/stock');
  const today = todayIn((await getSettings()).timeZone);
  const parsed = ledgerListQuery.safeParse(queryRecord(await searchParams));
  const query = parsed.success ? parsed.data : ledgerListQuery.parse({});
  const [totals, levels, ledger] = await Promise.all([
    stockTotals(user),
    listStockLevels(user),
    listLedger(user, query),
  ]);
  const filters = Object.fromEntries(
    Object.entries({ productId: query.productId, lotId: query.lotId })
      .filter(([, v]) => v !== undefined)
      .map(([k, v]) => [k, String(v)]),
  );
  return (
    <>
      <PageHeader
        title="Stock"
        lead="Jars on hand per product and per lot. Every change is a line in the ledger below."
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <div className="space-y-6">
          <section className="overflow-x-auto card p-0" aria-labelledby="totals-h">
            <h2 id="totals-h" className="px-4 pt-4">
              Per product
            </h2>
            <table className="data-table" data-testid="stock-totals">
              <TableHead
                columns={[
                  'Product',
                  num('On hand'),
                  num('Reserved'),
                  num('Available'),
                  num('Lots'),
                  'Earliest best-before',
                ]}
              />
              <tbody>
                {totals.map((t) => (
                  <tr key={t.productId}>
                    <td>{t.productName}</td>
                    <td className="num">{t.onHand}</td>
                    <td className="num">{t.reserved}</td>
                    <td className="num">{t.available}</td>
                    <td className="num">{t.lots}</td>
                    <td>{t.earliestBestBefore ? <BestBefore iso={t.earliestBestBefore} today={today} /> : '—'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </section>
          <section className="overflow-x-auto card p-0" aria-labelledby="lots-h">
            <h2 id="lots-h" className="px-4 pt-4">
              Per lot
            </h2>
            <table className="data-table">
              <TableHead columns={['Product', 'Lot', num('On hand'), num('Reserved'), 'Best before']} />
              <tbody>
                {levels.length === 0 ? <EmptyRow columns={5}>No stock yet.</EmptyRow> : null}
                {levels.map((l) => (
                  <tr key={`${l.productId}:${l.lotId}`}>
                    <td>{l.productName}</td>
                    <td>{l.lotCode}</td>
                    <td className="num">{l.onHand}</td>
                    <td className="num">{l.reserved}</td>
                    <td>
                      <BestBefore iso={l.bestBeforeOn} today={today} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </section>
          <section aria-labelledby="ledger-h">
            <h2 id="ledger-h" className="mb-2">
              Ledger
            </h2>
            <LedgerTable
              initial={ledger}
              filters={filters}
              initialSort={{ id: query.sort, desc: query.dir === 'desc' }}
            />
          </section>
        </div>
        {can(user.role, 'stock.adjust') ? (
          <section className="h-fit card" aria-labelledby="adjust-h">
            <h2 id="adjust-h" className="mb-3">
              Breakage, count, return
            </h2>
            <AdjustForm
              choices={levels.map((l) => ({
                productId: l.productId,
                lotId: l.lotId,
                label: `${l.productName} · ${l.lotCode} (${l.onHand} on hand)`,
              }))}
              onAdjust={adjustStockAction}
            />
          </section>
        ) : null}
      </div>
    </>
  );
}
