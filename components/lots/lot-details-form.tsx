'use client';
import { useEffect } from 'react';
import { lotDetailsInput, type LotDetailsInput } from '@/lib/schemas/lots';
import { HONEY_SOURCES } from '@/lib/domain/lab-results';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

/** Floral source, heather, honey category, extraction date and notes, while the lot is still open (each change audited). */
export function LotDetailsForm({
  defaults,
  suggestions,
  onSave,
}: {
  defaults: LotDetailsInput;
  suggestions: string[];
  onSave: (v: LotDetailsInput) => Promise<ActionResult>;
}) {
  const { form, field, submit, pending, message } = useActionForm({
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
      <TextField label="Floral source" {...field('floralSource')} list="floral-sources" autoComplete="off" />
      <datalist id="floral-sources">
        {suggestions.map((s) => (
          <option key={s} value={s} />
        ))}
      </datalist>
      <TextField label="Extraction date" type="date" {...field('extractedOn')} />
      <label className="flex min-h-11 items-center gap-3 text-sm font-medium" htmlFor="heather">
        <input id="heather" type="checkbox" className="h-5 w-5" {...form.register('heather')} /> Heather honey (heather
        moisture limit)
      </label>
      <fieldset className="grid gap-3 sm:col-span-2 sm:grid-cols-2">
        <legend className="text-sm font-medium">Honey category (composition limits, 2001/110/EC Annex II)</legend>
        <label className="field" htmlFor="honeyOrigin">
          <span>Origin</span>
          <select id="honeyOrigin" className="input" {...form.register('honeyOrigin')}>
            <option value="blossom">Blossom (nectar) honey</option>
            <option value="honeydew">Honeydew honey</option>
            <option value="honeydew-blossom-blend">Blend of honeydew and blossom honey</option>
          </select>
        </label>
        <label className="field" htmlFor="annexSource">
          <span>Named floral source</span>
          <select id="annexSource" className="input" {...form.register('annexSource')}>
            <option value="">None of these</option>
            {Object.entries(HONEY_SOURCES).map(([key, name]) => (
              <option key={key} value={key}>
                {name}
              </option>
            ))}
          </select>
        </label>
        {(
          [
            ['bakers', 'Baker’s honey (for cooking only)'],
            ['pressed', 'Pressed honey'],
            ['tropical', 'Declared origin from a tropical climate (or a blend of such honeys)'],
            ['lowEnzyme', 'Low natural enzyme content (e.g. citrus)'],
          ] as const
        ).map(([key, text]) => (
          <label key={key} className="flex min-h-11 items-center gap-3 text-sm" htmlFor={key}>
            <input id={key} type="checkbox" className="h-5 w-5" {...form.register(key)} /> {text}
          </label>
        ))}
      </fieldset>
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
