'use client';
import { useRouter } from 'next/navigation';
import type { ActionResult } from '@/lib/schemas/result';
import { labelLayoutIdInput, type LabelLayoutIdInput } from '@/lib/schemas/labels';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

export function DeleteLayoutButton({
  layoutId,
  onDelete,
}: {
  layoutId: number;
  onDelete: (v: LabelLayoutIdInput) => Promise<ActionResult>;
}) {
  const router = useRouter();
  const { run, pending, message } = useActionForm({
    schema: labelLayoutIdInput,
    action: onDelete,
    onSuccess: () => router.refresh(),
  });
  return (
    <>
      <button type="button" className="btn-quiet" disabled={pending} onClick={() => run({ layoutId })}>
        Delete
      </button>
      <FormMessage {...message} />
    </>
  );
}
