'use client';
import { useId, useState } from 'react';
import { useRouter } from 'next/navigation';
import type { ActionResult } from '@/lib/schemas/result';
import { voidPullInput, type VoidPullInput } from '@/lib/schemas/supers';
import type { PullVoid } from '@/lib/data/supers/pulls';
import type { VoidResult } from '@/lib/data/supers/void';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

export type VoidPull = (v: VoidPullInput) => Promise<ActionResult<VoidResult>>;

const WORDS = {
  pull: {
    open: 'Void this pull…',
    question: 'Why void this pull?',
    confirm: 'Void pull',
    hint: 'It stays on record, struck through, and no longer counts. If the super is still on the hive, record it as put on again.',
  },
  on: {
    open: 'Void this super-on record…',
    question: 'Why void this super-on record?',
    confirm: 'Void super-on record',
    hint: 'It stays on record, struck through, and the super no longer counts as on the hive: the next pull of this colony will not close it.',
  },
} as const;

/**
 * "Void this pull…" (or, for a super still on the hive, "Void this super-on record…") → a reason →
 * confirm. The record stays, struck through, and no longer counts anywhere. Without `onVoided` the
 * page is refreshed from the server.
 */
export function VoidPullButton({
  superPullId,
  what,
  onVoid,
  onVoided,
  record = 'pull',
}: {
  superPullId: number;
  what: string;
  onVoid: VoidPull;
  onVoided?: (v: PullVoid) => void;
  record?: 'pull' | 'on';
}) {
  const words = WORDS[record];
  const router = useRouter();
  const id = useId();
  const [open, setOpen] = useState(false);
  const { form, submit, pending, errors, message, setMessage } = useActionForm({
    schema: voidPullInput,
    action: onVoid,
    defaultValues: { superPullId, record, reason: '' },
    onSuccess: (result) => {
      setOpen(false);
      if (onVoided) onVoided(result.void);
      else router.refresh();
    },
  });
  const reason = form.watch('reason') ?? '';
  if (!open) {
    return (
      <button type="button" className="btn-quiet px-2" onClick={() => setOpen(true)}>
        {words.open}
        <span className="sr-only"> ({what})</span>
      </button>
    );
  }
  const error = errors.reason?.message;
  const ready = reason.trim().length >= 3;
  return (
    <form
      className="flex w-full max-w-sm min-w-56 flex-col gap-2"
      onSubmit={submit}
      noValidate
      aria-label={`Void ${what}`}
    >
      <label className="field" htmlFor={`${id}-reason`}>
        <span>{words.question}</span>
        <input
          id={`${id}-reason`}
          className="input"
          maxLength={500}
          autoFocus
          autoComplete="off"
          aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
          aria-invalid={error ? true : undefined}
          {...form.register('reason')}
        />
      </label>
      <small id={`${id}-hint`} className="hint">
        {words.hint}
      </small>
      {error ? (
        <small id={`${id}-error`} className="field-error" role="alert">
          {error}
        </small>
      ) : null}
      <FormMessage {...message} />
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-danger" disabled={!ready || pending}>
          {pending ? 'Voiding…' : words.confirm}
        </button>
        <button
          type="button"
          className="btn-quiet"
          onClick={() => {
            setOpen(false);
            setMessage({});
            form.clearErrors();
          }}
        >
          Cancel
        </button>
      </div>
    </form>
  );
}

/** Who voided a pull or super-on record, when (the business's calendar date) and why. */
export function VoidedNote({ v, date }: { v: PullVoid; date: string }) {
  return (
    <span className="text-xs text-ink-soft">
      Voided {date} by {v.byName ?? 'unknown'}: {v.reason}
    </span>
  );
}
