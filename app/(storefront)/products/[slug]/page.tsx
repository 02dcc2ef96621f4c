import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getSettings } from '@/lib/data/settings/settings';
import { getCatalogueItem } from '@/lib/data/shop/catalogue';
import { formatMoney, formatWeight } from '@/lib/domain/units';
import { Caution, INFANT_CAUTION } from '@/components/ui/caution';
import { Chip } from '@/components/ui/chip';
import { AddToCart } from '@/components/shop/add-to-cart';

export const dynamic = 'force-dynamic';

export default async function ProductPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const [settings, item] = await Promise.all([getSettings(), getCatalogueItem(slug)]);
  if (!item) notFound();
  const declared = item.declaredUnit === 'oz' ? `${item.declaredAmount} oz` : `${item.declaredAmount} g`;
  return (
    <article className="grid gap-8 md:grid-cols-2">
      <div>
        {item.photoId ? (
          // eslint-disable-next-line @next/next/no-img-element -- served by our own route
          <img
            src={`/api/products/${item.id}/photo?v=${item.photoId}`}
            alt={item.name}
            className="w-full rounded-card object-cover"
          />
        ) : (
          <div className="flex aspect-[4/3] items-center justify-center rounded-card bg-paper-sunk text-ink-soft">
            {item.containerKind}
          </div>
        )}
      </div>
      <div className="space-y-4">
        <p className="text-sm">
          <Link href="/products">← All honey</Link>
        </p>
        <h1>{item.name}</h1>
        <p className="text-2xl font-semibold tabular-nums">
          {formatMoney(item.priceCents, settings.currency.toUpperCase())}
        </p>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="font-semibold">Net quantity</dt>
          <dd>
            {declared} ({formatWeight(item.netGrams, settings.weightSystem)})
          </dd>
          <dt className="font-semibold">Container</dt>
          <dd>{item.containerKind}</dd>
          <dt className="font-semibold">Floral sources now</dt>
          <dd>{item.floralSources.length ? item.floralSources.join(', ') : '—'}</dd>
          <dt className="font-semibold">Availability</dt>
          <dd>
            {item.available > 0 ? <Chip tone="ok">{item.available} in stock</Chip> : <Chip tone="bad">Sold out</Chip>}
          </dd>
        </dl>
        {item.description ? <p className="whitespace-pre-line">{item.description}</p> : null}
        <AddToCart
          productId={item.id}
          slug={item.slug}
          name={item.name}
          priceCents={item.priceCents}
          available={item.available}
        />
        <Caution title="Food safety">{INFANT_CAUTION}</Caution>
      </div>
    </article>
  );
}
