import { formatMoney } from '@/lib/domain/units';
import type { OrderDetail } from '@/lib/data/orders/read';
import { TableHead, num } from '@/components/ui/table-parts';

/** Words for an allocation's state; "held" is a lot stage, so a reservation says "reserved". */
export const ALLOCATION_WORDS: Record<string, string> = {
  reserved: 'reserved',
  sold: '',
  returned: 'returned',
  written_off: 'written off',
};

/** The order's lines with the lot codes that fill them (a recall reaches the customer through these). */
export function OrderLines({ order }: { order: OrderDetail }) {
  const money = (c: number) => formatMoney(c, order.currency.toUpperCase());
  return (
    <table className="data-table">
      <TableHead columns={['Jar', num('Jars'), 'Lot codes', num('Amount')]} />
      <tbody>
        {order.lines.map((l) => (
          <tr key={l.id}>
            <td>
              {l.productName}
              <div className="hint">{money(l.unitPriceCents)} each</div>
            </td>
            <td className="num">{l.quantity}</td>
            <td>
              {l.lots.length ? (
                <ul>
                  {l.lots.map((a, i) => (
                    <li key={i}>
                      <span className="font-mono">{a.code}</span> × {a.quantity}
                      {ALLOCATION_WORDS[a.state] ? ` (${ALLOCATION_WORDS[a.state]})` : ''}
                    </li>
                  ))}
                </ul>
              ) : (
                '—'
              )}
            </td>
            <td className="num">{money(l.quantity * l.unitPriceCents)}</td>
          </tr>
        ))}
      </tbody>
      <tfoot>
        {order.shippingCents > 0 ? (
          <tr>
            <th scope="row" colSpan={3}>
              Shipping
            </th>
            <td className="num">{money(order.shippingCents)}</td>
          </tr>
        ) : null}
        <tr>
          <th scope="row" colSpan={3}>
            Total
          </th>
          <td className="num font-semibold">{money(order.totalCents)}</td>
        </tr>
        {order.refundedCents > 0 ? (
          <tr>
            <th scope="row" colSpan={3}>
              Refunded
            </th>
            <td className="num">−{money(order.refundedCents)}</td>
          </tr>
        ) : null}
      </tfoot>
    </table>
  );
}
