'use client';
import { useState } from 'react';
import { useForm, type DefaultValues, type FieldValues, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';

/**
 * react-hook-form + zod wired to a server action: field errors from the server land on their
 * fields, a general refusal in `message`, success in `done`.
 */
export type SaveResult = { ok: true; data?: unknown } | { ok: false; message?: string; fieldErrors?: Record<string, string> };

export function useActionForm<S extends z.ZodType<FieldValues, FieldValues>>(
  schema: S,
  onSave: (input: z.input<S>) => Promise<SaveResult>,
  defaultValues: DefaultValues<z.input<S>>,
  after?: (data: unknown) => void,
) {
  const form = useForm<z.input<S>, unknown, z.output<S>>({ resolver: zodResolver(schema as never) as never, defaultValues });
  const [message, setMessage] = useState<string | undefined>();
  const [done, setDone] = useState<string | undefined>();
  const submit = form.handleSubmit(async (values) => {
    setMessage(undefined);
    setDone(undefined);
    let result: SaveResult;
    try {
      result = await onSave(values as z.input<S>);
    } catch {
      setMessage('Could not reach the server. Check the connection and try again.');
      return;
    }
    if (result.ok) {
      setDone('Saved.');
      after?.(result.data);
      return;
    }
    for (const [name, msg] of Object.entries(result.fieldErrors ?? {})) form.setError(name as Path<z.input<S>>, { message: msg });
    setMessage(result.message);
  });
  return { form, submit, message, done, setDone };
}
