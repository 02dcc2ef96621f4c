import type { InputHTMLAttributes } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

type Props = InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  registration: UseFormRegisterReturn;
  error?: { message?: string };
  hint?: string;
};

/** A labelled input with its error announced to screen readers. */
export function TextField({ label, registration, error, hint, id, ...rest }: Props) {
  const inputId = id ?? registration.name;
  const describedBy =
    [error ? `${inputId}-error` : null, hint ? `${inputId}-hint` : null].filter(Boolean).join(' ') || undefined;
  return (
    <label className="field" htmlFor={inputId}>
      <span>{label}</span>
      <input
        id={inputId}
        className="input"
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        {...registration}
        {...rest}
      />
      {hint ? (
        <small id={`${inputId}-hint`} className="hint">
          {hint}
        </small>
      ) : null}
      {error?.message ? (
        <small id={`${inputId}-error`} className="field-error" role="alert">
          {error.message}
        </small>
      ) : null}
    </label>
  );
}
