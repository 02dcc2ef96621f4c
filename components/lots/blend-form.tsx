'use client';
import { useRouter } from 'next/navigation';
import { useFieldArray } from 'react-hook-form';
import { blendFormInput, type BlendFormInput } from '@/lib/schemas/lots';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

export type BlendableLot = { id: number; code: string; floralSource: string; remaining: string };

/** A new lot from parts of released lots, by weight. */
export function BlendForm({
  lots,
  unit,
  onCreate,
}: {
  lots: BlendableLot[];
  unit: 'kg' | 'lb';
  onCreate: (v: BlendFormInput) => Promise<ActionResult<{ id: number; code: string }>>;
}) {
  const router = useRouter();
  const { form, field, submit, pending, errors, message } = useActionForm({
    schema: blendFormInput,
    action: onCreate,
    defaultValues: { floralSource: '', notes: '', unit, parts: [{ lotId: lots[0]?.id ?? 0, amount: '' }] },
    successMessage: (blend) => `Blend ${blend.code} made.`,
    onSuccess: (blend) => router.push(`/admin/lots/${blend.id}`),
  });
  const parts = useFieldArray({ control: form.control, name: 'parts' });
  if (!lots.length) return <p className="hint">No released lot has honey left to blend.</p>;
  return (
    <form onSubmit={submit} className="max-w-2xl space-y-4 card" noValidate>
      <TextField label="Floral source of the blend" {...field('floralSource')} />
      <label className="field" htmlFor="unit">
        <span>Weights in</span>
        <select id="unit" className="input" {...form.register('unit')}>
          <option value="kg">kg</option>
          <option value="lb">lb</option>
        </select>
      </label>
      <fieldset className="space-y-3">
        <legend className="font-medium">Parts</legend>
        {parts.fields.map((f, i) => (
          <div key={f.id} className="grid gap-2 sm:grid-cols-[1fr_10rem_auto] sm:items-end">
            <label className="field" htmlFor={`parts.${i}.lotId`}>
              <span>Parent lot {i + 1}</span>
              <select id={`parts.${i}.lotId`} className="input" {...form.register(`parts.${i}.lotId` as const)}>
                {lots.map((l) => (
                  <option key={l.id} value={l.id}>
                    {l.code} · {l.floralSource || 'no floral source'} · {l.remaining} left
                  </option>
                ))}
              </select>
            </label>
            <TextField label={`Amount ${i + 1}`} {...field(`parts.${i}.amount`)} inputMode="decimal" />
            {parts.fields.length > 1 ? (
              <button type="button" className="btn-quiet" onClick={() => parts.remove(i)}>
                Remove
              </button>
            ) : (
              <span />
            )}
          </div>
        ))}
        <button type="button" className="btn-quiet" onClick={() => parts.append({ lotId: lots[0].id, amount: '' })}>
          Add another parent
        </button>
      </fieldset>
      <label className="field" htmlFor="notes">
        <span>Notes</span>
        <textarea id="notes" rows={2} className="input" {...form.register('notes')} />
      </label>
      <FormMessage error={message.error ?? errors.parts?.message} success={message.success} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        Make the blend
      </button>
    </form>
  );
}
