'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import type { ActionResult } from '@/lib/schemas/result';

export function DeleteLayoutButton({ layoutId, onDelete }: { layoutId: number; onDelete: (v: { layoutId: number }) => Promise<ActionResult> }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  return (
    <>
      <button type="button" className="btn-quiet" onClick={async () => {
        const res = await onDelete({ layoutId });
        if (res.ok) router.refresh();
        else setError(res.message ?? 'Could not delete.');
      }}>Delete</button>
      {error ? <span role="alert" className="field-error">{error}</span> : null}
    </>
  );
}
