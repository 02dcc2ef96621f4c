import { z } from 'zod';
import { safeString } from './fields';
import { passwordProblem } from '@/lib/domain/password-rules';

export const email = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long.')
  .email('Enter a valid e-mail address.');
export const personName = safeString().trim().min(1, 'Enter a name.').max(120, 'Keep the name under 120 characters.');

export const password = z.string().superRefine((value, ctx) => {
  const problem = passwordProblem(value);
  if (problem) ctx.addIssue({ code: 'custom', message: problem });
});

/** What the sign-in form sends to next-auth's credentials provider, which parses it again. */
export const signInInput = z.object({ email, password: z.string().min(1, 'Enter your password.').max(1024) });
export type SignInInput = z.input<typeof signInInput>;

// .strict() is not used: extra fields such as `role` are dropped by zod, never trusted.
// No password here: the new customer chooses one through the link mailed to the address, so a
// sign-up proves the mailbox and answers the same whether or not the address has an account.
export const signUpInput = z.object({ name: personName, email });
export type SignUpInput = z.input<typeof signUpInput>;

export const forgotPasswordInput = z.object({ email });
export type ForgotPasswordInput = z.input<typeof forgotPasswordInput>;

export const resetPasswordInput = z.object({ token: z.string().min(20).max(200), password });
export type ResetPasswordInput = z.input<typeof resetPasswordInput>;
