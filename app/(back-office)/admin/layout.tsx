import Link from 'next/link';
import { requirePermission } from '@/lib/auth/session';
import { menuFor } from '@/lib/auth/roles';
import { getSettings } from '@/lib/data/settings/settings';
import { AdminNav } from '@/components/layout/admin-nav';
import { SignOutButton } from '@/components/auth/sign-out-button';

export const dynamic = 'force-dynamic';

const ROLE_NAMES = { owner: 'Owner', keeper: 'Keeper', crew: 'Honey house', customer: 'Customer' } as const;

export default async function BackOfficeLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePermission('backoffice.enter');
  const settings = await getSettings();
  return (
    <div className="min-h-screen">
      <header className="bg-forest-800 text-paper">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center justify-between gap-2 px-4 py-3">
          <Link href="/admin" className="font-heading text-lg font-bold text-paper no-underline">
            {settings.businessName}
          </Link>
          <div className="flex items-center gap-3 text-sm">
            <span>
              <span className="sr-only">Signed in as </span>
              {user.name} · {ROLE_NAMES[user.role]}
            </span>
            <SignOutButton />
          </div>
        </div>
      </header>
      <div className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6 lg:flex-row">
        <aside className="lg:w-52 lg:shrink-0">
          <AdminNav items={menuFor(user.role).map(({ href, label }) => ({ href, label }))} />
        </aside>
        <main id="main" className="min-w-0 flex-1">
          {children}
        </main>
      </div>
    </div>
  );
}
