'use client';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { signIn } from 'next-auth/react';
import { z } from 'zod';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import type { ActionResult } from '@/lib/schemas/result';
import type { SignUpInput } from '@/lib/schemas/auth';

// The browser checks shape only; the password rules (length, common list) are the server's.
const clientSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name.').max(120),
  email: z.string().trim().email('Enter a valid e-mail address.'),
  password: z.string().min(8, 'Use at least 8 characters.'),
});

export function SignUpForm({ onSignUp }: { onSignUp: (v: SignUpInput) => Promise<ActionResult> }) {
  const form = useForm<z.input<typeof clientSchema>>({ resolver: zodResolver(clientSchema) });
  const [error, setError] = useState<string>();
  const { errors, isSubmitting } = form.formState;

  async function submit(values: z.input<typeof clientSchema>) {
    setError(undefined);
    const result = await onSignUp(values);
    if (!result.ok) {
      for (const [name, message] of Object.entries(result.fieldErrors ?? {})) form.setError(name as keyof SignUpInput, { message });
      return setError(result.message);
    }
    await signIn('credentials', { redirect: false, email: values.email, password: values.password });
    window.location.assign('/account');
  }

  return (
    <form onSubmit={form.handleSubmit(submit)} className="card space-y-4" noValidate>
      <TextField label="Your name" registration={form.register('name')} error={errors.name} autoComplete="name" />
      <TextField label="E-mail" type="email" registration={form.register('email')} error={errors.email} autoComplete="email" />
      <TextField label="Password" type="password" registration={form.register('password')} error={errors.password} autoComplete="new-password"
        hint="At least 8 characters. A long phrase is best; pasting from a password manager is fine." />
      <FormMessage error={error} />
      <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>{isSubmitting ? 'Creating…' : 'Create account'}</button>
    </form>
  );
}
