'use client';
import type { ActionResult } from '@/lib/schemas/result';
import { stageInput, type StageInput } from '@/lib/schemas/lots';
import type { LotStage } from '@/lib/domain/lot-stage';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type Props = {
  lotId: number;
  stage: LotStage;
  isOwner: boolean;
  onChange: (v: StageInput) => Promise<ActionResult<{ stage: LotStage; holdReasons: string[] }>>;
};
type Target = StageInput['target'];

/** The stage buttons that make sense now; the server decides (lib/domain/lot-stage.ts) and explains a refusal. */
export function StageControls({ lotId, stage, isOwner, onChange }: Props) {
  // Holding, and leaving held, carry the written reason; the other steps do not.
  const withReason = (target: Target) => target === 'held' || stage === 'held';
  const { form, submit, pending, errors, setMessage, message } = useActionForm({
    schema: stageInput,
    action: (v) => onChange({ ...v, reason: withReason(v.target) ? v.reason : undefined }),
    defaultValues: { lotId, target: 'extracted', reason: '' },
    successMessage: (result) => `The lot is now ${result.stage.replace('_', ' ')}.`,
    resetOnSuccess: true,
    onSuccess: (result) => {
      if (result.stage === 'held') setMessage({ error: `The lot is held: ${result.holdReasons.join('; ')}` });
    },
  });
  const go = (target: Target) => {
    form.setValue('target', target);
    void submit();
  };
  const reason = form.watch('reason') ?? '';
  const needsReason = stage === 'held' ? isOwner : stage !== 'packed_out';
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        {stage === 'gathering' ? (
          <button type="button" className="btn-primary" disabled={pending} onClick={() => go('extracted')}>
            Mark extracted
          </button>
        ) : null}
        {stage === 'extracted' ? (
          <button type="button" className="btn-primary" disabled={pending} onClick={() => go('released')}>
            Release the lot
          </button>
        ) : null}
      </div>
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
