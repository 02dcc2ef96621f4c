'use client';
import { useState } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import { removeSuperInput, type RemoveSuperInput } from '@/lib/schemas/lots';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

/** Takes a super back out of a lot that is still gathering, with a written reason (audited). */
export function RemoveSuperButton({
  lotId,
  superPullId,
  tag,
  onRemove,
}: {
  lotId: number;
  superPullId: number;
  tag: string;
  onRemove: (v: RemoveSuperInput) => Promise<ActionResult>;
}) {
  const [open, setOpen] = useState(false);
  // On success the page refreshes without this super's row.
  const { form, field, submit, pending, message } = useActionForm({
    schema: removeSuperInput,
    action: onRemove,
    defaultValues: { lotId, superPullId, reason: '' },
  });
  const reason = form.watch('reason') ?? '';
  if (!open)
    return (
      <button type="button" className="btn-quiet min-h-0 px-2 py-1" onClick={() => setOpen(true)}>
        Take out<span className="sr-only"> super {tag}</span>
      </button>
    );
  return (
    <form onSubmit={submit} className="flex min-w-48 flex-col gap-1" noValidate>
      <TextField id={`remove-${superPullId}`} label={`Why take ${tag} out?`} {...field('reason')} />
      <FormMessage {...message} />
      <div className="flex gap-1">
        <button type="submit" className="btn-danger min-h-9 px-2 py-1" disabled={pending || reason.trim().length < 5}>
          Take out
        </button>
        <button type="button" className="btn-quiet min-h-9 px-2 py-1" onClick={() => setOpen(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
