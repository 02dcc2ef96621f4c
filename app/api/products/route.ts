import { listCatalogue } from '@/lib/data/shop/catalogue';
import { handleRouteError } from '@/lib/http/json';

export const dynamic = 'force-dynamic';

/** The catalogue as JSON (the cart re-checks names, prices and stock with it). Public. */
export async function GET(): Promise<Response> {
  try {
    const items = await listCatalogue();
    return Response.json(
      {
        products: items.map(({ id, slug, name, netGrams, containerGrams, priceCents, available, floralSources }) => ({
          id,
          slug,
          name,
          netGrams,
          containerGrams,
          priceCents,
          available,
          floralSources,
        })),
      },
      { headers: { 'Cache-Control': 'no-store' } },
    );
  } catch (err) {
    return handleRouteError(err);
  }
}
