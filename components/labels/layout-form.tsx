'use client';
import { useRouter } from 'next/navigation';
import { labelLayoutInput, type LabelLayoutInput } from '@/lib/schemas/labels';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type Values = LabelLayoutInput;

/** A named sheet layout in millimetres, with a print-offset nudge for the printer. */
export function LayoutForm({
  defaults,
  onSave,
}: {
  defaults: Values;
  onSave: (v: LabelLayoutInput) => Promise<ActionResult<{ id: number }>>;
}) {
  const router = useRouter();
  const { form, field, submit, pending, message } = useActionForm({
    schema: labelLayoutInput,
    action: onSave,
    defaultValues: defaults,
    successMessage: 'Layout saved.',
    onSuccess: () => router.refresh(),
  });
  const num = (name: keyof Values, label: string, hint?: string) => (
    <TextField label={label} {...field(name)} inputMode="decimal" hint={hint} />
  );
  return (
    <form onSubmit={submit} className="space-y-4" noValidate aria-label="Label layout">
      <TextField label="Name" {...field('name')} />
      <label className="field" htmlFor="paper">
        <span>Paper</span>
        <select id="paper" className="input" {...form.register('paper')}>
          <option value="a4">A4 sheet</option>
          <option value="letter">US Letter sheet</option>
          <option value="roll">Roll (one label per page)</option>
        </select>
      </label>
      <div className="grid grid-cols-2 gap-3">
        {num('labelWidthMm', 'Label width, mm')}
        {num('labelHeightMm', 'Label height, mm')}
        {num('columns', 'Columns')}
        {num('rows', 'Rows')}
        {num('marginTopMm', 'Top margin, mm')}
        {num('marginLeftMm', 'Left margin, mm')}
        {num('gapXMm', 'Gap across, mm')}
        {num('gapYMm', 'Gap down, mm')}
        {num('offsetXMm', 'Nudge right, mm', 'Negative moves left.')}
        {num('offsetYMm', 'Nudge down, mm', 'Negative moves up.')}
      </div>
      <FormMessage {...message} />
      <button type="submit" className="btn-primary" disabled={pending}>
        Save layout
      </button>
    </form>
  );
}
