'use server';
import { headers } from 'next/headers';
import { createCustomer, EmailTakenError, requestPasswordReset, resetPassword } from '@/lib/data/staff/users';
import {
  forgotPasswordInput,
  resetPasswordInput,
  signUpInput,
  type ForgotPasswordInput,
  type ResetPasswordInput,
  type SignUpInput,
} from '@/lib/schemas/auth';
import { fail, toFieldErrors, type ActionResult } from '@/lib/schemas/result';
import { assertSameOrigin } from '@/lib/http/origin';

/** Anyone may sign up, and only ever as a customer: a `role` in the body is dropped by the schema. */
export async function signUpAction(input: SignUpInput): Promise<ActionResult> {
  await assertSameOrigin(await headers());
  const parsed = signUpInput.safeParse(input);
  if (!parsed.success) return fail('Please fix the marked fields.', toFieldErrors(parsed.error));
  try {
    await createCustomer(parsed.data);
    return { ok: true };
  } catch (err) {
    if (err instanceof EmailTakenError) return fail(err.message, { email: err.message });
    throw err;
  }
}

export async function forgotPasswordAction(input: ForgotPasswordInput): Promise<ActionResult> {
  await assertSameOrigin(await headers());
  const parsed = forgotPasswordInput.safeParse(input);
  if (!parsed.success) return fail('Enter a valid e-mail address.', toFieldErrors(parsed.error));
  await requestPasswordReset(parsed.data.email);
  return { ok: true };
}

export async function resetPasswordAction(input: ResetPasswordInput): Promise<ActionResult> {
  await assertSameOrigin(await headers());
  const parsed = resetPasswordInput.safeParse(input);
  if (!parsed.success) return fail('Please fix the marked fields.', toFieldErrors(parsed.error));
  const result = await resetPassword(parsed.data.token, parsed.data.password);
  if (result === 'invalid') return fail('This link has expired or was already used. Ask for a new one.');
  return { ok: true };
}
