'use client';
import { useState } from 'react';
import Link from 'next/link';
import { formatMoney } from '@/lib/domain/units';
import { parcelWeightGrams, shippingCents, type ShippingBand } from '@/lib/domain/shipping';
import { FormMessage } from '@/components/ui/form-message';
import { useCart } from './use-cart';

type Props = { currency: string; bands: ShippingBand[]; pickupAddress: string; user: { name: string; email: string } | null };
type Errors = Record<string, string>;

export function CheckoutForm({ currency, bands, pickupAddress, user }: Props) {
  const { items, live, ready } = useCart();
  const [fulfilment, setFulfilment] = useState<'pickup' | 'ship'>('pickup');
  const [error, setError] = useState<string>();
  const [fieldErrors, setFieldErrors] = useState<Errors>({});
  const [busy, setBusy] = useState(false);
  const money = (c: number) => formatMoney(c, currency.toUpperCase());
  if (!ready) return <p className="text-ink-soft">Loading your cart…</p>;
  if (items.length === 0) return <p>Your cart is empty. <Link href="/products">Browse the jars</Link>.</p>;

  const priced = items.map((i) => ({ ...i, p: live?.get(i.productId) }));
  const subtotal = priced.reduce((s, i) => s + (i.p?.priceCents ?? i.priceCents) * i.quantity, 0);
  const weight = parcelWeightGrams(priced.map((i) => ({ quantity: i.quantity, netGrams: i.p?.netGrams ?? 0, containerGrams: i.p?.containerGrams ?? 0 })));
  const shipping = fulfilment === 'ship' ? shippingCents(weight, bands) : 0;

  async function submit(form: HTMLFormElement) {
    const f = new FormData(form);
    const s = (k: string) => String(f.get(k) ?? '');
    setBusy(true);
    setError(undefined);
    setFieldErrors({});
    try {
      const res = await fetch('/api/checkout', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({
          items: items.map((i) => ({ productId: i.productId, quantity: i.quantity })),
          name: s('name'), email: s('email'), phone: s('phone'), fulfilment,
          address: fulfilment === 'ship' ? { line1: s('line1'), line2: s('line2'), city: s('city'), region: s('region'), postalCode: s('postalCode'), country: s('country') } : undefined,
        }),
      });
      const body = (await res.json()) as { url?: string; error?: string; fieldErrors?: Errors };
      if (res.ok && body.url) {
        window.location.assign(body.url);
        return;
      }
      setError(body.error ?? 'Something went wrong. Please try again.');
      setFieldErrors(body.fieldErrors ?? {});
    } catch {
      setError('Could not reach the shop. Check your connection and try again.');
    }
    setBusy(false);
  }

  const field = (name: string, label: string, props: React.InputHTMLAttributes<HTMLInputElement> = {}) => (
    <label className="field" htmlFor={`co-${name}`}>
      <span>{label}</span>
      <input id={`co-${name}`} name={name} className="input" aria-invalid={fieldErrors[name] || fieldErrors[`address.${name}`] ? true : undefined} {...props} />
      {fieldErrors[name] || fieldErrors[`address.${name}`] ? <small className="field-error">{fieldErrors[name] ?? fieldErrors[`address.${name}`]}</small> : null}
    </label>
  );

  return (
    <form className="grid gap-8 md:grid-cols-[1fr_20rem]" onSubmit={(e) => { e.preventDefault(); void submit(e.currentTarget); }} noValidate>
      <div className="space-y-4">
        <FormMessage error={error} />
        <fieldset className="card space-y-3">
          <legend className="font-heading text-lg font-bold">You</legend>
          {field('name', 'Your name', { autoComplete: 'name', defaultValue: user?.name ?? '', required: true })}
          {field('email', 'E-mail', { type: 'email', autoComplete: 'email', defaultValue: user?.email ?? '', readOnly: Boolean(user), required: true })}
          {user ? null : <p className="hint">Checking out as a guest. <Link href="/sign-in?next=/checkout">Sign in</Link> or <Link href="/sign-up">make an account</Link> to see your orders later.</p>}
          {field('phone', 'Phone (optional)', { type: 'tel', autoComplete: 'tel', inputMode: 'tel' })}
        </fieldset>
        <fieldset className="card space-y-3">
          <legend className="font-heading text-lg font-bold">Pickup or delivery</legend>
          <label className="flex min-h-11 items-center gap-2"><input type="radio" name="fulfilment" checked={fulfilment === 'pickup'} onChange={() => setFulfilment('pickup')} /> Pick up at the honey house{pickupAddress ? ` (${pickupAddress})` : ''} — free</label>
          <label className="flex min-h-11 items-center gap-2"><input type="radio" name="fulfilment" checked={fulfilment === 'ship'} onChange={() => setFulfilment('ship')} /> Ship to me</label>
          {fulfilment === 'ship' ? (
            <div className="grid gap-3 sm:grid-cols-2">
              <div className="sm:col-span-2">{field('line1', 'Street and number', { autoComplete: 'address-line1' })}</div>
              <div className="sm:col-span-2">{field('line2', 'Address line 2 (optional)', { autoComplete: 'address-line2' })}</div>
              {field('city', 'Town or city', { autoComplete: 'address-level2' })}
              {field('region', 'State or region', { autoComplete: 'address-level1' })}
              {field('postalCode', 'Postal code', { autoComplete: 'postal-code' })}
              {field('country', 'Country', { autoComplete: 'country-name' })}
            </div>
          ) : null}
        </fieldset>
      </div>
      <aside className="card h-fit space-y-3" aria-label="Order summary">
        <h2 className="text-lg">Your order</h2>
        <ul className="space-y-1 text-sm">
          {priced.map((i) => <li key={i.productId} className="flex justify-between gap-2"><span>{i.quantity} × {i.p?.name ?? i.name}</span><span className="tabular-nums">{money((i.p?.priceCents ?? i.priceCents) * i.quantity)}</span></li>)}
          <li className="flex justify-between gap-2"><span>{fulfilment === 'ship' ? 'Shipping' : 'Pickup'}</span><span className="tabular-nums">{shipping === null ? 'too heavy to ship' : money(shipping)}</span></li>
        </ul>
        <p className="flex justify-between border-t border-line pt-2 font-semibold"><span>Total</span><span className="tabular-nums">{money(subtotal + (shipping ?? 0))}</span></p>
        <button type="submit" className="btn-primary w-full" disabled={busy || shipping === null}>{busy ? 'Reserving your jars…' : 'Pay by card'}</button>
        <p className="hint">Your jars are held for 30 minutes while you pay.</p>
      </aside>
    </form>
  );
}
