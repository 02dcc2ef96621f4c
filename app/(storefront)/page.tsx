import Link from 'next/link';
import { getSettings } from '@/lib/data/settings/settings';
import { listCatalogue } from '@/lib/data/shop/catalogue';
import { Caution, INFANT_CAUTION } from '@/components/ui/caution';
import { ProductCard } from '@/components/shop/product-card';

export const dynamic = 'force-dynamic';

export default async function ShopHome() {
  const [settings, catalogue] = await Promise.all([getSettings(), listCatalogue()]);
  const inStock = catalogue.filter((i) => i.available > 0);
  return (
    <div className="space-y-8">
      <section className="grid gap-6 rounded-card bg-forest-800 px-6 py-10 text-paper sm:px-10">
        <h1 className="text-3xl text-paper sm:text-4xl">Honey from our own colonies</h1>
        <p className="max-w-2xl text-lg whitespace-pre-line text-forest-100">
          {settings.story || 'Raw honey, jarred by hand, every jar traceable to the hives that made it.'}
        </p>
        <div>
          <Link href="/products" className="btn-primary no-underline">
            Browse the jars
          </Link>
        </div>
      </section>
      <section aria-labelledby="in-stock">
        <h2 id="in-stock" className="mb-3">
          In stock now
        </h2>
        {inStock.length ? (
          <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            {inStock.map((item) => (
              <ProductCard key={item.id} item={item} currency={settings.currency} system={settings.weightSystem} />
            ))}
          </ul>
        ) : (
          <p className="text-ink-soft">Every jar is sold for now. New lots are jarred through the season.</p>
        )}
      </section>
      <Caution title="Food safety">{INFANT_CAUTION}</Caution>
    </div>
  );
}
