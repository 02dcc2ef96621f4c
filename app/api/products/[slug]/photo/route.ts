import { getDb } from '@/lib/db';

export const dynamic = 'force-dynamic';

/** A product's photo from stored_files (uploads are never served from public/). */
export async function GET(_req: Request, ctx: { params: Promise<{ slug: string }> }): Promise<Response> {
  const { slug } = await ctx.params;
  const { Product, StoredFile } = getDb().models;
  const product = await Product.findOne({ where: { slug, active: true }, attributes: ['photoId'] });
  const file = product?.photoId ? await StoredFile.findByPk(product.photoId) : null;
  if (!file || !file.contentType.startsWith('image/')) return new Response('Not found', { status: 404 });
  return new Response(new Uint8Array(file.data), {
    headers: { 'Content-Type': file.contentType, 'Cache-Control': 'public, max-age=3600', 'X-Content-Type-Options': 'nosniff', ETag: `"${file.sha256}"` },
  });
}
