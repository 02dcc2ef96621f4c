'use client';
import type { UseFormRegisterReturn } from 'react-hook-form';
import type { ActionResult } from '@/lib/schemas/result';
import { emptyWeightInput, waxInput, type EmptyWeightInput, type WaxInput } from '@/lib/schemas/lots';
import { FormMessage, type FormMessageState } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type FieldProps = {
  id: string;
  label: string;
  unit: 'kg' | 'lb';
  button: string;
  registration: UseFormRegisterReturn;
  error?: string;
  pending: boolean;
  message: FormMessageState;
  onSubmit: () => void;
};

/** One weight in kg or lb (a super's empty weight, the cappings wax): small enough for a table row. */
function WeightFieldForm({ id, label, unit, button, registration, error, pending, message, onSubmit }: FieldProps) {
  return (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        onSubmit();
      }}
      className="flex flex-wrap items-end gap-1"
      noValidate
    >
      <label className="field w-28" htmlFor={id}>
        <span className="sr-only">{label}</span>
        <input
          id={id}
          className="input min-h-9 py-1"
          inputMode="decimal"
          placeholder={unit}
          aria-label={label}
          aria-invalid={error ? true : undefined}
          {...registration}
        />
      </label>
      <button type="submit" className="btn-quiet min-h-9 px-2 py-1" disabled={pending}>
        {button}
      </button>
      {error ? (
        <small className="w-full field-error" role="alert">
          {error}
        </small>
      ) : null}
      <div className="w-full">
        <FormMessage {...message} />
      </div>
    </form>
  );
}

export function EmptyWeightForm({
  lotId,
  superPullId,
  tag,
  unit,
  onSave,
}: {
  lotId: number;
  superPullId: number;
  tag: string;
  unit: 'kg' | 'lb';
  onSave: (v: EmptyWeightInput) => Promise<ActionResult>;
}) {
  const { form, submit, pending, errors, message } = useActionForm({
    schema: emptyWeightInput,
    action: onSave,
    defaultValues: { lotId, superPullId, empty: '', unit },
    resetOnSuccess: true,
  });
  return (
    <WeightFieldForm
      id={`empty-${superPullId}`}
      label={`Empty weight of super ${tag}, ${unit}`}
      unit={unit}
      button="Save"
      registration={form.register('empty')}
      error={errors.empty?.message}
      pending={pending}
      message={message}
      onSubmit={submit}
    />
  );
}

export function WaxForm({
  lotId,
  unit,
  onSave,
}: {
  lotId: number;
  unit: 'kg' | 'lb';
  onSave: (v: WaxInput) => Promise<ActionResult>;
}) {
  const { form, submit, pending, errors, message } = useActionForm({
    schema: waxInput,
    action: onSave,
    defaultValues: { lotId, wax: '', unit },
    resetOnSuccess: true,
  });
  return (
    <WeightFieldForm
      id="wax"
      label={`Cappings wax, ${unit}`}
      unit={unit}
      button="Record wax"
      registration={form.register('wax')}
      error={errors.wax?.message}
      pending={pending}
      message={message}
      onSubmit={submit}
    />
  );
}
