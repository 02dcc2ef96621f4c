'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import type { ActionResult } from '@/lib/schemas/result';
import { stageInput, type StageInput } from '@/lib/schemas/lots';
import type { LotStage } from '@/lib/domain/lot-stage';
import { bestBeforeDate } from '@/lib/domain/jars';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type Props = {
  lotId: number;
  stage: LotStage;
  isOwner: boolean;
  /** Today in the business's time zone, and the lot's extraction date if one was typed already. */
  today: string;
  extractedOn: string | null;
  bestBeforeMonths: number;
  onChange: (
    v: StageInput,
  ) => Promise<
    ActionResult<{ stage: LotStage; holdReasons: string[]; extractedOn: string | null; bestBeforeOn: string | null }>
  >;
};
type Target = StageInput['target'];

/** The stage buttons that make sense now; the server decides (lib/domain/lot-stage.ts) and explains a refusal. */
export function StageControls({ lotId, stage, isOwner, today, extractedOn, bestBeforeMonths, onChange }: Props) {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  // Holding, and leaving held, carry the written reason; the other steps do not.
  const withReason = (target: Target) => target === 'held' || stage === 'held';
  const { form, submit, pending, errors, setMessage, message } = useActionForm({
    schema: stageInput,
    action: (v) =>
      onChange({
        ...v,
        reason: withReason(v.target) ? v.reason : undefined,
        extractedOn: stage === 'gathering' && v.target === 'extracted' ? v.extractedOn : undefined,
      }),
    defaultValues: { lotId, target: 'extracted', reason: '', extractedOn: extractedOn ?? today },
    successMessage: (result) =>
      stage === 'gathering' && result.stage === 'extracted'
        ? `The lot is now extracted. Extracted on ${result.extractedOn}, best before ${result.bestBeforeOn}.`
        : `The lot is now ${result.stage.replace('_', ' ')}.`,
    resetOnSuccess: true,
    onSuccess: (result) => {
      setAsking(false);
      if (result.stage === 'held') setMessage({ error: `The lot is held: ${result.holdReasons.join('; ')}` });
      router.refresh();
    },
  });
  const chosenDay = form.watch('extractedOn') ?? '';
  let preview = '';
  try {
    preview = /^\d{4}-\d{2}-\d{2}$/.test(chosenDay) ? bestBeforeDate(chosenDay, bestBeforeMonths) : '';
  } catch {
    preview = '';
  }
  const go = (target: Target) => {
    form.setValue('target', target);
    void submit();
  };
  const reason = form.watch('reason') ?? '';
  const needsReason = stage === 'held' ? isOwner : stage !== 'packed_out';
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        {stage === 'gathering' && !asking ? (
          <button type="button" className="btn-primary" disabled={pending} onClick={() => setAsking(true)}>
            Mark extracted
          </button>
        ) : null}
        {stage === 'extracted' ? (
          <button type="button" className="btn-primary" disabled={pending} onClick={() => go('released')}>
            Release the lot
          </button>
        ) : null}
      </div>
      {stage === 'gathering' && asking ? (
        <fieldset className="space-y-2" aria-label="Extraction date">
          <label className="field" htmlFor="stage-extracted-on">
            <span>Extracted on</span>
            <input
              id="stage-extracted-on"
              type="date"
              max={today}
              className="input min-h-11"
              aria-invalid={errors.extractedOn ? true : undefined}
              aria-describedby="stage-best-before"
              {...form.register('extractedOn')}
            />
            {errors.extractedOn?.message ? (
              <small className="field-error" role="alert">
                {errors.extractedOn.message}
              </small>
            ) : null}
          </label>
          <p id="stage-best-before" className="text-sm" aria-live="polite">
            {preview
              ? `Best before ${preview} (${bestBeforeMonths} months after extraction, your setting). Jars and labels carry it.`
              : 'Pick the extraction date to see the best-before date.'}
          </p>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className="btn-primary"
              disabled={pending || !preview}
              onClick={() => go('extracted')}
            >
              Confirm extracted
            </button>
            <button type="button" className="btn-quiet" disabled={pending} onClick={() => setAsking(false)}>
              Cancel
            </button>
          </div>
        </fieldset>
      ) : null}
      {needsReason ? (
        <div className="space-y-2">
          <label className="field" htmlFor="stage-reason">
            <span>{stage === 'held' ? 'Owner’s reason to take the lot out of held' : 'Reason to hold the lot'}</span>
            <textarea
              id="stage-reason"
              rows={2}
              className="input"
              aria-invalid={errors.reason ? true : undefined}
              {...form.register('reason')}
            />
            {errors.reason?.message ? (
              <small className="field-error" role="alert">
                {errors.reason.message}
              </small>
            ) : null}
          </label>
          <div className="flex flex-wrap gap-2">
            {stage === 'held' ? (
              <>
                <button
                  type="button"
                  className="btn-danger"
                  disabled={pending || reason.trim().length < 5}
                  onClick={() => go('released')}
                >
                  Release held lot
                </button>
                <button
                  type="button"
                  className="btn-secondary"
                  disabled={pending || reason.trim().length < 5}
                  onClick={() => go('extracted')}
                >
                  Back to extracted
                </button>
              </>
            ) : (
              <button
                type="button"
                className="btn-danger"
                disabled={pending || reason.trim().length < 5}
                onClick={() => go('held')}
              >
                Hold the lot
              </button>
            )}
          </div>
        </div>
      ) : stage === 'held' ? (
        <p className="hint">Only the owner can take a lot out of held.</p>
      ) : null}
      <FormMessage {...message} />
    </div>
  );
}
