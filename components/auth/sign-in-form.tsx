'use client';
import { signIn } from 'next-auth/react';
import Link from 'next/link';
import { signInInput } from '@/lib/schemas/auth';
import { fail, type ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
import { safeRedirectPath } from '@/lib/http/redirect-target';

const MESSAGES: Record<string, string> = {
  CredentialsSignin: 'That e-mail and password do not match an account.',
  Throttled: 'Too many attempts. Wait a few minutes, then try again.',
  Busy: 'The server is busy. Wait a minute, then try again.',
};

export function SignInForm({ next }: { next?: string }) {
  const { field, submit, pending, message } = useActionForm({
    schema: signInInput,
    defaultValues: { email: '', password: '' },
    action: async ({ email, password }): Promise<ActionResult> => {
      const res = await signIn('credentials', { redirect: false, email, password });
      return !res || res.error ? fail(MESSAGES[res?.error ?? ''] ?? MESSAGES.CredentialsSignin) : { ok: true };
    },
    onSuccess: () => {
      // Only our own pages are followed after sign-in; anything else goes to the role's home.
      window.location.assign(safeRedirectPath(next));
    },
  });

  return (
    <form onSubmit={submit} className="space-y-4 card" noValidate>
      <TextField label="E-mail" type="email" {...field('email')} autoComplete="email" required />
      <TextField label="Password" type="password" {...field('password')} autoComplete="current-password" required />
      <FormMessage {...message} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        {pending ? 'Signing in…' : 'Sign in'}
      </button>
      <p className="flex justify-between text-sm">
        <Link href="/forgot-password">Forgot your password?</Link>
        <Link href="/sign-up">New here? Create an account</Link>
      </p>
    </form>
  );
}
