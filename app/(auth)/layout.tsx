import { ShopHeader } from '@/components/layout/shop-header';
import { SiteFooter } from '@/components/layout/site-footer';
import { currentUser } from '@/lib/auth/session';
import { getSettings } from '@/lib/data/settings/settings';

export default async function AuthLayout({ children }: { children: React.ReactNode }) {
  const [settings, user] = await Promise.all([getSettings(), currentUser()]);
  return (
    <>
      <ShopHeader businessName={settings.businessName} user={user} />
      <main id="main" className="mx-auto max-w-md px-4 py-10">
        {children}
      </main>
      <SiteFooter businessName={settings.businessName} address={settings.address} />
    </>
  );
}
