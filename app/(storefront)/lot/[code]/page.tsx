import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { getPublicLot } from '@/lib/data/trace/public-lot';
import { Caution, INFANT_CAUTION } from '@/components/ui/caution';

export const dynamic = 'force-dynamic';

type Props = { params: Promise<{ code: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: `Lot ${decodeURIComponent((await params).code)}` };
}

const MONTHS = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
];
const monthName = (ym: string) => `${MONTHS[Number(ym.slice(5, 7)) - 1]} ${ym.slice(0, 4)}`;
const dayName = (iso: string) =>
  `${Number(iso.slice(8, 10))} ${MONTHS[Number(iso.slice(5, 7)) - 1]} ${iso.slice(0, 4)}`;

/** What the QR code on a jar opens: where and when this honey was made. No sign-in. */
export default async function PublicLotPage({ params }: Props) {
  const code = decodeURIComponent((await params).code);
  const lot = await getPublicLot(code);
  if (!lot) notFound();
  const rows: [string, string][] = [
    ['Floral source', lot.floralSource || 'Mixed flowers'],
    ['Harvested', lot.harvestMonths.length ? lot.harvestMonths.map(monthName).join(', ') : 'Not recorded'],
    ['Extracted', lot.extractedOn ? monthName(lot.extractedOn.slice(0, 7)) : 'Not recorded'],
    ['Region', lot.region || '—'],
    ['Yards', lot.yardNames.length ? lot.yardNames.join(', ') : '—'],
    [
      'Water content',
      lot.waterPct === null
        ? 'Not measured'
        : `${lot.waterPct.toFixed(1)} %${lot.waterFromParents ? ' (from the lots blended)' : ''}`,
    ],
    ['Best before', lot.bestBeforeOn ? dayName(lot.bestBeforeOn) : '—'],
  ];
  return (
    <article className="mx-auto max-w-2xl space-y-6">
      <header>
        <p className="text-sm text-ink-soft">{lot.businessName}</p>
        <h1>Lot {lot.code}</h1>
        {lot.isBlend ? (
          <p className="text-ink-soft">
            A blend of several of our lots; the harvest months and yards below cover all of them.
          </p>
        ) : null}
      </header>
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-3 card">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="font-semibold text-forest-800">{k}</dt>
            <dd>{v}</dd>
          </div>
        ))}
      </dl>
      {lot.note ? <p className="text-lg">{lot.note}</p> : null}
      <Caution title="For little ones">{INFANT_CAUTION}</Caution>
    </article>
  );
}
