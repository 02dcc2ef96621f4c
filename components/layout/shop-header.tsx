import Link from 'next/link';
import { ShoppingBasket, UserRound } from 'lucide-react';
import type { SessionUser } from '@/lib/auth/session';
import { CartCount } from '@/components/shop/cart-count';

export function ShopHeader({ businessName, user }: { businessName: string; user: SessionUser | null }) {
  const staff = user && user.role !== 'customer';
  return (
    <header className="border-b border-line bg-paper-raised">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-3 px-4 py-3">
        <Link href="/" className="font-heading text-xl font-bold text-forest-800 no-underline">
          {businessName}
        </Link>
        <nav aria-label="Shop" className="flex items-center gap-1 text-sm">
          <Link className="btn-quiet no-underline" href="/products">
            Shop
          </Link>
          <Link className="btn-quiet no-underline" href="/cart">
            <ShoppingBasket aria-hidden className="h-4 w-4" />
            Cart
            <CartCount />
          </Link>
          {staff ? (
            <Link className="btn-quiet no-underline" href="/admin">
              Back office
            </Link>
          ) : null}
          {user ? (
            <Link className="btn-quiet no-underline" href="/account">
              <UserRound aria-hidden className="h-4 w-4" />
              {user.name.split(' ')[0]}
            </Link>
          ) : (
            <Link className="btn-quiet no-underline" href="/sign-in">
              Sign in
            </Link>
          )}
        </nav>
      </div>
    </header>
  );
}
