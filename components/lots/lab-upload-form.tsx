'use client';
import { useRouter } from 'next/navigation';
import { LAB_RESULT_FIELDS, labUploadFormInput, type LabUploadFormInput } from '@/lib/schemas/lots';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
import { postForm } from '@/components/ui/post-form';

/** Uploads a PDF or image lab report to the route handler (the server checks its real type). */
export function LabUploadForm({ lotId }: { lotId: number }) {
  const router = useRouter();
  const { field, submit, pending, message } = useActionForm({
    schema: labUploadFormInput,
    defaultValues: Object.fromEntries(LAB_RESULT_FIELDS.map((k) => [k, ''])) as Omit<LabUploadFormInput, 'file'>,
    action: (v) => {
      const body = new FormData();
      body.set('file', v.file[0]);
      for (const k of LAB_RESULT_FIELDS) if (v[k]) body.set(k, v[k]);
      return postForm<{ held?: boolean }>(
        `/api/lots/${lotId}/lab-files`,
        body,
        (status) => `Upload failed (${status}).`,
      );
    },
    successMessage: (saved) =>
      saved.held
        ? 'Lab report stored. Its results fail the composition limits for this lot’s honey: the lot is now held.'
        : 'Lab report stored.',
    resetOnSuccess: true,
    onSuccess: () => router.refresh(),
  });
  return (
    <form onSubmit={submit} className="grid gap-3 sm:grid-cols-3" noValidate aria-label="Upload a lab report">
      <div className="sm:col-span-3">
        <TextField
          label="Lab report (PDF, PNG, JPEG or WebP, at most 10 MB)"
          id="lab-file"
          type="file"
          accept="application/pdf,image/png,image/jpeg,image/webp"
          {...field('file')}
        />
      </div>
      <TextField label="HMF, mg/kg" {...field('hmfMgKg')} inputMode="decimal" />
      <TextField label="Diastase, Schade" {...field('diastaseSchade')} inputMode="decimal" />
      <TextField label="Water-insoluble, g/100 g" {...field('insolubleG100g')} inputMode="decimal" />
      <TextField label="Fructose + glucose, g/100 g" {...field('fructoseGlucoseG100g')} inputMode="decimal" />
      <TextField label="Sucrose, g/100 g" {...field('sucroseG100g')} inputMode="decimal" />
      <TextField label="Electrical conductivity, mS/cm" {...field('conductivityMsCm')} inputMode="decimal" />
      <TextField label="Free acid, meq/kg" {...field('freeAcidMeqKg')} inputMode="decimal" />
      <div className="sm:col-span-3">
        <FormMessage {...message} />
      </div>
      <div>
        <button type="submit" className="btn-secondary" disabled={pending}>
          Upload report
        </button>
      </div>
    </form>
  );
}
