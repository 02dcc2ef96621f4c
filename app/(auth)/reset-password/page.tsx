import Link from 'next/link';
import { ResetPasswordForm } from '@/components/auth/reset-password-form';
import { resetPasswordAction } from '../actions';

export const metadata = { title: 'Choose a password' };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  return (
    <div className="space-y-4">
      <h1>Choose a password</h1>
      {token ? (
        <ResetPasswordForm token={token} onReset={resetPasswordAction} />
      ) : (
        <p>
          This link is incomplete. <Link href="/forgot-password">Ask for a new one.</Link>
        </p>
      )}
    </div>
  );
}
