'use server';
import { headers } from 'next/headers';
import { resetPassword } from '@/lib/data/staff/users';
import { kickAccountRequests, recordAccountRequest } from '@/lib/data/auth/account-requests';
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
import { clientIp } from '@/lib/http/client-ip';
import { PasswordHashingBusyError } from '@/lib/auth/password';

const TOO_MANY = 'Too many requests for now. Wait a few minutes, then try again.';

/**
 * Anyone may sign up, and only ever as a customer: a `role` in the body is dropped by the schema.
 * The answer is the same for a new address and one that already has an account (ASVS 6.3.8): a new
 * address gets a link to choose a password, an existing one a notice to its owner.
 */
export async function signUpAction(input: SignUpInput): Promise<ActionResult> {
  const h = await headers();
  await assertSameOrigin(h);
  const parsed = signUpInput.safeParse(input);
  if (!parsed.success) return fail('Please fix the marked fields.', toFieldErrors(parsed.error));
  const answer = await recordAccountRequest('sign-up', { ...parsed.data, ip: clientIp(h) });
  if (answer === 'throttled') return fail(TOO_MANY);
  void kickAccountRequests();
  return { ok: true };
}

/** Same answer, same work, whether or not the address has an account; the mail is written afterwards. */
export async function forgotPasswordAction(input: ForgotPasswordInput): Promise<ActionResult> {
  const h = await headers();
  await assertSameOrigin(h);
  const parsed = forgotPasswordInput.safeParse(input);
  if (!parsed.success) return fail('Enter a valid e-mail address.', toFieldErrors(parsed.error));
  const answer = await recordAccountRequest('reset', { email: parsed.data.email, ip: clientIp(h) });
  if (answer === 'throttled') return fail(TOO_MANY);
  void kickAccountRequests();
  return { ok: true };
}

export async function resetPasswordAction(input: ResetPasswordInput): Promise<ActionResult> {
  await assertSameOrigin(await headers());
  const parsed = resetPasswordInput.safeParse(input);
  if (!parsed.success) return fail('Please fix the marked fields.', toFieldErrors(parsed.error));
  try {
    const result = await resetPassword(parsed.data.token, parsed.data.password);
    if (result === 'invalid') return fail('This link has expired or was already used. Ask for a new one.');
  } catch (err) {
    if (err instanceof PasswordHashingBusyError) return fail(err.message);
    throw err;
  }
  return { ok: true };
}
