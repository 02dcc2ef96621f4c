import { Chip } from '@/components/ui/chip';

/** A run's fill check as a word: passed, failed (not in stock) or overridden by the owner. */
export function RunStatus({ pass, overridden }: { pass: boolean; overridden: boolean }) {
  if (pass) return <Chip tone="ok">passed</Chip>;
  if (overridden) return <Chip tone="warn">failed · overridden</Chip>;
  return <Chip tone="bad">failed · not in stock</Chip>;
}
