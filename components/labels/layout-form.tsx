'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { labelLayoutInput, type LabelLayoutInput } from '@/lib/schemas/jarring';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';

type Values = z.input<typeof labelLayoutInput>;

/** A named sheet layout in millimetres, with a print-offset nudge for the printer. */
export function LayoutForm({ defaults, onSave }: { defaults: Values; onSave: (v: LabelLayoutInput) => Promise<ActionResult<{ id: number }>> }) {
  const router = useRouter();
  const form = useForm<Values, unknown, z.output<typeof labelLayoutInput>>({ resolver: zodResolver(labelLayoutInput), defaultValues: defaults });
  const [msg, setMsg] = useState<{ error?: string; success?: string }>({});
  const e = form.formState.errors;
  const num = (name: keyof Values, label: string, hint?: string) => <TextField label={label} registration={form.register(name)} error={e[name]} inputMode="decimal" hint={hint} />;
  async function submit(values: z.output<typeof labelLayoutInput>) {
    const res = await onSave(values);
    if (res.ok) {
      setMsg({ success: 'Layout saved.' });
      router.refresh();
      return;
    }
    for (const [name, message] of Object.entries(res.fieldErrors ?? {})) form.setError(name as keyof Values, { message });
    setMsg({ error: res.message });
  }
  return (
    <form onSubmit={form.handleSubmit(submit)} className="space-y-4" noValidate aria-label="Label layout">
      <TextField label="Name" registration={form.register('name')} error={e.name} />
      <label className="field" htmlFor="paper"><span>Paper</span>
        <select id="paper" className="input" {...form.register('paper')}>
          <option value="a4">A4 sheet</option><option value="letter">US Letter sheet</option><option value="roll">Roll (one label per page)</option>
        </select>
      </label>
      <div className="grid grid-cols-2 gap-3">
        {num('labelWidthMm', 'Label width, mm')}{num('labelHeightMm', 'Label height, mm')}
        {num('columns', 'Columns')}{num('rows', 'Rows')}
        {num('marginTopMm', 'Top margin, mm')}{num('marginLeftMm', 'Left margin, mm')}
        {num('gapXMm', 'Gap across, mm')}{num('gapYMm', 'Gap down, mm')}
        {num('offsetXMm', 'Nudge right, mm', 'Negative moves left.')}{num('offsetYMm', 'Nudge down, mm', 'Negative moves up.')}
      </div>
      <FormMessage error={msg.error} success={msg.success} />
      <button type="submit" className="btn-primary" disabled={form.formState.isSubmitting}>Save layout</button>
    </form>
  );
}
