'use client';
import { containerInput, type ContainerInput } from '@/lib/schemas/lots';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
import { gramsToKg, gramsToLb } from '@/lib/domain/units';

export type ContainerTypeOption = { id: number; name: string; usualTareGrams: number };

/** Gross and tare of one bucket, pail, drum or tank, in kg or lb; picking a type fills its usual tare. */
export function ContainerForm({
  lotId,
  types,
  unit,
  onSave,
}: {
  lotId: number;
  types: ContainerTypeOption[];
  unit: 'kg' | 'lb';
  onSave: (v: ContainerInput) => Promise<ActionResult>;
}) {
  const { form, field, submit, pending, message } = useActionForm({
    schema: containerInput,
    action: onSave,
    defaultValues: { lotId, unit, label: '', containerTypeId: '' },
    successMessage: 'Container recorded.',
    // The next container is often the same type: keep type, unit and tare, clear the rest.
    resetOnSuccess: (typed) => ({
      lotId,
      unit: typed.unit,
      label: '',
      containerTypeId: typed.containerTypeId,
      tare: typed.tare,
      gross: '',
    }),
  });
  const typeField = form.register('containerTypeId', {
    onChange: (ev: React.ChangeEvent<HTMLSelectElement>) => {
      const t = types.find((x) => String(x.id) === ev.target.value);
      if (!t) return;
      const u = form.getValues('unit');
      const tare = u === 'kg' ? gramsToKg(t.usualTareGrams) : gramsToLb(t.usualTareGrams);
      form.setValue('tare', Number(tare.toFixed(u === 'kg' ? 3 : 2)));
    },
  });
  return (
    <form onSubmit={submit} className="grid gap-3 sm:grid-cols-3" noValidate aria-label="Add a container">
      <label className="field" htmlFor="containerTypeId">
        <span>Container type</span>
        <select id="containerTypeId" className="input" {...typeField}>
          <option value="">Other</option>
          {types.map((t) => (
            <option key={t.id} value={t.id}>
              {t.name}
            </option>
          ))}
        </select>
      </label>
      <TextField label="Label on the container" {...field('label')} placeholder="e.g. B3" />
      <label className="field" htmlFor="unit">
        <span>Unit</span>
        <select id="unit" className="input" {...form.register('unit')}>
          <option value="kg">kg</option>
          <option value="lb">lb</option>
        </select>
      </label>
      <TextField label="Gross weight" {...field('gross')} inputMode="decimal" />
      <TextField label="Tare (empty container)" {...field('tare')} inputMode="decimal" />
      <div className="flex items-end">
        <button type="submit" className="btn-secondary w-full" disabled={pending}>
          Add container
        </button>
      </div>
      <div className="sm:col-span-3">
        <FormMessage {...message} />
      </div>
    </form>
  );
}
