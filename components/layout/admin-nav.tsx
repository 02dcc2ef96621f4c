'use client';
import Link from 'next/link';
import { usePathname } from 'next/navigation';

/** The role's own menu; the current page is marked for screen readers too. */
export function AdminNav({ items }: { items: { href: string; label: string }[] }) {
  const path = usePathname();
  return (
    <nav aria-label="Back office" className="overflow-x-auto">
      <ul className="flex gap-1 text-sm lg:flex-col">
        {items.map((item) => {
          const active = item.href === '/admin' ? path === '/admin' : path.startsWith(item.href);
          return (
            <li key={item.href}>
              <Link
                href={item.href}
                aria-current={active ? 'page' : undefined}
                className={`flex min-h-11 items-center rounded-lg px-3 whitespace-nowrap no-underline ${active ? 'bg-forest-700 text-white' : 'text-forest-800 hover:bg-forest-50'}`}
              >
                {item.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
