'use client';
import { signUpInput, type SignUpInput } from '@/lib/schemas/auth';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

/** Name and e-mail only: the password is chosen through the link we mail, which proves the address. */
export function SignUpForm({ onSignUp }: { onSignUp: (v: SignUpInput) => Promise<ActionResult> }) {
  const { field, submit, pending, message } = useActionForm({
    schema: signUpInput,
    defaultValues: { name: '', email: '' },
    action: onSignUp,
    successMessage:
      'Check your mail: we sent a link to that address. Open it to choose your password and finish creating your account.',
  });

  if (message.success) {
    return (
      <div className="space-y-3 card">
        <FormMessage {...message} />
      </div>
    );
  }
  return (
    <form onSubmit={submit} className="space-y-4 card" noValidate>
      <TextField label="Your name" {...field('name')} autoComplete="name" />
      <TextField
        label="E-mail"
        type="email"
        {...field('email')}
        autoComplete="email"
        hint="We send a link to this address; you choose your password from there."
      />
      <FormMessage {...message} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        {pending ? 'Sending…' : 'Create account'}
      </button>
    </form>
  );
}
