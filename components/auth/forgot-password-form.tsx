'use client';
import { useState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import type { ActionResult } from '@/lib/schemas/result';
import type { ForgotPasswordInput } from '@/lib/schemas/auth';

export function ForgotPasswordForm({ onRequest }: { onRequest: (v: ForgotPasswordInput) => Promise<ActionResult> }) {
  const [state, setState] = useState<{ error?: string; success?: string; busy?: boolean }>({});
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setState({ busy: true });
    const result = await onRequest({ email: String(new FormData(e.currentTarget).get('email') ?? '') });
    setState(result.ok
      ? { success: 'If an account uses that address, a reset link is on its way. Check your inbox.' }
      : { error: result.message });
  }
  return (
    <form onSubmit={onSubmit} className="card space-y-4" noValidate>
      <label className="field" htmlFor="email"><span>E-mail</span>
        <input id="email" name="email" type="email" autoComplete="email" required className="input" />
      </label>
      <FormMessage error={state.error} success={state.success} />
      <button type="submit" className="btn-primary w-full" disabled={state.busy}>Send reset link</button>
    </form>
  );
}
