'use client';
import { useState } from 'react';
import Link from 'next/link';
import { FormMessage } from '@/components/ui/form-message';
import type { ActionResult } from '@/lib/schemas/result';
import type { ResetPasswordInput } from '@/lib/schemas/auth';

export function ResetPasswordForm({ token, onReset }: { token: string; onReset: (v: ResetPasswordInput) => Promise<ActionResult> }) {
  const [state, setState] = useState<{ error?: string; done?: boolean; busy?: boolean }>({});
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setState({ busy: true });
    const result = await onReset({ token, password: String(new FormData(e.currentTarget).get('password') ?? '') });
    setState(result.ok ? { done: true } : { error: result.fieldErrors?.password ?? result.message });
  }
  if (state.done) {
    return (
      <div className="card space-y-3">
        <FormMessage success="Your password is set." />
        <Link className="btn-primary no-underline" href="/sign-in">Sign in</Link>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} className="card space-y-4" noValidate>
      <label className="field" htmlFor="password"><span>New password</span>
        <input id="password" name="password" type="password" autoComplete="new-password" required className="input" aria-describedby="password-hint" />
        <small id="password-hint" className="hint">At least 8 characters. A long phrase is best.</small>
      </label>
      <FormMessage error={state.error} />
      <button type="submit" className="btn-primary w-full" disabled={state.busy}>Save password</button>
    </form>
  );
}
