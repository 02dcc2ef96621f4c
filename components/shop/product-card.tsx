import Link from 'next/link';
import { formatMoney, formatWeight, type UnitSystem } from '@/lib/domain/units';
import { Chip } from '@/components/ui/chip';
import type { CatalogueItem } from '@/lib/data/shop/catalogue';

export function ProductCard({ item, currency, system }: { item: CatalogueItem; currency: string; system: UnitSystem }) {
  return (
    <li className="flex flex-col gap-2 card">
      {item.photoId ? (
        // eslint-disable-next-line @next/next/no-img-element -- served by our own route, sizes vary
        <img
          src={`/api/products/${item.id}/photo?v=${item.photoId}`}
          alt=""
          className="aspect-[4/3] w-full rounded-lg object-cover"
          loading="lazy"
        />
      ) : null}
      <h2 className="text-lg">
        <Link href={`/products/${item.slug}`}>{item.name}</Link>
      </h2>
      <p className="text-sm text-ink-soft">
        {formatWeight(item.netGrams, system)} net · {item.containerKind}
      </p>
      {item.floralSources.length ? <p className="text-sm">{item.floralSources.join(', ')}</p> : null}
      <div className="mt-auto flex items-center justify-between gap-2">
        <span className="text-lg font-semibold tabular-nums">
          {formatMoney(item.priceCents, currency.toUpperCase())}
        </span>
        {item.available > 0 ? <Chip tone="ok">In stock</Chip> : <Chip tone="bad">Sold out</Chip>}
      </div>
    </li>
  );
}
