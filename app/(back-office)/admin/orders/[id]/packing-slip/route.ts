import { authorize } from '@/lib/auth/session';
import { handleRouteError, HttpError } from '@/lib/http/json';
import { getOrderDetail } from '@/lib/data/orders/read';
import { getSettings } from '@/lib/data/settings/settings';
import { renderTableReport } from '@/lib/pdf/table-report';
import { pdfResponse } from '@/lib/pdf/response';
import { formatDateTime } from '@/lib/domain/order-dates';

export const dynamic = 'force-dynamic';

/** A packing slip: what goes in the box, jar by jar with lot codes, so a recall can find this customer. */
export async function GET(_req: Request, ctx: { params: Promise<{ id: string }> }): Promise<Response> {
  try {
    await authorize('orders.desk');
    const id = Number((await ctx.params).id);
    const order = Number.isInteger(id) && id > 0 ? await getOrderDetail(id) : null;
    if (!order) throw new HttpError(404, 'No such order.');
    const settings = await getSettings();
    const a = order.shippingAddress;
    const rows = order.lines.flatMap((l) =>
      l.lots.filter((x) => x.state === 'sold').map((x) => [l.productName, x.code, String(x.quantity), '']),
    );
    const bytes = await renderTableReport({
      title: `Packing slip — order ${order.number}`,
      subtitle: `${settings.businessName} · placed ${formatDateTime(order.createdAt, settings.timeZone)}`,
      sections: [
        {
          heading: order.fulfilment === 'ship' ? 'Ship to' : 'Pickup at the honey house',
          columns: ['Customer', 'Contact', 'Address'],
          rows: [
            [
              order.name,
              [order.email, order.phone].filter(Boolean).join(' · '),
              a ? [a.line1, a.line2, a.city, a.region, a.postalCode, a.country].filter(Boolean).join(', ') : '—',
            ],
          ],
        },
        {
          heading: 'Jars',
          columns: ['Product', 'Lot code', 'Jars', 'Packed'],
          rows: rows.length ? rows : [['Nothing to pack', '', '', '']],
          note: 'Pack jars from the lots listed; a different lot means a different trace.',
        },
      ],
      footer: `${order.number} · Honey is not for infants under 12 months.`,
    });
    return pdfResponse(bytes, `packing-slip-${order.number}.pdf`);
  } catch (err) {
    return handleRouteError(err);
  }
}
