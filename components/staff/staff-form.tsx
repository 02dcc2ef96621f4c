'use client';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import type { ActionResult } from '@/lib/schemas/result';
import type { StaffInput } from '@/lib/schemas/auth';

const schema = z.object({
  name: z.string().trim().min(1, 'Enter a name.').max(120),
  email: z.string().trim().email('Enter a valid e-mail address.'),
  role: z.enum(['owner', 'keeper', 'crew']),
});

export function StaffForm({ onCreate }: { onCreate: (v: StaffInput) => Promise<ActionResult> }) {
  const form = useForm<z.input<typeof schema>>({ resolver: zodResolver(schema), defaultValues: { role: 'keeper' } });
  const [msg, setMsg] = useState<{ error?: string; success?: string }>({});
  async function submit(values: z.input<typeof schema>) {
    const result = await onCreate(values);
    if (result.ok) {
      form.reset({ name: '', email: '', role: values.role });
      return setMsg({ success: `Account made; ${values.email} has a link to set a password.` });
    }
    for (const [name, message] of Object.entries(result.fieldErrors ?? {})) form.setError(name as keyof StaffInput, { message });
    setMsg({ error: result.message });
  }
  return (
    <form onSubmit={form.handleSubmit(submit)} className="space-y-4" noValidate>
      <TextField label="Name" registration={form.register('name')} error={form.formState.errors.name} />
      <TextField label="E-mail" type="email" registration={form.register('email')} error={form.formState.errors.email} />
      <label className="field" htmlFor="role"><span>Role</span>
        <select id="role" className="input" {...form.register('role')}>
          <option value="keeper">Keeper</option>
          <option value="crew">Honey house crew</option>
          <option value="owner">Owner</option>
        </select>
      </label>
      <FormMessage error={msg.error} success={msg.success} />
      <button type="submit" className="btn-primary w-full" disabled={form.formState.isSubmitting}>Create and send link</button>
    </form>
  );
}
