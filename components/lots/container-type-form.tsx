'use client';
import { containerTypeInput, type ContainerTypeInput } from '@/lib/schemas/lots';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

/** Adds a container type, or edits one when `defaults.id` is given. */
export function ContainerTypeForm({
  defaults,
  onSave,
}: {
  defaults: ContainerTypeInput;
  onSave: (v: ContainerTypeInput) => Promise<ActionResult<{ id: number }>>;
}) {
  const { form, field, submit, pending, message } = useActionForm({
    schema: containerTypeInput,
    action: onSave,
    defaultValues: defaults,
    successMessage: 'Saved.',
    resetOnSuccess: !defaults.id,
  });
  const key = defaults.id ?? 'new';
  return (
    <form
      onSubmit={submit}
      className="grid gap-2 sm:grid-cols-[1fr_8rem_6rem_auto_auto] sm:items-end"
      noValidate
      aria-label={defaults.id ? `Edit ${defaults.name}` : 'Add a container type'}
    >
      <TextField id={`name-${key}`} label="Name" {...field('name')} />
      <TextField id={`tare-${key}`} label="Usual tare" {...field('usualTare')} inputMode="decimal" />
      <label className="field" htmlFor={`unit-${key}`}>
        <span>Unit</span>
        <select id={`unit-${key}`} className="input" {...form.register('unit')}>
          <option value="kg">kg</option>
          <option value="lb">lb</option>
        </select>
      </label>
      <label className="flex min-h-11 items-center gap-2 text-sm" htmlFor={`active-${key}`}>
        <input id={`active-${key}`} type="checkbox" className="h-5 w-5" {...form.register('active')} /> In use
      </label>
      <button type="submit" className="btn-secondary" disabled={pending}>
        {defaults.id ? 'Save' : 'Add'}
      </button>
      <div className="sm:col-span-5">
        <FormMessage {...message} />
      </div>
    </form>
  );
}
