'use client';
import { useState, useTransition } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import type { RefundInput, ShipInput } from '@/lib/schemas/orders';
import { FormMessage } from '@/components/ui/form-message';

type IdAction = (v: { orderId: number }) => Promise<ActionResult>;
type Props = {
  order: { id: number; status: string; fulfilment: 'pickup' | 'ship'; paid: boolean; refundableCents: number; currencyDigits: number; currency: string };
  lines: { id: number; name: string; sold: number }[];
  canRefund: boolean;
  actions: { packed: IdAction; pickedUp: IdAction; cancel: IdAction; shipped: (v: ShipInput) => Promise<ActionResult>; refund: (v: RefundInput) => Promise<ActionResult> };
};

/** The order desk's buttons: only the steps that fit the order's state are offered. */
export function OrderDeskActions({ order, lines, canRefund, actions }: Props) {
  const [pending, start] = useTransition();
  const [error, setError] = useState<string>();
  const [done, setDone] = useState<string>();
  const run = (what: string, call: () => Promise<ActionResult>) =>
    start(async () => {
      setError(undefined);
      setDone(undefined);
      const r = await call();
      if (r.ok) setDone(what);
      else setError(r.message ?? 'That did not work.');
    });
  const id = order.id;
  const open = order.status === 'paid' || order.status === 'packed';
  const refundable = canRefund && order.paid && order.refundableCents > 0;
  const max = order.refundableCents / 10 ** order.currencyDigits;

  return (
    <div className="space-y-4">
      <FormMessage error={error} success={done} />
      <div className="flex flex-wrap gap-2">
        {order.status === 'paid' ? <button type="button" className="btn-primary" disabled={pending} onClick={() => run('Marked packed.', () => actions.packed({ orderId: id }))}>Mark packed</button> : null}
        {open && order.fulfilment === 'pickup' ? <button type="button" className="btn-secondary" disabled={pending} onClick={() => run('Marked picked up.', () => actions.pickedUp({ orderId: id }))}>Mark picked up</button> : null}
        {order.status === 'awaiting_payment' ? <button type="button" className="btn-danger" disabled={pending} onClick={() => { if (confirm('Cancel this unpaid order and put its jars back?')) run('Order cancelled; jars released.', () => actions.cancel({ orderId: id })); }}>Cancel unpaid order</button> : null}
      </div>
      {open && order.fulfilment === 'ship' ? (
        <form className="flex flex-wrap items-end gap-2" onSubmit={(e) => { e.preventDefault(); const tracking = String(new FormData(e.currentTarget).get('tracking') ?? ''); run('Marked shipped.', () => actions.shipped({ orderId: id, tracking })); }}>
          <label className="field grow" htmlFor="tracking"><span>Tracking (carrier and number)</span><input id="tracking" name="tracking" className="input" maxLength={200} /></label>
          <button type="submit" className="btn-secondary" disabled={pending}>Mark shipped</button>
        </form>
      ) : null}
      {refundable ? (
        <form
          className="card space-y-3"
          aria-label="Refund"
          onSubmit={(e) => {
            e.preventDefault();
            const f = new FormData(e.currentTarget);
            const amount = Number(String(f.get('amount') ?? '').replace(',', '.'));
            const jars = lines.map((l) => ({ lineId: l.id, quantity: Math.floor(Number(f.get(`jars-${l.id}`) || 0)) }));
            run('Refund sent.', () => actions.refund({ orderId: id, amount, jars, restock: f.get('restock') === 'yes', reason: String(f.get('reason') ?? '') }));
          }}
        >
          <h2 className="text-lg">Refund</h2>
          <label className="field" htmlFor="amount"><span>Amount ({order.currency.toUpperCase()}, at most {max.toFixed(order.currencyDigits)})</span>
            <input id="amount" name="amount" className="input w-40" inputMode="decimal" defaultValue={max.toFixed(order.currencyDigits)} required /></label>
          {lines.some((l) => l.sold > 0) ? (
            <fieldset className="space-y-2">
              <legend className="text-sm font-medium">Jars coming back</legend>
              {lines.filter((l) => l.sold > 0).map((l) => (
                <label key={l.id} className="flex items-center gap-2 text-sm" htmlFor={`jars-${l.id}`}>
                  <input id={`jars-${l.id}`} name={`jars-${l.id}`} className="input w-20" type="number" inputMode="numeric" min={0} max={l.sold} defaultValue={l.sold} />
                  of {l.sold} × {l.name}
                </label>
              ))}
              <div className="flex flex-wrap gap-4 text-sm">
                <label className="flex min-h-11 items-center gap-2"><input type="radio" name="restock" value="yes" defaultChecked /> Back to stock (sealed, fit to sell)</label>
                <label className="flex min-h-11 items-center gap-2"><input type="radio" name="restock" value="no" /> Write off (broken or opened)</label>
              </div>
            </fieldset>
          ) : <input type="hidden" name="restock" value="no" />}
          <label className="field" htmlFor="reason"><span>Reason (kept in the history)</span><input id="reason" name="reason" className="input" maxLength={500} /></label>
          <button type="submit" className="btn-danger" disabled={pending}>Refund to card</button>
        </form>
      ) : null}
    </div>
  );
}
