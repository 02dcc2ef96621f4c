import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';

/** Where to go after signing in: staff to the back office, customers to their account. */
export async function GET() {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  redirect(user.role === 'customer' ? '/account' : '/admin');
}
