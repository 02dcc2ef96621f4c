'use client';
import { useRouter } from 'next/navigation';
import { lotInput, type LotInput } from '@/lib/schemas/lots';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

export function NewLotForm({
  suggestions,
  onCreate,
}: {
  suggestions: string[];
  onCreate: (v: LotInput) => Promise<ActionResult<{ id: number; code: string }>>;
}) {
  const router = useRouter();
  const { form, field, submit, pending, message } = useActionForm({
    schema: lotInput,
    action: onCreate,
    defaultValues: { floralSource: '', heather: false, extractedOn: '', notes: '' },
    successMessage: (lot) => `Lot ${lot.code} made.`,
    onSuccess: (lot) => router.push(`/admin/lots/${lot.id}`),
  });
  return (
    <form onSubmit={submit} className="max-w-xl space-y-4 card" noValidate>
      <TextField
        label="Floral source"
        {...field('floralSource')}
        list="floral-sources"
        hint="e.g. linden, spring blossom, late-summer wildflower"
        autoComplete="off"
      />
      <datalist id="floral-sources">
        {suggestions.map((s) => (
          <option key={s} value={s} />
        ))}
      </datalist>
      <label className="flex min-h-11 items-center gap-3 text-sm font-medium" htmlFor="heather">
        <input id="heather" type="checkbox" className="h-5 w-5" {...form.register('heather')} /> Heather honey (the
        heather moisture limit applies)
      </label>
      <TextField label="Extraction date (if known)" type="date" {...field('extractedOn')} />
      <label className="field" htmlFor="notes">
        <span>Notes</span>
        <textarea id="notes" rows={3} className="input" {...form.register('notes')} />
      </label>
      <FormMessage {...message} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        Start the lot
      </button>
    </form>
  );
}
