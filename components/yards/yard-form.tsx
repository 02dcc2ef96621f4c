'use client';
import { useRouter } from 'next/navigation';
import { yardInput, type YardInput } from '@/lib/schemas/yards';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type Props = {
  initial?: YardInput;
  keepers: { id: number; name: string; role: string }[];
  onSave: (v: YardInput) => Promise<ActionResult<{ id: number }>>;
};

export function YardForm({ initial, keepers, onSave }: Props) {
  const router = useRouter();
  const { form, field, submit, pending, message } = useActionForm({
    schema: yardInput,
    action: onSave,
    defaultValues: initial ?? { name: '', place: '', forageNotes: '', keeperIds: [] },
    onSuccess: (data) => router.push(`/admin/yards/${data.id}`),
  });
  const { register } = form;
  return (
    <form onSubmit={submit} className="grid max-w-2xl gap-4 card" noValidate>
      <TextField label="Yard name" {...field('name')} />
      <TextField label="Place" hint="How to find it: lane, gate, landmark." {...field('place')} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Latitude (optional)" inputMode="decimal" {...field('latitude')} />
        <TextField label="Longitude (optional)" inputMode="decimal" {...field('longitude')} />
      </div>
      <label className="field" htmlFor="forageNotes">
        <span>Forage notes</span>
        <textarea id="forageNotes" className="input min-h-24" {...register('forageNotes')} />
      </label>
      <fieldset className="field">
        <legend className="font-medium">Keepers assigned</legend>
        {keepers.map((k) => (
          <label key={k.id} className="flex min-h-11 items-center gap-2">
            <input type="checkbox" value={k.id} className="h-5 w-5" {...register('keeperIds')} />
            {k.name}
            {k.role === 'owner' ? ' (owner)' : ''}
          </label>
        ))}
      </fieldset>
      <FormMessage {...message} />
      <div>
        <button type="submit" className="btn-primary min-h-11" disabled={pending}>
          {pending ? 'Saving…' : 'Save yard'}
        </button>
      </div>
    </form>
  );
}
