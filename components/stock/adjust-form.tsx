'use client';
import { stockAdjustInput, type StockAdjustInput } from '@/lib/schemas/stock';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

export type StockChoice = { productId: number; lotId: number; label: string };

/** Breakage, a counted adjustment or a return, for one product from one lot. */
export function AdjustForm({
  choices,
  onAdjust,
}: {
  choices: StockChoice[];
  onAdjust: (v: StockAdjustInput) => Promise<ActionResult<{ onHand: number }>>;
}) {
  const first = choices[0];
  const { form, field, submit, pending, message } = useActionForm({
    schema: stockAdjustInput,
    action: onAdjust,
    defaultValues: { productId: first?.productId ?? 0, lotId: first?.lotId ?? 0, kind: 'breakage', reason: '' },
    successMessage: (level) => `Saved. ${level.onHand} jars on hand.`,
    resetOnSuccess: (typed) => ({ ...typed, delta: undefined, reason: '' }),
  });
  const pick = `${form.watch('productId')}:${form.watch('lotId')}`;
  if (!first) return <p className="hint">Nothing in stock yet.</p>;
  return (
    <form onSubmit={submit} className="space-y-4" noValidate aria-label="Adjust stock">
      <label className="field" htmlFor="stock-pick">
        <span>Product and lot</span>
        <select
          id="stock-pick"
          className="input"
          value={pick}
          onChange={(ev) => {
            const [p, l] = ev.target.value.split(':').map(Number);
            form.setValue('productId', p);
            form.setValue('lotId', l);
          }}
        >
          {choices.map((c) => (
            <option key={`${c.productId}:${c.lotId}`} value={`${c.productId}:${c.lotId}`}>
              {c.label}
            </option>
          ))}
        </select>
      </label>
      <label className="field" htmlFor="kind">
        <span>Kind</span>
        <select id="kind" className="input" {...form.register('kind')}>
          <option value="breakage">Breakage (−)</option>
          <option value="adjustment">Count adjustment (±)</option>
          <option value="return">Return (+)</option>
        </select>
      </label>
      <TextField label="Change in jars (− takes away)" {...field('delta')} inputMode="numeric" />
      <TextField label="Reason" {...field('reason')} />
      <FormMessage {...message} />
      <button type="submit" className="btn-secondary w-full" disabled={pending}>
        Save change
      </button>
    </form>
  );
}
