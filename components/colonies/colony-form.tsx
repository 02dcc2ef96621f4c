'use client';
import { useRouter } from 'next/navigation';
import { colonyInput, COLONY_ORIGINS, type ColonyInput } from '@/lib/schemas/colonies';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type Props = {
  initial: ColonyInput;
  keepers: { id: number; name: string }[] | null;
  parents: { id: number; code: string }[];
  onSave: (v: ColonyInput) => Promise<ActionResult<{ id: number }>>;
  submitLabel: string;
};

const ORIGIN_NAMES: Record<(typeof COLONY_ORIGINS)[number], string> = {
  package: 'Package',
  nucleus: 'Nucleus',
  swarm: 'Swarm',
  purchased: 'Purchased colony',
  split: 'Split from another colony',
};

export function ColonyForm({ initial, keepers, parents, onSave, submitLabel }: Props) {
  const router = useRouter();
  const { form, field, submit, pending, errors, message } = useActionForm({
    schema: colonyInput,
    action: onSave,
    defaultValues: initial,
    onSuccess: (data) => router.push(`/admin/colonies/${data.id}`),
  });
  const { register, watch } = form;
  const origin = watch('origin');
  return (
    <form onSubmit={submit} className="grid max-w-2xl gap-4 card" noValidate>
      <TextField
        label="Colony code"
        hint="Unique in the business, e.g. OT-07."
        autoCapitalize="characters"
        {...field('code')}
      />
      {keepers ? (
        <label className="field" htmlFor="keeperId">
          <span>Keeper</span>
          <select id="keeperId" className="input min-h-11" {...register('keeperId')}>
            {keepers.map((k) => (
              <option key={k.id} value={k.id}>
                {k.name}
              </option>
            ))}
          </select>
          {errors.keeperId ? (
            <small className="field-error" role="alert">
              {errors.keeperId.message}
            </small>
          ) : null}
        </label>
      ) : null}
      <label className="field" htmlFor="origin">
        <span>Origin</span>
        <select id="origin" className="input min-h-11" {...register('origin')}>
          {COLONY_ORIGINS.map((o) => (
            <option key={o} value={o}>
              {ORIGIN_NAMES[o]}
            </option>
          ))}
        </select>
      </label>
      {origin === 'split' ? (
        <label className="field" htmlFor="parentColonyId">
          <span>Split from</span>
          <select id="parentColonyId" className="input min-h-11" {...register('parentColonyId')}>
            <option value="">Choose the parent colony</option>
            {parents.map((p) => (
              <option key={p.id} value={p.id}>
                {p.code}
              </option>
            ))}
          </select>
        </label>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Queen year" hint="Gives the marking colour." inputMode="numeric" {...field('queenYear')} />
        <TextField label="Started on" type="date" {...field('startedOn')} />
      </div>
      <label className="field" htmlFor="notes">
        <span>Notes</span>
        <textarea id="notes" className="input min-h-20" {...register('notes')} />
      </label>
      <FormMessage {...message} />
      <div>
        <button type="submit" className="btn-primary min-h-11" disabled={pending}>
          {pending ? 'Saving…' : submitLabel}
        </button>
      </div>
    </form>
  );
}
