'use client';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { lotDetailsInput, type LotDetailsInput } from '@/lib/schemas/lots';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useResult } from './use-result';

type Values = z.input<typeof lotDetailsInput>;

/** Floral source, heather, extraction date and notes, while the lot is still open (each change audited). */
export function LotDetailsForm({ defaults, suggestions, onSave }: { defaults: Values; suggestions: string[]; onSave: (v: LotDetailsInput) => Promise<ActionResult> }) {
  const form = useForm<Values, unknown, z.output<typeof lotDetailsInput>>({ resolver: zodResolver(lotDetailsInput), defaultValues: defaults });
  const { msg, setMsg, apply } = useResult(form);
  const e = form.formState.errors;
  async function submit(values: z.output<typeof lotDetailsInput>) {
    setMsg({});
    apply(await onSave(values), 'Details saved.');
  }
  return (
    <form onSubmit={form.handleSubmit(submit)} className="grid gap-3 sm:grid-cols-2" noValidate aria-label="Lot details">
      <TextField label="Floral source" registration={form.register('floralSource')} error={e.floralSource} list="floral-sources" autoComplete="off" />
      <datalist id="floral-sources">{suggestions.map((s) => <option key={s} value={s} />)}</datalist>
      <TextField label="Extraction date" type="date" registration={form.register('extractedOn')} error={e.extractedOn} />
      <label className="flex min-h-11 items-center gap-3 text-sm font-medium" htmlFor="heather">
        <input id="heather" type="checkbox" className="h-5 w-5" {...form.register('heather')} /> Heather honey (heather moisture limit)
      </label>
      <label className="field sm:col-span-2" htmlFor="notes"><span>Notes</span><textarea id="notes" rows={2} className="input" {...form.register('notes')} /></label>
      <div className="sm:col-span-2"><FormMessage error={msg.error} success={msg.success} /></div>
      <div><button type="submit" className="btn-secondary" disabled={form.formState.isSubmitting}>Save details</button></div>
    </form>
  );
}
