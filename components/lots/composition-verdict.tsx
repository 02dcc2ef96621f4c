import { Chip } from '@/components/ui/chip';
import { HONEY_SOURCES, type HoneyCategory } from '@/lib/domain/lab-results';
import type { CompositionRow } from '@/lib/data/lots/detail';

const NAMES: Record<CompositionRow['criterion'], [string, string]> = {
  water: ['Water', '%'],
  sugars: ['Fructose + glucose', 'g/100 g'],
  sucrose: ['Sucrose', 'g/100 g'],
  insoluble: ['Water-insoluble content', 'g/100 g'],
  conductivity: ['Electrical conductivity', 'mS/cm'],
  'free-acid': ['Free acid', 'meq/kg'],
  diastase: ['Diastase activity', 'Schade'],
  hmf: ['HMF', 'mg/kg'],
};
const ORIGIN = {
  blossom: 'blossom honey',
  honeydew: 'honeydew honey',
  'honeydew-blossom-blend': 'honeydew–blossom blend',
};

/** Words for a lot's honey category, as the composition check reads it. */
export function categoryWords(c: HoneyCategory): string {
  const parts: string[] = [ORIGIN[c.origin]];
  if (c.source) parts.push(HONEY_SOURCES[c.source as keyof typeof HONEY_SOURCES] ?? c.source);
  if (c.bakers) parts.push('baker’s honey');
  if (c.pressed) parts.push('pressed');
  if (c.tropical) parts.push('declared tropical origin');
  if (c.lowEnzyme) parts.push('low natural enzyme content');
  return parts.join(' · ');
}

/** The lot's composition verdict per criterion of Council Directive 2001/110/EC, Annex II. */
export function CompositionVerdict({ rows, category }: { rows: CompositionRow[]; category: HoneyCategory }) {
  return (
    <div className="space-y-2">
      <p className="text-sm">
        Composition (Council Directive 2001/110/EC, Annex II) for <strong>{categoryWords(category)}</strong>. Water is
        judged from the moisture readings above. Local food law decides; Combtrace records and warns.
      </p>
      <div className="overflow-x-auto">
        <table className="data-table" aria-label="Composition verdict">
          <thead>
            <tr>
              <th scope="col">Criterion</th>
              <th scope="col" className="num">
                Latest result
              </th>
              <th scope="col">Limit for this honey</th>
              <th scope="col">Verdict</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => {
              const [name, unit] = NAMES[r.criterion];
              const limit =
                r.min !== null ? `at least ${r.min} ${unit}` : r.max !== null ? `at most ${r.max} ${unit}` : 'no limit';
              return (
                <tr key={r.criterion}>
                  <th scope="row">{name}</th>
                  <td className="num">{r.value === null ? '—' : `${r.value} ${unit}`}</td>
                  <td>{limit}</td>
                  <td>
                    {r.pass === null ? (
                      <Chip>{r.value === null ? 'not measured' : 'no limit'}</Chip>
                    ) : r.pass ? (
                      <Chip tone="ok">meets</Chip>
                    ) : (
                      <Chip tone="bad">fails</Chip>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
