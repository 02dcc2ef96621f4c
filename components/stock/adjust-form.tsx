'use client';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { stockAdjustInput, type StockAdjustInput } from '@/lib/schemas/jarring';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';

type Values = z.input<typeof stockAdjustInput>;
export type StockChoice = { productId: number; lotId: number; label: string };

/** Breakage, a counted adjustment or a return, for one product from one lot. */
export function AdjustForm({ choices, onAdjust }: { choices: StockChoice[]; onAdjust: (v: StockAdjustInput) => Promise<ActionResult<{ onHand: number }>> }) {
  const first = choices[0];
  const form = useForm<Values, unknown, z.output<typeof stockAdjustInput>>({
    resolver: zodResolver(stockAdjustInput),
    defaultValues: { productId: first?.productId ?? 0, lotId: first?.lotId ?? 0, kind: 'breakage', reason: '' },
  });
  const [msg, setMsg] = useState<{ error?: string; success?: string }>({});
  const e = form.formState.errors;
  const pick = `${form.watch('productId')}:${form.watch('lotId')}`;
  async function submit(values: z.output<typeof stockAdjustInput>) {
    const res = await onAdjust(values);
    if (res.ok) {
      form.reset({ ...values, delta: undefined, reason: '' } as Values);
      return setMsg({ success: `Saved. ${res.data.onHand} jars on hand.` });
    }
    for (const [name, message] of Object.entries(res.fieldErrors ?? {})) form.setError(name as keyof Values, { message });
    setMsg({ error: res.message });
  }
  if (!first) return <p className="hint">Nothing in stock yet.</p>;
  return (
    <form onSubmit={form.handleSubmit(submit)} className="space-y-4" noValidate aria-label="Adjust stock">
      <label className="field" htmlFor="stock-pick"><span>Product and lot</span>
        <select id="stock-pick" className="input" value={pick} onChange={(ev) => {
          const [p, l] = ev.target.value.split(':').map(Number);
          form.setValue('productId', p);
          form.setValue('lotId', l);
        }}>
          {choices.map((c) => <option key={`${c.productId}:${c.lotId}`} value={`${c.productId}:${c.lotId}`}>{c.label}</option>)}
        </select>
      </label>
      <label className="field" htmlFor="kind"><span>Kind</span>
        <select id="kind" className="input" {...form.register('kind')}>
          <option value="breakage">Breakage (−)</option>
          <option value="adjustment">Count adjustment (±)</option>
          <option value="return">Return (+)</option>
        </select>
      </label>
      <TextField label="Change in jars (− takes away)" registration={form.register('delta')} error={e.delta} inputMode="numeric" />
      <TextField label="Reason" registration={form.register('reason')} error={e.reason} />
      <FormMessage error={msg.error} success={msg.success} />
      <button type="submit" className="btn-secondary w-full" disabled={form.formState.isSubmitting}>Save change</button>
    </form>
  );
}
