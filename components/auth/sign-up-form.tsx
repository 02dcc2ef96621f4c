'use client';
import { signIn } from 'next-auth/react';
import { signUpInput, type SignUpInput } from '@/lib/schemas/auth';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

export function SignUpForm({ onSignUp }: { onSignUp: (v: SignUpInput) => Promise<ActionResult> }) {
  const { field, submit, pending, message } = useActionForm({
    schema: signUpInput,
    defaultValues: { name: '', email: '', password: '' },
    action: onSignUp,
    onSuccess: async (_, values) => {
      await signIn('credentials', { redirect: false, email: values.email, password: values.password });
      // A full page load, so the header and every server component see the new session cookie.
      // eslint-disable-next-line @next/next/no-location-assign-relative-destination
      window.location.assign('/account');
    },
  });

  return (
    <form onSubmit={submit} className="space-y-4 card" noValidate>
      <TextField label="Your name" {...field('name')} autoComplete="name" />
      <TextField label="E-mail" type="email" {...field('email')} autoComplete="email" />
      <TextField
        label="Password"
        type="password"
        {...field('password')}
        autoComplete="new-password"
        hint="At least 8 characters. A long phrase is best; pasting from a password manager is fine."
      />
      <FormMessage {...message} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        {pending ? 'Creating…' : 'Create account'}
      </button>
    </form>
  );
}
