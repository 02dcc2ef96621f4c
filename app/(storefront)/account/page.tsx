import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';
import { SignOutButton } from '@/components/auth/sign-out-button';

export const metadata = { title: 'Your account' };

export default async function AccountPage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in?next=/account');
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Hello, {user.name}</h1>
        <SignOutButton />
      </div>
      <section className="card">
        <h2>Your orders</h2>
        <p className="mt-2 text-ink-soft">Orders you place while signed in as {user.email} appear here.</p>
      </section>
    </div>
  );
}
