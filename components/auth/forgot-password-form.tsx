'use client';
import { forgotPasswordInput, type ForgotPasswordInput } from '@/lib/schemas/auth';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

export function ForgotPasswordForm({ onRequest }: { onRequest: (v: ForgotPasswordInput) => Promise<ActionResult> }) {
  const { field, submit, pending, message } = useActionForm({
    schema: forgotPasswordInput,
    defaultValues: { email: '' },
    action: onRequest,
    successMessage: 'If an account uses that address, a reset link is on its way. Check your inbox.',
  });
  return (
    <form onSubmit={submit} className="space-y-4 card" noValidate>
      <TextField label="E-mail" type="email" {...field('email')} autoComplete="email" required />
      <FormMessage {...message} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        Send reset link
      </button>
    </form>
  );
}
