import { INFANT_CAUTION } from '@/components/ui/caution';

export function SiteFooter({ businessName, address }: { businessName: string; address?: string }) {
  return (
    <footer className="mt-16 border-t border-line bg-paper-sunk">
      <div className="mx-auto flex max-w-6xl flex-col gap-2 px-4 py-6 text-sm text-ink-soft sm:flex-row sm:justify-between">
        <div>
          <p className="font-heading font-semibold text-forest-800">{businessName}</p>
          {address ? <p className="whitespace-pre-line">{address}</p> : null}
        </div>
        <div className="sm:text-right">
          <p>{INFANT_CAUTION}</p>
          <p>Runs on Combtrace.</p>
        </div>
      </div>
    </footer>
  );
}
