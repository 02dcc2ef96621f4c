'use client';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import type { ReadingInput } from '@/lib/schemas/lots';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useResult } from './use-result';

// One flat form for both kinds of refractometer; the action's schema checks the chosen kind.
const schema = z.object({
  lotId: z.number(),
  method: z.enum(['ri', 'scale']),
  refractiveIndex: z.string().trim(),
  scaleWaterPct: z.string().trim(),
  temperatureC: z.string().trim(),
  takenOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick a date.'),
}).superRefine((v, ctx) => {
  if (v.method === 'ri' && !/^1\.\d{3,5}$/.test(v.refractiveIndex)) ctx.addIssue({ code: 'custom', path: ['refractiveIndex'], message: 'Enter the refractive index, e.g. 1.4900.' });
  if (v.method === 'ri' && v.temperatureC === '') ctx.addIssue({ code: 'custom', path: ['temperatureC'], message: 'Enter the sample temperature.' });
  if (v.method === 'scale' && !(Number(v.scaleWaterPct) > 0)) ctx.addIssue({ code: 'custom', path: ['scaleWaterPct'], message: 'Enter the % water read on the scale.' });
});
type Values = z.infer<typeof schema>;

/** A refractometer reading: refractive index + temperature, or % water from a honey scale (+ temperature if not compensated). */
export function ReadingForm({ lotId, today, onSave }: { lotId: number; today: string; onSave: (v: ReadingInput) => Promise<ActionResult<{ id: number; waterPct: number }>> }) {
  const form = useForm<Values>({ resolver: zodResolver(schema), defaultValues: { lotId, method: 'scale', refractiveIndex: '', scaleWaterPct: '', temperatureC: '', takenOn: today } });
  const { msg, setMsg, apply } = useResult(form);
  const method = form.watch('method');
  const e = form.formState.errors;
  async function submit(v: Values) {
    setMsg({});
    const input: ReadingInput = v.method === 'ri'
      ? { lotId, method: 'ri', refractiveIndex: Number(v.refractiveIndex), temperatureC: Number(v.temperatureC), takenOn: v.takenOn }
      : { lotId, method: 'scale', scaleWaterPct: Number(v.scaleWaterPct), temperatureC: v.temperatureC === '' ? undefined : Number(v.temperatureC), takenOn: v.takenOn };
    const result = await onSave(input);
    if (apply(result, result.ok ? `Reading saved: ${result.data.waterPct.toFixed(1)} % water at 20 °C.` : undefined)) form.reset({ ...v, refractiveIndex: '', scaleWaterPct: '', temperatureC: '' });
  }
  return (
    <form onSubmit={form.handleSubmit(submit)} className="grid gap-3 sm:grid-cols-2" noValidate aria-label="Add a moisture reading">
      <fieldset className="sm:col-span-2 flex flex-wrap gap-4 text-sm">
        <legend className="mb-1 font-medium">Refractometer shows</legend>
        <label className="flex min-h-11 items-center gap-2"><input type="radio" value="scale" className="h-5 w-5" {...form.register('method')} /> % water (honey scale)</label>
        <label className="flex min-h-11 items-center gap-2"><input type="radio" value="ri" className="h-5 w-5" {...form.register('method')} /> Refractive index</label>
      </fieldset>
      {method === 'ri'
        ? <TextField label="Refractive index (nD)" registration={form.register('refractiveIndex')} error={e.refractiveIndex} inputMode="decimal" placeholder="1.4900" />
        : <TextField label="Water on the scale, %" registration={form.register('scaleWaterPct')} error={e.scaleWaterPct} inputMode="decimal" placeholder="17.8" />}
      <TextField label={method === 'ri' ? 'Sample temperature, °C' : 'Temperature, °C (only if not compensated)'} registration={form.register('temperatureC')} error={e.temperatureC} inputMode="decimal" />
      <TextField label="Taken on" type="date" registration={form.register('takenOn')} error={e.takenOn} />
      <div className="flex items-end"><button type="submit" className="btn-secondary w-full" disabled={form.formState.isSubmitting}>Add reading</button></div>
      <div className="sm:col-span-2"><FormMessage error={msg.error} success={msg.success} /></div>
    </form>
  );
}
