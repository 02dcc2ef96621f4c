import { getSettings } from '@/lib/data/settings/settings';
import { currentUser } from '@/lib/auth/session';
import { PageHeader } from '@/components/ui/page-header';
import { CheckoutForm } from '@/components/shop/checkout-form';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Check out' };

export default async function CheckoutPage() {
  const [settings, user] = await Promise.all([getSettings(), currentUser()]);
  return (
    <div>
      <PageHeader
        title="Check out"
        lead="You pay on the card page of our payment provider; we never see your card number."
      />
      <CheckoutForm
        currency={settings.currency}
        bands={settings.shippingBands ?? []}
        pickupAddress={settings.address}
        user={user?.role === 'customer' ? { name: user.name, email: user.email } : null}
      />
    </div>
  );
}
