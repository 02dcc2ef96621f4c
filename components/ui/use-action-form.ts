'use client';
import { useState } from 'react';
import { get, useForm, type DefaultValues, type FieldError, type FieldValues, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import type { ActionResult } from '@/lib/schemas/result';
import type { FormMessageState } from './form-message';

/** Any answer of a `guardedAction` (lib/http/server-action.ts), with or without data. */
export type AnyResult = ActionResult<unknown> | ActionResult;
/** The data of a successful answer (`undefined` for actions that return none). */
export type ResultData<Res extends AnyResult> = Extract<Res, { ok: true }>['data'];

export const OFFLINE_MESSAGE = 'Could not reach the server. Check the connection and try again.';
const REFUSED_MESSAGE = 'That did not work. Try again.';

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
 *
 * `submit` is the form's onSubmit. `run(input)` is for controls without fields of their own (a
 * button, a select that saves on change, a scanner): it checks `input` with the same schema,
 * handles the answer the same way and also returns it (undefined if the input or the connection
 * failed).
 *
 * `field(name)` is the field's `registration` and `error` together, for a TextField:
 * `<TextField label="E-mail" {...field('email')} />`.
 */
export function useActionForm<S extends z.ZodType<FieldValues, FieldValues>, Res extends AnyResult>(
  options: ActionFormOptions<S, Res>,
) {
  const { schema, action, defaultValues, successMessage, onSuccess, resetOnSuccess } = options;
  const form = useForm<z.input<S>, unknown, z.output<S>>({
    resolver: zodResolver(schema as never) as never,
    defaultValues,
  });
  const [message, setMessage] = useState<FormMessageState>({});
  const [running, setRunning] = useState(false);

  async function save(values: z.output<S>, typed: z.input<S>): Promise<Res | undefined> {
    setMessage({});
    let result: Res;
    try {
      result = await action(values);
    } catch {
      setMessage({ error: OFFLINE_MESSAGE });
      return undefined;
    }
    if (!result.ok) {
      for (const [name, msg] of Object.entries(result.fieldErrors ?? {}))
        form.setError(name as Path<z.input<S>>, { message: msg });
      setMessage({ error: result.message ?? (result.fieldErrors ? 'Please fix the marked fields.' : REFUSED_MESSAGE) });
      return result;
    }
    const data = result.data as ResultData<Res>;
    if (resetOnSuccess) form.reset(resetOnSuccess === true ? undefined : resetOnSuccess(typed));
    setMessage({ success: typeof successMessage === 'function' ? successMessage(data, values) : successMessage });
    await onSuccess?.(data, values);
    return result;
  }

  const submit = form.handleSubmit(async (values) => {
    await save(values, form.getValues());
  });

  async function run(input: z.input<S>): Promise<Res | undefined> {
    const parsed = schema.safeParse(input);
    if (!parsed.success) {
      setMessage({ error: parsed.error.issues[0]?.message });
      return undefined;
    }
    setRunning(true);
    try {
      return await save(parsed.data as z.output<S>, input);
    } finally {
      setRunning(false);
    }
  }

  const field = (name: Path<z.input<S>>) => ({
    registration: form.register(name),
    error: get(form.formState.errors, name) as FieldError | undefined,
  });

  return {
    form,
    field,
    submit,
    run,
    pending: form.formState.isSubmitting || running,
    errors: form.formState.errors,
    message,
    setMessage,
  };
}
