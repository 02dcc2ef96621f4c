import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { menuFor } from '@/lib/auth/roles';
import { PageHeader } from '@/components/ui/page-header';
import { Chip } from '@/components/ui/chip';
import { stockPastBestBefore } from '@/lib/data/stock/stock';

export const metadata = { title: 'Today' };

const BLURBS: Record<string, string> = {
  '/admin/yards': 'Yards, colonies and what went on and came off each hive.',
  '/admin/supers': 'Every super pulled this season, flagged ones first.',
  '/admin/lots': 'Extraction lots: weights, moisture, lab files, release.',
  '/admin/jarring': 'Fill jars from a released lot and print labels.',
  '/admin/stock': 'Jars on hand per product and lot, with the ledger.',
  '/admin/orders': 'Paid orders to pack, ship or hand over.',
  '/admin/reports': 'Honey and revenue shared back to each colony.',
  '/admin/trace': 'From a jar, lot or order to colonies and customers.',
  '/admin/products': 'Jar sizes for sale, prices and GTINs.',
  '/admin/staff': 'Accounts for keepers and the honey-house crew.',
  '/admin/settings': 'Business name, label details, limits and prices.',
};

export default async function AdminHome() {
  const user = await requirePermission('backoffice.enter');
  const items = menuFor(user.role).filter((m) => m.href !== '/admin');
  const past = user.role === 'owner' ? await stockPastBestBefore() : [];
  return (
    <>
      <PageHeader title={`Good day, ${user.name.split(' ')[0]}`} lead="Where would you like to start?" />
      {past.length > 0 ? (
        <section className="mb-6 card" aria-labelledby="past-bb-h">
          <h2 id="past-bb-h" className="text-lg">
            <Chip tone="bad">past best-before</Chip> Jars the shop no longer sells
          </h2>
          <p className="hint">
            These jars are past their best-before date, so checkout and orders skip them. Count them out on the{' '}
            <Link href="/admin/stock">Stock</Link> page.
          </p>
          <ul className="mt-2 text-sm">
            {past.map((r) => (
              <li key={`${r.lotCode}-${r.productName}`}>
                {r.onHand} × {r.productName}, lot {r.lotCode}, best before {r.bestBeforeOn}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <ul className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
        {items.map((m) => (
          <li key={m.href}>
            <Link href={m.href} className="block h-full card no-underline hover:border-forest-600">
              <h2 className="text-lg">{m.label}</h2>
              <p className="mt-1 text-sm text-ink-soft">{BLURBS[m.href]}</p>
            </Link>
          </li>
        ))}
      </ul>
    </>
  );
}
