'use client';
import { readingFormInput, type ReadingInput } from '@/lib/schemas/lots';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

/** A refractometer reading: refractive index + temperature, or % water from a honey scale (+ temperature if not compensated). */
export function ReadingForm({
  lotId,
  today,
  onSave,
}: {
  lotId: number;
  today: string;
  onSave: (v: ReadingInput) => Promise<ActionResult<{ id: number; waterPct: number }>>;
}) {
  const { form, field, submit, pending, message } = useActionForm({
    schema: readingFormInput,
    action: onSave,
    defaultValues: { lotId, method: 'scale', refractiveIndex: '', scaleWaterPct: '', temperatureC: '', takenOn: today },
    successMessage: (saved) => `Reading saved: ${saved.waterPct.toFixed(1)} % water at 20 °C.`,
    resetOnSuccess: (typed) => ({ ...typed, refractiveIndex: '', scaleWaterPct: '', temperatureC: '' }),
  });
  const method = form.watch('method');
  return (
    <form onSubmit={submit} className="grid gap-3 sm:grid-cols-2" noValidate aria-label="Add a moisture reading">
      <fieldset className="flex flex-wrap gap-4 text-sm sm:col-span-2">
        <legend className="mb-1 font-medium">Refractometer shows</legend>
        <label className="flex min-h-11 items-center gap-2">
          <input type="radio" value="scale" className="h-5 w-5" {...form.register('method')} /> % water (honey scale)
        </label>
        <label className="flex min-h-11 items-center gap-2">
          <input type="radio" value="ri" className="h-5 w-5" {...form.register('method')} /> Refractive index
        </label>
      </fieldset>
      {method === 'ri' ? (
        <TextField
          label="Refractive index (nD)"
          {...field('refractiveIndex')}
          inputMode="decimal"
          placeholder="1.4900"
        />
      ) : (
        <TextField label="Water on the scale, %" {...field('scaleWaterPct')} inputMode="decimal" placeholder="17.8" />
      )}
      <TextField
        label={method === 'ri' ? 'Sample temperature, °C' : 'Temperature, °C (only if not compensated)'}
        {...field('temperatureC')}
        inputMode="decimal"
      />
      <TextField label="Taken on" type="date" {...field('takenOn')} />
      <div className="flex items-end">
        <button type="submit" className="btn-secondary w-full" disabled={pending}>
          Add reading
        </button>
      </div>
      <div className="sm:col-span-2">
        <FormMessage {...message} />
      </div>
    </form>
  );
}
