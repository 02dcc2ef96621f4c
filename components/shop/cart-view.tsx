'use client';
import Link from 'next/link';
import { formatMoney } from '@/lib/domain/units';
import { writeCart } from './cart-store';
import { useCart } from './use-cart';
import { TableHead, num } from '@/components/ui/table-parts';

export function CartView({ currency, cancelled }: { currency: string; cancelled: boolean }) {
  const { items, live, ready } = useCart();
  const money = (c: number) => formatMoney(c, currency.toUpperCase());
  if (!ready) return <p className="text-ink-soft">Loading your cart…</p>;
  const notice = cancelled ? (
    <p role="status" className="mb-4 rounded-lg bg-info-bg px-3 py-2 text-sm text-info-fg">
      Payment cancelled. Your jars are back on the shelf; your cart is as you left it.
    </p>
  ) : null;
  if (items.length === 0)
    return (
      <>
        {notice}
        <p>
          Your cart is empty. <Link href="/products">Browse the jars</Link>.
        </p>
      </>
    );
  const setQty = (productId: number, quantity: number) =>
    writeCart(items.map((i) => (i.productId === productId ? { ...i, quantity } : i)));
  const total = items.reduce((sum, i) => sum + (live?.get(i.productId)?.priceCents ?? i.priceCents) * i.quantity, 0);
  return (
    <div className="space-y-4">
      {notice}
      <table className="data-table">
        <TableHead columns={['Jar', num('Price'), 'Jars', num('Amount'), { label: 'Remove', hidden: true }]} />
        <tbody>
          {items.map((i) => {
            const p = live?.get(i.productId);
            const price = p?.priceCents ?? i.priceCents;
            const warn =
              live && !p
                ? 'No longer sold'
                : p && p.available <= 0
                  ? 'Sold out'
                  : p && p.available < i.quantity
                    ? `Only ${p.available} left`
                    : null;
            return (
              <tr key={i.productId}>
                <td>
                  <Link href={`/products/${i.slug}`}>{p?.name ?? i.name}</Link>
                  {warn ? <div className="field-error">{warn}</div> : null}
                </td>
                <td className="num">{money(price)}</td>
                <td>
                  <label className="sr-only" htmlFor={`cart-qty-${i.productId}`}>
                    Jars of {i.name}
                  </label>
                  <input
                    id={`cart-qty-${i.productId}`}
                    className="input w-20"
                    type="number"
                    inputMode="numeric"
                    min={1}
                    max={48}
                    value={i.quantity}
                    onChange={(e) =>
                      setQty(i.productId, Math.max(1, Math.min(48, Math.floor(Number(e.target.value) || 1))))
                    }
                  />
                </td>
                <td className="num">{money(price * i.quantity)}</td>
                <td>
                  <button type="button" className="btn-quiet" onClick={() => setQty(i.productId, 0)}>
                    Remove
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
        <tfoot>
          <tr>
            <th scope="row" colSpan={3}>
              Jars total
            </th>
            <td className="num font-semibold">{money(total)}</td>
            <td />
          </tr>
        </tfoot>
      </table>
      <p className="hint">Prices and stock are checked again when you check out. Shipping is added there.</p>
      <Link href="/checkout" className="btn-primary no-underline">
        Check out
      </Link>
    </div>
  );
}
