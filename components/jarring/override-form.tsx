'use client';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { overrideRunInput, type OverrideRunInput } from '@/lib/schemas/jarring';
import type { ActionResult } from '@/lib/schemas/result';
import { FormMessage } from '@/components/ui/form-message';

type Values = z.input<typeof overrideRunInput>;

/** The owner lets a failing run's jars into stock with a written reason. */
export function OverrideForm({ runId, onOverride }: { runId: number; onOverride: (v: OverrideRunInput) => Promise<ActionResult> }) {
  const form = useForm<Values, unknown, z.output<typeof overrideRunInput>>({ resolver: zodResolver(overrideRunInput), defaultValues: { runId, reason: '' } });
  const [msg, setMsg] = useState<{ error?: string; success?: string }>({});
  async function submit(values: z.output<typeof overrideRunInput>) {
    const res = await onOverride(values);
    if (res.ok) return setMsg({ success: 'Overridden; the jars are in stock.' });
    if (res.fieldErrors?.reason) form.setError('reason', { message: res.fieldErrors.reason });
    setMsg({ error: res.message });
  }
  const err = form.formState.errors.reason?.message;
  return (
    <form onSubmit={form.handleSubmit(submit)} className="space-y-3" noValidate>
      <label className="field" htmlFor="reason"><span>Why these jars may be sold anyway</span>
        <textarea id="reason" rows={3} className="input" aria-invalid={err ? true : undefined} {...form.register('reason')} />
        {err ? <small className="field-error" role="alert">{err}</small> : null}
      </label>
      <FormMessage error={msg.error} success={msg.success} />
      <button type="submit" className="btn-danger" disabled={form.formState.isSubmitting}>Override and put in stock</button>
    </form>
  );
}
