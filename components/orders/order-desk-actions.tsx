'use client';
import type { ActionResult } from '@/lib/schemas/result';
import { orderIdInput, refundFormInput, shipInput, type RefundInput, type ShipInput } from '@/lib/schemas/orders';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
import { newEntryKey } from '@/components/ui/entry-key';

type IdAction = (v: { orderId: number }) => Promise<ActionResult>;
type Props = {
  order: {
    id: number;
    status: string;
    fulfilment: 'pickup' | 'ship';
    paid: boolean;
    refundableCents: number;
    currencyDigits: number;
    currency: string;
  };
  lines: { id: number; name: string; sold: number }[];
  canRefund: boolean;
  actions: {
    packed: IdAction;
    pickedUp: IdAction;
    cancel: IdAction;
    shipped: (v: ShipInput) => Promise<ActionResult>;
    refund: (v: RefundInput) => Promise<ActionResult>;
  };
};

/** The order desk's buttons: only the steps that fit the order's state are offered. */
export function OrderDeskActions({ order, lines, canRefund, actions }: Props) {
  const id = order.id;
  const open = order.status === 'paid' || order.status === 'packed';
  const refundable = canRefund && order.paid && order.refundableCents > 0;
  const max = order.refundableCents / 10 ** order.currencyDigits;

  const pack = useActionForm({ schema: orderIdInput, action: actions.packed, successMessage: 'Marked packed.' });
  const pickUp = useActionForm({ schema: orderIdInput, action: actions.pickedUp, successMessage: 'Marked picked up.' });
  const cancel = useActionForm({
    schema: orderIdInput,
    action: actions.cancel,
    successMessage: 'Order cancelled; jars released.',
  });
  const ship = useActionForm({
    schema: shipInput,
    action: actions.shipped,
    defaultValues: { orderId: id, tracking: '' },
    successMessage: 'Marked shipped.',
  });
  const refund = useActionForm({
    schema: refundFormInput,
    action: actions.refund,
    // Every sold jar comes back, to the shelf, unless changed; lines with none sold stay at 0.
    defaultValues: {
      orderId: id,
      amount: max.toFixed(order.currencyDigits),
      jars: lines.map((l) => ({ lineId: l.id, quantity: l.sold })),
      restock: lines.some((l) => l.sold > 0),
      reason: '',
      // One key per refund form shown: a double click or a retry is the same refund, never a second one.
      requestKey: newEntryKey(),
    },
    successMessage: 'Refund sent.',
    onSuccess: (): void => refund.form.setValue('requestKey', newEntryKey()),
  });

  // The steps share one message and one pending state: starting one clears what another said.
  const steps = [pack, pickUp, cancel, ship, refund];
  const pending = steps.some((s) => s.pending);
  const message = steps.find((s) => s.message.error || s.message.success)?.message ?? {};
  const only = (step: (typeof steps)[number]) => {
    for (const s of steps) if (s !== step) s.setMessage({});
  };
  const restock = refund.form.watch('restock');

  return (
    <div className="space-y-4">
      <FormMessage {...message} />
      <div className="flex flex-wrap gap-2">
        {order.status === 'paid' ? (
          <button
            type="button"
            className="btn-primary"
            disabled={pending}
            onClick={() => {
              only(pack);
              void pack.run({ orderId: id });
            }}
          >
            Mark packed
          </button>
        ) : null}
        {open && order.fulfilment === 'pickup' ? (
          <button
            type="button"
            className="btn-secondary"
            disabled={pending}
            onClick={() => {
              only(pickUp);
              void pickUp.run({ orderId: id });
            }}
          >
            Mark picked up
          </button>
        ) : null}
        {order.status === 'awaiting_payment' ? (
          <button
            type="button"
            className="btn-danger"
            disabled={pending}
            onClick={() => {
              if (confirm('Cancel this unpaid order and put its jars back?')) {
                only(cancel);
                void cancel.run({ orderId: id });
              }
            }}
          >
            Cancel unpaid order
          </button>
        ) : null}
      </div>
      {open && order.fulfilment === 'ship' ? (
        <form
          className="flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            only(ship);
            void ship.submit(e);
          }}
        >
          <label className="field grow" htmlFor="tracking">
            <span>Tracking (carrier and number)</span>
            <input
              id="tracking"
              className="input"
              maxLength={200}
              aria-invalid={ship.errors.tracking ? true : undefined}
              {...ship.form.register('tracking')}
            />
            {ship.errors.tracking?.message ? (
              <small className="field-error" role="alert">
                {ship.errors.tracking.message}
              </small>
            ) : null}
          </label>
          <button type="submit" className="btn-secondary" disabled={pending}>
            Mark shipped
          </button>
        </form>
      ) : null}
      {refundable ? (
        <form
          className="space-y-3 card"
          aria-label="Refund"
          onSubmit={(e) => {
            only(refund);
            void refund.submit(e);
          }}
        >
          <h2 className="text-lg">Refund</h2>
          <label className="field" htmlFor="amount">
            <span>
              Amount ({order.currency.toUpperCase()}, at most {max.toFixed(order.currencyDigits)})
            </span>
            <input
              id="amount"
              className="input w-40"
              inputMode="decimal"
              required
              aria-invalid={refund.errors.amount ? true : undefined}
              {...refund.form.register('amount')}
            />
            {refund.errors.amount?.message ? (
              <small className="field-error" role="alert">
                {refund.errors.amount.message}
              </small>
            ) : null}
          </label>
          {lines.some((l) => l.sold > 0) ? (
            <fieldset className="space-y-2">
              <legend className="text-sm font-medium">Jars coming back</legend>
              {lines.map((l, i) =>
                l.sold > 0 ? (
                  <label key={l.id} className="flex items-center gap-2 text-sm" htmlFor={`jars-${l.id}`}>
                    <input
                      id={`jars-${l.id}`}
                      className="input w-20"
                      type="number"
                      inputMode="numeric"
                      min={0}
                      max={l.sold}
                      {...refund.form.register(`jars.${i}.quantity`, { setValueAs: (v) => Math.floor(Number(v || 0)) })}
                    />
                    of {l.sold} × {l.name}
                  </label>
                ) : null,
              )}
              <div className="flex flex-wrap gap-4 text-sm">
                <label className="flex min-h-11 items-center gap-2">
                  <input
                    type="radio"
                    name="restock"
                    checked={restock}
                    onChange={() => refund.form.setValue('restock', true)}
                  />{' '}
                  Back to stock (sealed, fit to sell)
                </label>
                <label className="flex min-h-11 items-center gap-2">
                  <input
                    type="radio"
                    name="restock"
                    checked={!restock}
                    onChange={() => refund.form.setValue('restock', false)}
                  />{' '}
                  Write off (broken or opened)
                </label>
              </div>
            </fieldset>
          ) : null}
          <label className="field" htmlFor="reason">
            <span>Reason (kept in the history)</span>
            <input
              id="reason"
              className="input"
              maxLength={500}
              aria-invalid={refund.errors.reason ? true : undefined}
              {...refund.form.register('reason')}
            />
            {refund.errors.reason?.message ? (
              <small className="field-error" role="alert">
                {refund.errors.reason.message}
              </small>
            ) : null}
          </label>
          <button type="submit" className="btn-danger" disabled={pending}>
            Refund to card
          </button>
        </form>
      ) : null}
    </div>
  );
}
