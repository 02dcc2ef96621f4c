import { getSettings } from '@/lib/data/settings/settings';
import { listCatalogue } from '@/lib/data/shop/catalogue';
import { PageHeader } from '@/components/ui/page-header';
import { Caution, INFANT_CAUTION } from '@/components/ui/caution';
import { ProductCard } from '@/components/shop/product-card';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Shop' };

export default async function CataloguePage() {
  const [settings, catalogue] = await Promise.all([getSettings(), listCatalogue()]);
  return (
    <div className="space-y-6">
      <PageHeader
        title="Our honey"
        lead="Every jar carries a lot code that leads back to the yards and colonies it came from."
      />
      {catalogue.length ? (
        <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {catalogue.map((item) => (
            <ProductCard key={item.id} item={item} currency={settings.currency} system={settings.weightSystem} />
          ))}
        </ul>
      ) : (
        <p className="text-ink-soft">Nothing is for sale yet.</p>
      )}
      <Caution title="Food safety">{INFANT_CAUTION}</Caution>
    </div>
  );
}
