'use client';
import { useState, type ReactNode } from 'react';
import type { DefaultValues, FieldValues, Path } from 'react-hook-form';
import type { z } from 'zod';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm, type AnyResult } from '@/components/ui/use-action-form';

/**
 * A correction that needs a written reason (audited; nothing is deleted): a quiet `verb` button opens a short form
 * asking `question`, and its `verb` button is ready once the reason has five characters. `closeOnSuccess` folds the
 * form away after a save; otherwise the refreshed page no longer shows the row.
 */
export function ReasonButton<S extends z.ZodType<FieldValues & { reason: string }, FieldValues>>({
  schema,
  action,
  defaultValues,
  closeOnSuccess = false,
  verb,
  what,
  inputId,
  question,
}: {
  schema: S;
  action: (v: z.output<S>) => Promise<AnyResult>;
  defaultValues: DefaultValues<z.input<S>>;
  closeOnSuccess?: boolean;
  verb: string;
  /** Said to screen readers after the opening `verb`: what it acts on. */
  what: ReactNode;
  inputId: string;
  question: string;
}) {
  const [open, setOpen] = useState(false);
  const { form, field, submit, pending, message } = useActionForm({
    schema,
    action,
    defaultValues,
    onSuccess: closeOnSuccess ? () => setOpen(false) : undefined,
  });
  const reasonField = 'reason' as Path<z.input<S>>;
  const reason: string = form.watch(reasonField) ?? '';
  if (!open)
    return (
      <button type="button" className="btn-quiet min-h-0 px-2 py-1" onClick={() => setOpen(true)}>
        {verb}
        <span className="sr-only"> {what}</span>
      </button>
    );
  return (
    <form onSubmit={submit} className="flex min-w-48 flex-col gap-1" noValidate>
      <TextField id={inputId} label={question} {...field(reasonField)} />
      <FormMessage {...message} />
      <div className="flex gap-1">
        <button type="submit" className="btn-danger min-h-9 px-2 py-1" disabled={pending || reason.trim().length < 5}>
          {verb}
        </button>
        <button type="button" className="btn-quiet min-h-9 px-2 py-1" onClick={() => setOpen(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
