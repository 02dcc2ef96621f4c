'use client';
import { useState } from 'react';
import type { FieldValues, Path, UseFormReturn } from 'react-hook-form';
import type { ActionResult } from '@/lib/schemas/result';

/** Shows an action's answer: field errors on the fields, the message above the button. */
export function useResult<T extends FieldValues>(form: UseFormReturn<T>) {
  const [msg, setMsg] = useState<{ error?: string; success?: string }>({});
  function apply<R>(result: ActionResult<R>, success?: string): boolean {
    if (result.ok) {
      setMsg({ success });
      return true;
    }
    for (const [name, message] of Object.entries(result.fieldErrors ?? {})) form.setError(name as Path<T>, { message });
    setMsg({ error: result.message });
    return false;
  }
  return { msg, setMsg, apply };
}
