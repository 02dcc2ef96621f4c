import { SignInForm } from '@/components/auth/sign-in-form';
import { safeRedirectPath } from '@/lib/http/redirect-target';

export const metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  return (
    <div className="space-y-4">
      <h1>Sign in</h1>
      <SignInForm next={safeRedirectPath(next)} />
    </div>
  );
}
