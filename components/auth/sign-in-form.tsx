'use client';
import { useState } from 'react';
import { signIn } from 'next-auth/react';
import Link from 'next/link';
import { FormMessage } from '@/components/ui/form-message';

const MESSAGES: Record<string, string> = {
  CredentialsSignin: 'That e-mail and password do not match an account.',
  Throttled: 'Too many attempts. Wait a few minutes, then try again.',
};

export function SignInForm({ next }: { next?: string }) {
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError(undefined);
    const res = await signIn('credentials', { redirect: false, email: String(form.get('email') ?? ''), password: String(form.get('password') ?? '') });
    setBusy(false);
    if (!res || res.error) return setError(MESSAGES[res?.error ?? ''] ?? MESSAGES.CredentialsSignin);
    // Only same-site paths are followed after sign-in.
    const target = next && next.startsWith('/') && !next.startsWith('//') ? next : '/welcome';
    window.location.assign(target);
  }

  return (
    <form onSubmit={onSubmit} className="card space-y-4" noValidate>
      <label className="field" htmlFor="email"><span>E-mail</span>
        <input id="email" name="email" type="email" autoComplete="email" required className="input" />
      </label>
      <label className="field" htmlFor="password"><span>Password</span>
        <input id="password" name="password" type="password" autoComplete="current-password" required className="input" />
      </label>
      <FormMessage error={error} />
      <button type="submit" className="btn-primary w-full" disabled={busy}>{busy ? 'Signing in…' : 'Sign in'}</button>
      <p className="flex justify-between text-sm">
        <Link href="/forgot-password">Forgot your password?</Link>
        <Link href="/sign-up">New here? Create an account</Link>
      </p>
    </form>
  );
}
