'use client';
import Link from 'next/link';
import { resetPasswordInput, type ResetPasswordInput } from '@/lib/schemas/auth';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

// The token comes from the link, not from the person: the server checks it and says so if it is not valid.
const passwordOnly = resetPasswordInput.pick({ password: true });

export function ResetPasswordForm({
  token,
  onReset,
}: {
  token: string;
  onReset: (v: ResetPasswordInput) => Promise<ActionResult>;
}) {
  const { field, submit, pending, message } = useActionForm({
    schema: passwordOnly,
    defaultValues: { password: '' },
    action: ({ password }) => onReset({ token, password }),
    successMessage: 'Your password is set.',
  });
  if (message.success) {
    return (
      <div className="space-y-3 card">
        <FormMessage {...message} />
        <Link className="btn-primary no-underline" href="/sign-in">
          Sign in
        </Link>
      </div>
    );
  }
  return (
    <form onSubmit={submit} className="space-y-4 card" noValidate>
      <TextField
        label="New password"
        type="password"
        {...field('password')}
        autoComplete="new-password"
        required
        hint="At least 8 characters. A long phrase is best."
      />
      <FormMessage {...message} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        Save password
      </button>
    </form>
  );
}
