'use client';
import { useState } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import { voidInput, type VoidInput } from '@/lib/schemas/lots';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

/** Corrects a record by voiding it with a written reason; nothing is deleted. */
export function VoidButton({
  lotId,
  kind,
  recordId,
  what,
  onVoid,
}: {
  lotId: number;
  kind: VoidInput['kind'];
  recordId: number;
  what: string;
  onVoid: (v: VoidInput) => Promise<ActionResult>;
}) {
  const [open, setOpen] = useState(false);
  const { form, field, submit, pending, message } = useActionForm({
    schema: voidInput,
    action: onVoid,
    defaultValues: { lotId, kind, recordId, reason: '' },
    onSuccess: () => setOpen(false),
  });
  const reason = form.watch('reason') ?? '';
  if (!open)
    return (
      <button type="button" className="btn-quiet min-h-0 px-2 py-1" onClick={() => setOpen(true)}>
        Void<span className="sr-only"> {what}</span>
      </button>
    );
  return (
    <form onSubmit={submit} className="flex min-w-48 flex-col gap-1" noValidate>
      <TextField id={`void-${kind}-${recordId}`} label={`Why void ${what}?`} {...field('reason')} />
      <FormMessage {...message} />
      <div className="flex gap-1">
        <button type="submit" className="btn-danger min-h-9 px-2 py-1" disabled={pending || reason.trim().length < 5}>
          Void
        </button>
        <button type="button" className="btn-quiet min-h-9 px-2 py-1" onClick={() => setOpen(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
