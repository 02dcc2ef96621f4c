'use client';
import { useState } from 'react';
import { FormMessage } from '@/components/ui/form-message';

/** Uploads a product photo to the route handler, which checks its type by content. */
export function PhotoUpload({ productId, photoId }: { productId: number; photoId: number | null }) {
  const [version, setVersion] = useState(photoId);
  const [msg, setMsg] = useState<{ error?: string; success?: string }>({});
  const [busy, setBusy] = useState(false);
  async function submit(ev: React.FormEvent<HTMLFormElement>) {
    ev.preventDefault();
    const file = new FormData(ev.currentTarget).get('photo');
    if (!(file instanceof File) || file.size === 0) return setMsg({ error: 'Choose a photo first.' });
    if (file.size > 5 * 1024 * 1024) return setMsg({ error: 'The photo is larger than 5 MB.' });
    setBusy(true);
    const res = await fetch(`/api/products/${productId}/photo`, { method: 'POST', body: new FormData(ev.currentTarget) });
    setBusy(false);
    const body = (await res.json().catch(() => ({}))) as { photoId?: number; error?: string };
    if (!res.ok) return setMsg({ error: body.error ?? 'The upload failed.' });
    setVersion(body.photoId ?? null);
    setMsg({ success: 'Photo saved.' });
  }
  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Product photo">
      {version ? (
        <img src={`/api/products/${productId}/photo?v=${version}`} alt="Product photo" className="max-h-56 rounded-lg border border-line" />
      ) : <p className="hint">No photo yet.</p>}
      <label className="field" htmlFor="photo"><span>Photo (JPEG, PNG or WebP, up to 5 MB)</span>
        <input id="photo" name="photo" type="file" accept="image/jpeg,image/png,image/webp" className="input" />
      </label>
      <FormMessage error={msg.error} success={msg.success} />
      <button type="submit" className="btn-secondary" disabled={busy}>Upload photo</button>
    </form>
  );
}
