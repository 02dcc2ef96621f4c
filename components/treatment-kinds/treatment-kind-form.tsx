'use client';
import { useRouter } from 'next/navigation';
import { treatmentKindInput, type TreatmentKindInput } from '@/lib/schemas/treatment-kinds';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm, type AnyResult } from '@/components/ui/use-action-form';

/** One treatment kind (new or existing). Values are copied from the product label by the owner. */
export function TreatmentKindForm({
  initial,
  onSave,
}: {
  initial?: TreatmentKindInput;
  onSave: (v: TreatmentKindInput) => Promise<AnyResult>;
}) {
  const router = useRouter();
  const { form, field, submit, pending, message } = useActionForm({
    schema: treatmentKindInput,
    action: onSave,
    defaultValues: initial ?? { name: '', supersAllowed: false, waitingDays: 0, notes: '', active: true },
    successMessage: 'Saved.',
    resetOnSuccess: !initial,
    onSuccess: () => router.refresh(),
  });
  const { register } = form;
  const p = initial?.id ? `k${initial.id}` : 'new';
  return (
    <form
      onSubmit={submit}
      className="grid gap-3 sm:grid-cols-[2fr_auto_1fr_2fr_auto_auto] sm:items-end"
      noValidate
      aria-label={initial ? `Edit ${initial.name}` : 'New treatment kind'}
    >
      <TextField id={`${p}-name`} label="Name" {...field('name')} />
      <label className="flex min-h-11 items-center gap-2" htmlFor={`${p}-supers`}>
        <input id={`${p}-supers`} type="checkbox" className="h-5 w-5" {...register('supersAllowed')} />
        Label allows honey supers on
      </label>
      <TextField id={`${p}-wait`} label="Waiting days after removal" inputMode="numeric" {...field('waitingDays')} />
      <TextField id={`${p}-notes`} label="Notes" {...field('notes')} />
      <label className="flex min-h-11 items-center gap-2" htmlFor={`${p}-active`}>
        <input id={`${p}-active`} type="checkbox" className="h-5 w-5" {...register('active')} />
        In use
      </label>
      <button type="submit" className="btn-secondary min-h-11" disabled={pending}>
        {initial ? 'Save' : 'Add kind'}
      </button>
      <div className="sm:col-span-6">
        <FormMessage {...message} />
      </div>
    </form>
  );
}
