'use client';
import type { ActionResult } from '@/lib/schemas/result';
import { staffUpdateInput, type StaffUpdateInput } from '@/lib/schemas/staff';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

type Role = 'owner' | 'keeper' | 'crew';

export function StaffRowActions({
  userId,
  role,
  disabled,
  onUpdate,
}: {
  userId: number;
  role: Role;
  disabled: boolean;
  onUpdate: (v: StaffUpdateInput) => Promise<ActionResult>;
}) {
  // Each control saves at once and sends only its own change.
  const { run, pending, message } = useActionForm({ schema: staffUpdateInput, action: onUpdate });
  return (
    <div className="flex flex-wrap items-center gap-2">
      <label className="sr-only" htmlFor={`role-${userId}`}>
        Role
      </label>
      <select
        id={`role-${userId}`}
        className="input min-h-9 w-auto py-1 text-sm"
        defaultValue={role}
        disabled={pending}
        onChange={(e) => run({ userId, role: e.target.value as Role })}
      >
        <option value="keeper">Keeper</option>
        <option value="crew">Honey house</option>
        <option value="owner">Owner</option>
      </select>
      <button
        type="button"
        className={disabled ? 'btn-secondary min-h-9 py-1' : 'btn-danger min-h-9 py-1'}
        disabled={pending}
        onClick={() => run({ userId, disabled: !disabled })}
      >
        {disabled ? 'Enable' : 'Disable'}
      </button>
      <FormMessage error={message.error} />
    </div>
  );
}
