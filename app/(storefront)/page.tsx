import Link from 'next/link';
import { getSettings } from '@/lib/data/settings';
import { Caution, INFANT_CAUTION } from '@/components/ui/caution';

export const dynamic = 'force-dynamic';

export default async function ShopHome() {
  const settings = await getSettings();
  return (
    <div className="space-y-8">
      <section className="grid gap-6 rounded-card bg-forest-800 px-6 py-10 text-paper sm:px-10">
        <h1 className="text-3xl text-paper sm:text-4xl">Honey from our own colonies</h1>
        <p className="max-w-2xl whitespace-pre-line text-lg text-forest-100">{settings.story || 'Raw honey, jarred by hand, every jar traceable to the hives that made it.'}</p>
        <div><Link href="/products" className="btn-primary no-underline">Browse the jars</Link></div>
      </section>
      <Caution title="Food safety">{INFANT_CAUTION}</Caution>
    </div>
  );
}
