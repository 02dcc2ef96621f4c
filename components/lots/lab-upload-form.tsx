'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';

const MAX = 10 * 1024 * 1024;
const schema = z.object({
  file: z.custom<FileList>((v) => typeof FileList !== 'undefined' && v instanceof FileList && v.length === 1, 'Choose a file.')
    .refine((v) => !v?.[0] || v[0].size <= MAX, 'The file is larger than 10 MB.'),
  hmfMgKg: z.string().trim().regex(/^(\d+([.,]\d+)?)?$/, 'A number, or leave empty.'),
  diastaseSchade: z.string().trim().regex(/^(\d+([.,]\d+)?)?$/, 'A number, or leave empty.'),
  insolubleG100g: z.string().trim().regex(/^(\d+([.,]\d+)?)?$/, 'A number, or leave empty.'),
});
type Values = z.infer<typeof schema>;

/** Uploads a PDF or image lab report to the route handler (the server checks its real type). */
export function LabUploadForm({ lotId }: { lotId: number }) {
  const router = useRouter();
  const form = useForm<Values>({ resolver: zodResolver(schema), defaultValues: { hmfMgKg: '', diastaseSchade: '', insolubleG100g: '' } });
  const [msg, setMsg] = useState<{ error?: string; success?: string }>({});
  const e = form.formState.errors;
  async function submit(v: Values) {
    const body = new FormData();
    body.set('file', v.file[0]);
    for (const k of ['hmfMgKg', 'diastaseSchade', 'insolubleG100g'] as const) if (v[k]) body.set(k, v[k].replace(',', '.'));
    const res = await fetch(`/api/lots/${lotId}/lab-files`, { method: 'POST', body });
    const json = (await res.json().catch(() => ({}))) as { error?: string; held?: boolean };
    if (!res.ok) return setMsg({ error: json.error ?? `Upload failed (${res.status}).` });
    setMsg({ success: json.held ? 'Lab report stored. Its results fail the limits: the lot is now held.' : 'Lab report stored.' });
    form.reset();
    router.refresh();
  }
  return (
    <form onSubmit={form.handleSubmit(submit)} className="grid gap-3 sm:grid-cols-3" noValidate aria-label="Upload a lab report">
      <label className="field sm:col-span-3" htmlFor="lab-file"><span>Lab report (PDF, PNG, JPEG or WebP, at most 10 MB)</span>
        <input id="lab-file" type="file" accept="application/pdf,image/png,image/jpeg,image/webp" className="input" aria-invalid={e.file ? true : undefined} {...form.register('file')} />
        {e.file?.message ? <small className="field-error" role="alert">{e.file.message}</small> : null}
      </label>
      <TextField label="HMF, mg/kg" registration={form.register('hmfMgKg')} error={e.hmfMgKg} inputMode="decimal" />
      <TextField label="Diastase, Schade" registration={form.register('diastaseSchade')} error={e.diastaseSchade} inputMode="decimal" />
      <TextField label="Water-insoluble, g/100 g" registration={form.register('insolubleG100g')} error={e.insolubleG100g} inputMode="decimal" />
      <div className="sm:col-span-3"><FormMessage error={msg.error} success={msg.success} /></div>
      <div><button type="submit" className="btn-secondary" disabled={form.formState.isSubmitting}>Upload report</button></div>
    </form>
  );
}
