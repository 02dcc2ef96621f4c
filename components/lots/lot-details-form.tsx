'use client';
import { useEffect } from 'react';
import { lotDetailsInput, type LotDetailsInput } from '@/lib/schemas/lots';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

/** Floral source, heather, extraction date and notes, while the lot is still open (each change audited). */
export function LotDetailsForm({
  defaults,
  suggestions,
  onSave,
}: {
  defaults: LotDetailsInput;
  suggestions: string[];
  onSave: (v: LotDetailsInput) => Promise<ActionResult>;
}) {
  const {
    form,
    submit,
    pending,
    errors: e,
    message,
  } = useActionForm({
    schema: lotDetailsInput,
    action: onSave,
    defaultValues: defaults,
    successMessage: 'Details saved.',
  });
  // Marking the lot extracted sets its date elsewhere on the page: show it here at once, not after a reload.
  const { setValue } = form;
  useEffect(() => {
    setValue('extractedOn', defaults.extractedOn ?? '');
  }, [defaults.extractedOn, setValue]);
  return (
    <form onSubmit={submit} className="grid gap-3 sm:grid-cols-2" noValidate aria-label="Lot details">
      <TextField
        label="Floral source"
        registration={form.register('floralSource')}
        error={e.floralSource}
        list="floral-sources"
        autoComplete="off"
      />
      <datalist id="floral-sources">
        {suggestions.map((s) => (
          <option key={s} value={s} />
        ))}
      </datalist>
      <TextField
        label="Extraction date"
        type="date"
        registration={form.register('extractedOn')}
        error={e.extractedOn}
      />
      <label className="flex min-h-11 items-center gap-3 text-sm font-medium" htmlFor="heather">
        <input id="heather" type="checkbox" className="h-5 w-5" {...form.register('heather')} /> Heather honey (heather
        moisture limit)
      </label>
      <label className="field sm:col-span-2" htmlFor="notes">
        <span>Notes</span>
        <textarea id="notes" rows={2} className="input" {...form.register('notes')} />
      </label>
      <div className="sm:col-span-2">
        <FormMessage {...message} />
      </div>
      <div>
        <button type="submit" className="btn-secondary" disabled={pending}>
          Save details
        </button>
      </div>
    </form>
  );
}
