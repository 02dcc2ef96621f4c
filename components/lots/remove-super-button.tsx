'use client';
import type { ActionResult } from '@/lib/schemas/result';
import { removeSuperInput, type RemoveSuperInput } from '@/lib/schemas/lots';
import { ReasonButton } from './reason-button';

/** Takes a super back out of a lot that is still gathering, with a written reason (audited). */
export function RemoveSuperButton({
  lotId,
  superPullId,
  tag,
  onRemove,
}: {
  lotId: number;
  superPullId: number;
  tag: string;
  onRemove: (v: RemoveSuperInput) => Promise<ActionResult>;
}) {
  // On success the page refreshes without this super's row.
  return (
    <ReasonButton
      schema={removeSuperInput}
      action={onRemove}
      defaultValues={{ lotId, superPullId, reason: '' }}
      verb="Take out"
      what={`super ${tag}`}
      inputId={`remove-${superPullId}`}
      question={`Why take ${tag} out?`}
    />
  );
}
