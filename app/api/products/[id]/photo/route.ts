import { assertSameOrigin } from '@/lib/http/origin';
import { readUploadForm, uploadedFile } from '@/lib/http/upload';
import { authorize } from '@/lib/auth/session';
import { handleRouteError, HttpError, jsonError } from '@/lib/http/json';
import { getProductPhoto, MAX_PHOTO_BYTES, setProductPhoto } from '@/lib/data/products/products';

type Ctx = { params: Promise<{ id: string }> };

function productId(raw: string): number {
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0) throw new HttpError(404, 'No such product.');
  return id;
}

/** A product photo for the shop: the type we sniffed at upload, never a guess from the bytes (nosniff). */
export async function GET(_req: Request, { params }: Ctx): Promise<Response> {
  try {
    const photo = await getProductPhoto(productId((await params).id));
    if (!photo) return jsonError(404, 'No photo.');
    return new Response(new Uint8Array(photo.data), {
      headers: {
        'Content-Type': photo.contentType,
        'Content-Length': String(photo.data.byteLength),
        'X-Content-Type-Options': 'nosniff',
        'Content-Security-Policy': "default-src 'none'; sandbox",
        'Content-Disposition': 'inline',
        ETag: `"${photo.sha256}"`,
        'Cache-Control': 'public, max-age=300',
      },
    });
  } catch (err) {
    return handleRouteError(err);
  }
}

/** Owner uploads a photo (multipart field "photo"): JPEG, PNG or WebP by content, at most 5 MB. */
export async function POST(req: Request, { params }: Ctx): Promise<Response> {
  try {
    await assertSameOrigin(req.headers);
    const user = await authorize('products.manage');
    const id = productId((await params).id);
    const messages = {
      tooLarge: 'The photo is larger than 5 MB.',
      notAForm: 'Send the photo as a form upload.',
      missing: 'Choose a photo to upload.',
    };
    const form = await readUploadForm(req, MAX_PHOTO_BYTES, messages);
    const file = uploadedFile(form, 'photo', MAX_PHOTO_BYTES, messages);
    const saved = await setProductPhoto(user.id, id, {
      name: file.name,
      bytes: new Uint8Array(await file.arrayBuffer()),
    });
    return Response.json(
      { ok: true, photoId: saved.photoId, url: `/api/products/${id}/photo?v=${saved.photoId}` },
      { status: 201 },
    );
  } catch (err) {
    return handleRouteError(err);
  }
}
