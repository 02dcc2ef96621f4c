import { Chip, type ChipTone } from '@/components/ui/chip';
import type { LotStage } from '@/lib/domain/lot-stage';

const TONE: Record<LotStage, ChipTone> = {
  gathering: 'neutral',
  extracted: 'info',
  released: 'ok',
  packed_out: 'neutral',
  held: 'bad',
};
export const STAGE_WORD: Record<LotStage, string> = {
  gathering: 'gathering',
  extracted: 'extracted',
  released: 'released',
  packed_out: 'packed out',
  held: 'held',
};

/** A lot's stage as a word in a chip. */
export function StageChip({ stage }: { stage: LotStage }) {
  return <Chip tone={TONE[stage]}>{STAGE_WORD[stage]}</Chip>;
}
