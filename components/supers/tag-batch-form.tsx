'use client';
import { useRouter } from 'next/navigation';
import { tagBatchInput, SUPER_DEPTHS } from '@/lib/schemas/supers';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm, type SaveResult } from '@/components/ui/use-action-form';
import type { z } from 'zod';

export function TagBatchForm({ onSave }: { onSave: (v: z.input<typeof tagBatchInput>) => Promise<SaveResult> }) {
  const router = useRouter();
  const { form, submit, message, done, setDone } = useActionForm(tagBatchInput, onSave, { prefix: 'SP', from: 1, count: 21, depth: 'medium', frameCount: 10 }, (data) => {
    const r = data as { codes: string[]; created: number };
    setDone(`${r.created} new tags (${r.codes[0]} to ${r.codes.at(-1)}).`);
    router.refresh();
  });
  const { register, formState: { errors, isSubmitting } } = form;
  return (
    <form onSubmit={submit} className="grid gap-3 sm:grid-cols-3" noValidate aria-label="Create super tags">
      <TextField label="Prefix" registration={register('prefix')} error={errors.prefix} />
      <TextField label="First number" inputMode="numeric" registration={register('from')} error={errors.from} />
      <TextField label="How many" inputMode="numeric" registration={register('count')} error={errors.count} />
      <label className="field" htmlFor="depth"><span>Box depth</span>
        <select id="depth" className="input min-h-11" {...register('depth')}>{SUPER_DEPTHS.map((d) => <option key={d} value={d}>{d}</option>)}</select>
      </label>
      <TextField label="Frames" inputMode="numeric" registration={register('frameCount')} error={errors.frameCount} />
      <div className="flex items-end"><button type="submit" className="btn-secondary min-h-11" disabled={isSubmitting}>Create tags</button></div>
      <div className="sm:col-span-3"><FormMessage error={message} success={done} /></div>
    </form>
  );
}
