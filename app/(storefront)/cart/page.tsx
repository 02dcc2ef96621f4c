import { getSettings } from '@/lib/data/settings/settings';
import { PageHeader } from '@/components/ui/page-header';
import { CartView } from '@/components/shop/cart-view';

export const metadata = { title: 'Your cart' };

export default async function CartPage({ searchParams }: { searchParams: Promise<{ cancelled?: string }> }) {
  const [settings, sp] = await Promise.all([getSettings(), searchParams]);
  return (
    <div>
      <PageHeader title="Your cart" />
      <CartView currency={settings.currency} cancelled={sp.cancelled === '1'} />
    </div>
  );
}
