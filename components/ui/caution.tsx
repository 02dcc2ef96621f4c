import { TriangleAlert } from 'lucide-react';

/** The usual safety and legal reminders; Combtrace records and warns, it does not certify. */
export function Caution({ children, title = 'Caution' }: { children: React.ReactNode; title?: string }) {
  return (
    <div className="flex gap-3 caution" role="note" aria-label={title}>
      <TriangleAlert aria-hidden className="mt-0.5 h-5 w-5 shrink-0" />
      <div>{children}</div>
    </div>
  );
}

export const INFANT_CAUTION = 'Honey is not for infants under 12 months.';
