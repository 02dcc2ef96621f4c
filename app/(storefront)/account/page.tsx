import Link from 'next/link';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';
import { listCustomerOrders } from '@/lib/data/orders/list';
import { customerOrderListQuery } from '@/lib/schemas/orders';
import { getSettings } from '@/lib/data/settings/settings';
import { SignOutButton } from '@/components/auth/sign-out-button';
import { AccountOrdersTable } from '@/components/orders/order-tables';

export const metadata = { title: 'Your account' };
export const dynamic = 'force-dynamic';

export default async function AccountPage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in?next=/account');
  const orders = await listCustomerOrders(user, customerOrderListQuery.parse({}));
  const { timeZone } = await getSettings();
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Hello, {user.name}</h1>
        <SignOutButton />
      </div>
      <section className="space-y-3">
        <h2>Your orders</h2>
        {orders.total === 0 ? (
          <p className="card text-ink-soft">
            Orders you place while signed in as {user.email} appear here. <Link href="/products">Browse the jars</Link>.
          </p>
        ) : (
          <AccountOrdersTable initial={orders} timeZone={timeZone} />
        )}
      </section>
    </div>
  );
}
