'use client';
import { staffInput, type StaffInput } from '@/lib/schemas/staff';
import type { ActionResult } from '@/lib/schemas/result';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';

export function StaffForm({ onCreate }: { onCreate: (v: StaffInput) => Promise<ActionResult> }) {
  const { form, field, submit, pending, message } = useActionForm({
    schema: staffInput,
    defaultValues: { name: '', email: '', role: 'keeper' },
    action: onCreate,
    successMessage: (_, values) => `Account made; ${values.email} has a link to set a password.`,
    resetOnSuccess: (typed) => ({ name: '', email: '', role: typed.role }),
  });
  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      <TextField label="Name" {...field('name')} />
      <TextField label="E-mail" type="email" {...field('email')} />
      <label className="field" htmlFor="role">
        <span>Role</span>
        <select id="role" className="input" {...form.register('role')}>
          <option value="keeper">Keeper</option>
          <option value="crew">Honey house crew</option>
          <option value="owner">Owner</option>
        </select>
      </label>
      <FormMessage {...message} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        Create and send link
      </button>
    </form>
  );
}
