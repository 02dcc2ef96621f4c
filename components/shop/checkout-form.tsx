'use client';
import { useState } from 'react';
import Link from 'next/link';
import { formatMoney } from '@/lib/domain/units';
import { parcelWeightGrams, shippingCents, type ShippingBand } from '@/lib/domain/shipping';
import { checkoutInput } from '@/lib/schemas/checkout';
import type { ActionResult } from '@/lib/schemas/result';
import { FormMessage } from '@/components/ui/form-message';
import { TextField } from '@/components/ui/text-field';
import { useActionForm } from '@/components/ui/use-action-form';
import { postForm } from '@/components/ui/post-form';
import { useCart } from './use-cart';

type Props = {
  currency: string;
  bands: ShippingBand[];
  pickupAddress: string;
  user: { name: string; email: string } | null;
};
type Started = { url: string; number: string };

export function CheckoutForm({ currency, bands, pickupAddress, user }: Props) {
  const { items, live, ready } = useCart();
  // Once the jars are reserved the browser leaves for the card page; the button stays busy until it does.
  const [leaving, setLeaving] = useState(false);
  const { form, field, submit, pending, errors, message } = useActionForm({
    schema: checkoutInput,
    defaultValues: { items: [], name: user?.name ?? '', email: user?.email ?? '', phone: '', fulfilment: 'pickup' },
    action: async (v): Promise<ActionResult<Started>> => {
      try {
        return await postForm<Started>(
          '/api/checkout',
          { ...v, address: v.fulfilment === 'ship' ? v.address : undefined },
          () => 'Something went wrong. Please try again.',
        );
      } catch {
        return { ok: false, message: 'Could not reach the shop. Check your connection and try again.' };
      }
    },
    onSuccess: ({ url }) => {
      setLeaving(true);
      window.location.assign(url);
    },
  });
  const fulfilment = form.watch('fulfilment');
  const money = (c: number) => formatMoney(c, currency.toUpperCase());
  if (!ready) return <p className="text-ink-soft">Loading your cart…</p>;
  if (items.length === 0)
    return (
      <p>
        Your cart is empty. <Link href="/products">Browse the jars</Link>.
      </p>
    );

  const priced = items.map((i) => ({ ...i, p: live?.get(i.productId) }));
  const subtotal = priced.reduce((s, i) => s + (i.p?.priceCents ?? i.priceCents) * i.quantity, 0);
  const weight = parcelWeightGrams(
    priced.map((i) => ({
      quantity: i.quantity,
      netGrams: i.p?.netGrams ?? 0,
      containerGrams: i.p?.containerGrams ?? 0,
    })),
  );
  const shipping = fulfilment === 'ship' ? shippingCents(weight, bands) : 0;
  const busy = pending || leaving;
  // The cart is no field of its own: a refused line (e.g. too many jars) is said in the form's message.
  const cartError =
    errors.items?.message ??
    (Array.isArray(errors.items) ? errors.items.find((e) => e?.quantity)?.quantity?.message : undefined);

  return (
    <form
      className="grid gap-8 md:grid-cols-[1fr_20rem]"
      onSubmit={(e) => {
        form.setValue(
          'items',
          items.map((i) => ({ productId: i.productId, quantity: i.quantity })),
        );
        void submit(e);
      }}
      noValidate
    >
      <div className="space-y-4">
        <FormMessage error={message.error ?? cartError} />
        <fieldset className="space-y-3 card">
          <legend className="font-heading text-lg font-bold">You</legend>
          <TextField id="co-name" label="Your name" {...field('name')} autoComplete="name" required />
          <TextField
            id="co-email"
            label="E-mail"
            {...field('email')}
            type="email"
            autoComplete="email"
            readOnly={Boolean(user)}
            required
          />
          {user ? null : (
            <p className="hint">
              Checking out as a guest. <Link href="/sign-in?next=/checkout">Sign in</Link> or{' '}
              <Link href="/sign-up">make an account</Link> to see your orders later.
            </p>
          )}
          <TextField
            id="co-phone"
            label="Phone (optional)"
            {...field('phone')}
            type="tel"
            autoComplete="tel"
            inputMode="tel"
          />
        </fieldset>
        <fieldset className="space-y-3 card">
          <legend className="font-heading text-lg font-bold">Pickup or delivery</legend>
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" value="pickup" {...form.register('fulfilment')} /> Pick up at the honey house
            {pickupAddress ? ` (${pickupAddress})` : ''} — free
          </label>
          <label className="flex min-h-11 items-center gap-2">
            <input type="radio" value="ship" {...form.register('fulfilment')} /> Ship to me
          </label>
          {fulfilment === 'ship' ? (
            <div className="grid gap-3 sm:grid-cols-2">
              <div className="sm:col-span-2">
                <TextField
                  id="co-line1"
                  label="Street and number"
                  {...field('address.line1')}
                  autoComplete="address-line1"
                />
              </div>
              <div className="sm:col-span-2">
                <TextField
                  id="co-line2"
                  label="Address line 2 (optional)"
                  {...field('address.line2')}
                  autoComplete="address-line2"
                />
              </div>
              <TextField id="co-city" label="Town or city" {...field('address.city')} autoComplete="address-level2" />
              <TextField
                id="co-region"
                label="State or region"
                {...field('address.region')}
                autoComplete="address-level1"
              />
              <TextField
                id="co-postalCode"
                label="Postal code"
                {...field('address.postalCode')}
                autoComplete="postal-code"
              />
              <TextField id="co-country" label="Country" {...field('address.country')} autoComplete="country-name" />
            </div>
          ) : null}
        </fieldset>
      </div>
      <aside className="h-fit space-y-3 card" aria-label="Order summary">
        <h2 className="text-lg">Your order</h2>
        <ul className="space-y-1 text-sm">
          {priced.map((i) => (
            <li key={i.productId} className="flex justify-between gap-2">
              <span>
                {i.quantity} × {i.p?.name ?? i.name}
              </span>
              <span className="tabular-nums">{money((i.p?.priceCents ?? i.priceCents) * i.quantity)}</span>
            </li>
          ))}
          <li className="flex justify-between gap-2">
            <span>{fulfilment === 'ship' ? 'Shipping' : 'Pickup'}</span>
            <span className="tabular-nums">{shipping === null ? 'too heavy to ship' : money(shipping)}</span>
          </li>
        </ul>
        <p className="flex justify-between border-t border-line pt-2 font-semibold">
          <span>Total</span>
          <span className="tabular-nums">{money(subtotal + (shipping ?? 0))}</span>
        </p>
        <button type="submit" className="btn-primary w-full" disabled={busy || shipping === null}>
          {busy ? 'Reserving your jars…' : 'Pay by card'}
        </button>
        <p className="hint">Your jars are held for 30 minutes while you pay.</p>
      </aside>
    </form>
  );
}
