'use client';
import { useState, useTransition } from 'react';
import type { ActionResult } from '@/lib/schemas/result';
import type { StaffUpdateInput } from '@/lib/schemas/auth';

type Role = 'owner' | 'keeper' | 'crew';

export function StaffRowActions({ userId, role, disabled, onUpdate }: { userId: number; role: Role; disabled: boolean; onUpdate: (v: StaffUpdateInput) => Promise<ActionResult> }) {
  const [pending, start] = useTransition();
  const [error, setError] = useState<string>();
  const run = (patch: Partial<StaffUpdateInput>) =>
    start(async () => {
      const r = await onUpdate({ userId, ...patch });
      setError(r.ok ? undefined : r.message);
    });
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label className="sr-only" htmlFor={`role-${userId}`}>Role</label>
      <select id={`role-${userId}`} className="input min-h-9 w-auto py-1 text-sm" defaultValue={role} disabled={pending} onChange={(e) => run({ role: e.target.value as Role })}>
        <option value="keeper">Keeper</option>
        <option value="crew">Honey house</option>
        <option value="owner">Owner</option>
      </select>
      <button type="button" className={disabled ? 'btn-secondary min-h-9 py-1' : 'btn-danger min-h-9 py-1'} disabled={pending} onClick={() => run({ disabled: !disabled })}>
        {disabled ? 'Enable' : 'Disable'}
      </button>
      {error ? <span role="alert" className="field-error">{error}</span> : null}
    </div>
  );
}
