import Link from 'next/link';
import { redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/session';
import { listCustomerOrders } from '@/lib/data/orders/read';
import { formatMoney } from '@/lib/domain/units';
import { formatDateTime } from '@/lib/domain/order-dates';
import { getSettings } from '@/lib/data/settings/settings';
import { SignOutButton } from '@/components/auth/sign-out-button';
import { OrderStatusChip } from '@/components/orders/order-status-chip';

export const metadata = { title: 'Your account' };
export const dynamic = 'force-dynamic';

export default async function AccountPage() {
  const user = await currentUser();
  if (!user) redirect('/sign-in?next=/account');
  const orders = user.role === 'customer' ? await listCustomerOrders(user.id) : [];
  const { timeZone } = await getSettings();
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Hello, {user.name}</h1>
        <SignOutButton />
      </div>
      <section className="card space-y-3">
        <h2>Your orders</h2>
        {orders.length === 0 ? (
          <p className="text-ink-soft">Orders you place while signed in as {user.email} appear here. <Link href="/products">Browse the jars</Link>.</p>
        ) : (
          <table className="data-table">
            <thead><tr><th scope="col">Order</th><th scope="col">Placed</th><th scope="col">Status</th><th scope="col" className="num">Jars</th><th scope="col" className="num">Total</th></tr></thead>
            <tbody>
              {orders.map((o) => (
                <tr key={o.id}>
                  <td><Link href={`/orders/${o.number}`}>{o.number}</Link></td>
                  <td>{formatDateTime(o.createdAt, timeZone, false)}</td>
                  <td><OrderStatusChip status={o.status} /></td>
                  <td className="num">{o.jars}</td>
                  <td className="num">{formatMoney(o.totalCents, o.currency.toUpperCase())}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}
