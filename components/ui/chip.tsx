export type ChipTone = 'ok' | 'warn' | 'bad' | 'info' | 'neutral';

const TONES: Record<ChipTone, string> = {
  ok: 'bg-ok-bg text-ok-fg',
  warn: 'bg-warn-bg text-warn-fg',
  bad: 'bg-bad-bg text-bad-fg',
  info: 'bg-info-bg text-info-fg',
  neutral: 'bg-paper-sunk text-ink-soft',
};

/** Status is always a word in a chip, never colour alone. */
export function Chip({
  tone = 'neutral',
  children,
  title,
}: {
  tone?: ChipTone;
  children: React.ReactNode;
  title?: string;
}) {
  return (
    <span className={`chip ${TONES[tone]}`} title={title}>
      {children}
    </span>
  );
}
