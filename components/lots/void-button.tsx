'use client';
import type { ActionResult } from '@/lib/schemas/result';
import { voidInput, type VoidInput } from '@/lib/schemas/lots';
import { ReasonButton } from './reason-button';

/** Corrects a record by voiding it with a written reason; nothing is deleted. */
export function VoidButton({
  lotId,
  kind,
  recordId,
  what,
  onVoid,
}: {
  lotId: number;
  kind: VoidInput['kind'];
  recordId: number;
  what: string;
  onVoid: (v: VoidInput) => Promise<ActionResult>;
}) {
  return (
    <ReasonButton
      schema={voidInput}
      action={onVoid}
      defaultValues={{ lotId, kind, recordId, reason: '' }}
      closeOnSuccess
      verb="Void"
      what={what}
      inputId={`void-${kind}-${recordId}`}
      question={`Why void ${what}?`}
    />
  );
}
