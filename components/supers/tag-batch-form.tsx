'use client';
import { useRouter } from 'next/navigation';
import { tagBatchInput, SUPER_DEPTHS } from '@/lib/schemas/supers';
import { TextField } from '@/components/ui/text-field';
import { SelectField } from '@/components/ui/select-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
import type { ActionResult } from '@/lib/schemas/result';
import type { z } from 'zod';

export function TagBatchForm({
  onSave,
}: {
  onSave: (v: z.input<typeof tagBatchInput>) => Promise<ActionResult<{ codes: string[]; created: number }>>;
}) {
  const router = useRouter();
  const { form, field, submit, pending, message } = useActionForm({
    schema: tagBatchInput,
    action: onSave,
    defaultValues: { prefix: 'SP', from: 1, count: 21, depth: 'medium', frameCount: 10 },
    successMessage: (r) => `${r.created} new tags (${r.codes[0]} to ${r.codes.at(-1)}).`,
    onSuccess: () => router.refresh(),
  });
  const { register } = form;
  return (
    <form onSubmit={submit} className="grid gap-3 sm:grid-cols-3" noValidate aria-label="Create super tags">
      <TextField label="Prefix" {...field('prefix')} />
      <TextField label="First number" inputMode="numeric" {...field('from')} />
      <TextField label="How many" inputMode="numeric" {...field('count')} />
      <SelectField id="depth" label="Box depth" registration={register('depth')} options={SUPER_DEPTHS} />
      <TextField label="Frames" inputMode="numeric" {...field('frameCount')} />
      <div className="flex items-end">
        <button type="submit" className="btn-secondary min-h-11" disabled={pending}>
          Create tags
        </button>
      </div>
      <div className="sm:col-span-3">
        <FormMessage {...message} />
      </div>
    </form>
  );
}
