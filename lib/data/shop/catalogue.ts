import 'server-only';
import { getSettings } from '@/lib/data/settings/settings';
import { todayIn } from '@/lib/domain/local-date';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/db/index';

/** Stock counts only from lots that may be sold (released, or packed out while jars remain). */
export const SELLABLE_STAGES = `('released','packed_out')`;

export type CatalogueItem = {
  id: number;
  slug: string;
  name: string;
  description: string;
  netGrams: number;
  declaredUnit: string;
  declaredAmount: number;
  containerKind: string;
  containerGrams: number;
  priceCents: number;
  photoId: number | null;
  /** Σ(on hand − reserved) over sellable lots. */
  available: number;
  /** Floral sources of the lots that have jars available now. */
  floralSources: string[];
};

type Row = Omit<CatalogueItem, 'floralSources'> & { floralSources: string[] | null };

const SQL = `
SELECT p.id, p.slug, p.name, p.description, p.net_grams AS "netGrams", p.declared_unit AS "declaredUnit",
  p.declared_amount::float AS "declaredAmount", p.container_kind AS "containerKind",
  p.container_grams AS "containerGrams", p.price_cents AS "priceCents", p.photo_id AS "photoId",
  COALESCE(SUM(sl.on_hand - sl.reserved), 0)::int AS available,
  array_remove(array_agg(DISTINCT l.floral_source) FILTER (WHERE sl.on_hand > sl.reserved AND l.floral_source <> ''), NULL) AS "floralSources"
FROM products p
LEFT JOIN stock_levels sl ON sl.product_id = p.id
  AND sl.lot_id IN (SELECT id FROM lots WHERE stage IN ${SELLABLE_STAGES})
  AND sl.best_before_on >= :today
LEFT JOIN lots l ON l.id = sl.lot_id
WHERE p.active AND (:slug::text IS NULL OR p.slug = :slug)
GROUP BY p.id
ORDER BY p.sort_order, p.name`;

async function query(slug: string | null): Promise<CatalogueItem[]> {
  const today = todayIn((await getSettings()).timeZone);
  const rows = await getDb().sequelize.query<Row>(SQL, { type: QueryTypes.SELECT, replacements: { slug, today } });
  return rows.map((r) => ({ ...r, floralSources: r.floralSources ?? [] }));
}

/** Every active product with what can be bought now; sold-out products are listed too, marked by available 0. */
export function listCatalogue(): Promise<CatalogueItem[]> {
  return query(null);
}

export async function getCatalogueItem(slug: string): Promise<CatalogueItem | null> {
  const [item] = await query(slug);
  return item ?? null;
}
