'use client';
import { overrideRunInput, type OverrideRunInput } from '@/lib/schemas/jarring';
import type { ActionResult } from '@/lib/schemas/result';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

/** The owner lets a failing run's jars into stock with a written reason. */
export function OverrideForm({
  runId,
  onOverride,
}: {
  runId: number;
  onOverride: (v: OverrideRunInput) => Promise<ActionResult>;
}) {
  const { form, submit, pending, errors, message } = useActionForm({
    schema: overrideRunInput,
    action: onOverride,
    defaultValues: { runId, reason: '' },
    successMessage: 'Overridden; the jars are in stock.',
  });
  const err = errors.reason?.message;
  return (
    <form onSubmit={submit} className="space-y-3" noValidate>
      <label className="field" htmlFor="reason">
        <span>Why these jars may be sold anyway</span>
        <textarea
          id="reason"
          rows={3}
          className="input"
          aria-invalid={err ? true : undefined}
          {...form.register('reason')}
        />
        {err ? (
          <small className="field-error" role="alert">
            {err}
          </small>
        ) : null}
      </label>
      <FormMessage {...message} />
      <button type="submit" className="btn-danger" disabled={pending}>
        Override and put in stock
      </button>
    </form>
  );
}
