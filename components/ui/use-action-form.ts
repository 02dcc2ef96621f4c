'use client';
import { useState } from 'react';
import { useForm, type DefaultValues, type FieldValues, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import type { ActionResult } from '@/lib/schemas/result';
import type { FormMessageState } from './form-message';

/** Any answer of a `guardedAction` (lib/http/server-action.ts), with or without data. */
export type AnyResult = ActionResult<unknown> | ActionResult;
/** The data of a successful answer (`undefined` for actions that return none). */
export type ResultData<Res extends AnyResult> = Extract<Res, { ok: true }>['data'];

export const OFFLINE_MESSAGE = 'Could not reach the server. Check the connection and try again.';

export type ActionFormOptions<S extends z.ZodType<FieldValues, FieldValues>, Res extends AnyResult> = {
  /** The form's schema from lib/schemas: checked in the browser before the action is called. */
  schema: S;
  /** The server action (or a wrapper around it) that receives the parsed values. */
  action: (values: z.output<S>) => Promise<Res>;
  defaultValues?: DefaultValues<z.input<S>>;
  /** Shown as a status after a successful save; none when left out. */
  successMessage?: string | ((data: ResultData<Res>, values: z.output<S>) => string | undefined);
  /** Runs after a successful save, after the form was reset and the message set (navigate, refresh…). */
  onSuccess?: (data: ResultData<Res>, values: z.output<S>) => void | Promise<void>;
  /** After a successful save: `true` resets to `defaultValues`; a function gets the values as typed and returns the next ones. */
  resetOnSuccess?: boolean | ((typed: z.input<S>) => DefaultValues<z.input<S>>);
};

/**
 * The one form pattern: react-hook-form checks the shared zod schema, then the action runs. Its
 * `ActionResult` is shown the same way in every form: field errors on their fields, the refusal
 * as the form's message, a success message, and `pending` while the action runs. Render the
 * message with `<FormMessage {...message} />`.
 */
export function useActionForm<S extends z.ZodType<FieldValues, FieldValues>, Res extends AnyResult>(options: ActionFormOptions<S, Res>) {
  const { schema, action, defaultValues, successMessage, onSuccess, resetOnSuccess } = options;
  const form = useForm<z.input<S>, unknown, z.output<S>>({ resolver: zodResolver(schema as never) as never, defaultValues });
  const [message, setMessage] = useState<FormMessageState>({});

  const submit = form.handleSubmit(async (values) => {
    const typed = form.getValues();
    setMessage({});
    let result: Res;
    try {
      result = await action(values);
    } catch {
      setMessage({ error: OFFLINE_MESSAGE });
      return;
    }
    if (!result.ok) {
      for (const [name, msg] of Object.entries(result.fieldErrors ?? {})) form.setError(name as Path<z.input<S>>, { message: msg });
      setMessage({ error: result.message });
      return;
    }
    const data = result.data as ResultData<Res>;
    if (resetOnSuccess) form.reset(resetOnSuccess === true ? undefined : resetOnSuccess(typed));
    setMessage({ success: typeof successMessage === 'function' ? successMessage(data, values) : successMessage });
    await onSuccess?.(data, values);
  });

  return { form, submit, pending: form.formState.isSubmitting, errors: form.formState.errors, message, setMessage };
}
