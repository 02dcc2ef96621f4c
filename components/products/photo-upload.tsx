'use client';
import { useState } from 'react';
import { productPhotoInput } from '@/lib/schemas/products';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/ui/form-message';
import { useActionForm } from '@/components/ui/use-action-form';
import { postForm } from '@/components/ui/post-form';

/** Uploads a product photo to the route handler, which checks its type by content. */
export function PhotoUpload({ productId, photoId }: { productId: number; photoId: number | null }) {
  const [version, setVersion] = useState(photoId);
  const { field, submit, pending, message } = useActionForm({
    schema: productPhotoInput,
    action: (v) => {
      const body = new FormData();
      body.set('photo', v.photo[0]);
      return postForm<{ photoId?: number }>(`/api/products/${productId}/photo`, body, () => 'The upload failed.');
    },
    successMessage: 'Photo saved.',
    onSuccess: (saved) => setVersion(saved.photoId ?? null),
  });
  return (
    <form onSubmit={submit} className="space-y-3" noValidate aria-label="Product photo">
      {version ? (
        // eslint-disable-next-line @next/next/no-img-element -- served by our own route, sizes vary
        <img
          src={`/api/products/${productId}/photo?v=${version}`}
          alt="Product photo"
          className="max-h-56 rounded-lg border border-line"
        />
      ) : (
        <p className="hint">No photo yet.</p>
      )}
      <TextField
        label="Photo (JPEG, PNG or WebP, up to 5 MB)"
        id="photo"
        type="file"
        accept="image/jpeg,image/png,image/webp"
        {...field('photo')}
      />
      <FormMessage {...message} />
      <button type="submit" className="btn-secondary" disabled={pending}>
        Upload photo
      </button>
    </form>
  );
}
