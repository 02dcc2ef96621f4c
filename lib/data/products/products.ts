import 'server-only';
import { createHash } from 'node:crypto';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/db/index';
import { ConflictError, DomainError, InvalidError, NotFoundError } from '@/lib/domain/errors';
import { isValidGtin, makeGtin } from '@/lib/domain/gs1';
import { toGrams } from '@/lib/domain/units';
import type { ProductData } from '@/lib/schemas/products';
import { recordAudit } from '@/lib/data/audit';
import { getSettings } from '@/lib/data/settings/settings';
import { sniffImageType } from '@/lib/domain/file-type';

export type ProductRow = {
  id: number;
  slug: string;
  name: string;
  description: string;
  netGrams: number;
  declaredUnit: 'g' | 'oz';
  declaredAmount: number;
  containerKind: string;
  containerGrams: number;
  priceCents: number;
  gtin: string | null;
  photoId: number | null;
  active: boolean;
};

type ProductModel = InstanceType<ReturnType<typeof getDb>['models']['Product']>;
function toRow(p: ProductModel): ProductRow {
  return {
    id: p.id,
    slug: p.slug,
    name: p.name,
    description: p.description,
    netGrams: p.netGrams,
    declaredUnit: p.declaredUnit,
    declaredAmount: Number(p.declaredAmount),
    containerKind: p.containerKind,
    containerGrams: p.containerGrams,
    priceCents: p.priceCents,
    gtin: p.gtin ?? null,
    photoId: p.photoId ?? null,
    active: p.active,
  };
}

function slugify(name: string): string {
  return (
    name
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 80) || 'product'
  );
}

export async function listProducts(opts: { activeOnly?: boolean } = {}): Promise<ProductRow[]> {
  const rows = await getDb().models.Product.findAll({
    where: opts.activeOnly ? { active: true } : {},
    order: [
      ['sortOrder', 'ASC'],
      ['name', 'ASC'],
    ],
  });
  return rows.map(toRow);
}

export async function getProduct(id: number): Promise<ProductRow | null> {
  const p = await getDb().models.Product.findByPk(id);
  return p ? toRow(p) : null;
}

/** The GTIN to store: typed (checked), made from the owner's GS1 company prefix + item reference, or none. */
async function resolveGtin(data: ProductData): Promise<string | null> {
  if (data.gtinMode === 'none') return null;
  if (data.gtinMode === 'typed') {
    if (!isValidGtin(data.gtin)) throw new InvalidError('That GTIN has a wrong check digit or length.');
    return data.gtin;
  }
  const { gs1CompanyPrefix } = await getSettings();
  if (!gs1CompanyPrefix) throw new InvalidError('Set your GS1 company prefix in Settings first, or type the GTIN.');
  try {
    return makeGtin(gs1CompanyPrefix, data.itemReference);
  } catch (err) {
    throw new InvalidError(`${(err as Error).message}.`);
  }
}

function attributes(data: ProductData, gtin: string | null) {
  return {
    name: data.name,
    slug: data.slug || slugify(data.name),
    description: data.description,
    netGrams: toGrams(data.netAmount, data.netUnit),
    declaredUnit: data.netUnit,
    declaredAmount: data.netAmount,
    containerKind: data.containerKind,
    containerGrams: data.containerGrams,
    priceCents: Math.round(data.price * 100),
    active: data.active,
    gtin,
  };
}

function uniqueMessage(err: UniqueConstraintError): string {
  const field = Object.keys(err.fields ?? {})[0];
  return field === 'gtin'
    ? 'Another product already has this GTIN.'
    : 'Another product already has this web address (slug); change the name or slug.';
}

/** Creates (no productId) or updates a product; audited. */
export async function saveProduct(actorUserId: number, data: ProductData): Promise<ProductRow> {
  const { sequelize, models } = getDb();
  const gtin = await resolveGtin(data);
  try {
    return await sequelize.transaction(async (t) => {
      const attrs = attributes(data, gtin);
      if (!data.productId) {
        const p = await models.Product.create(attrs, { transaction: t });
        await recordAudit(
          { actorUserId, action: 'product.create', entityType: 'product', entityId: p.id, after: attrs },
          t,
        );
        return toRow(p);
      }
      const p = await models.Product.findByPk(data.productId, { transaction: t, lock: t.LOCK.UPDATE });
      if (!p) throw new NotFoundError('No such product.');
      const before = toRow(p);
      await p.update(attrs, { transaction: t });
      await recordAudit(
        { actorUserId, action: 'product.update', entityType: 'product', entityId: p.id, before, after: attrs },
        t,
      );
      return toRow(p);
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw new ConflictError(uniqueMessage(err));
    throw err;
  }
}

export const MAX_PHOTO_BYTES = 5 * 1024 * 1024;

/** Stores an uploaded photo (JPEG/PNG/WebP by content, ≤ 5 MB) and attaches it to the product. */
export async function setProductPhoto(
  actorUserId: number,
  productId: number,
  file: { name: string; bytes: Uint8Array },
): Promise<{ photoId: number }> {
  if (file.bytes.byteLength === 0) throw new InvalidError('The file is empty.');
  if (file.bytes.byteLength > MAX_PHOTO_BYTES) throw new DomainError('too-large', 'The photo is larger than 5 MB.');
  const contentType = sniffImageType(file.bytes);
  if (!contentType) throw new DomainError('unsupported-type', 'Upload a JPEG, PNG or WebP image.');
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (t) => {
    const product = await models.Product.findByPk(productId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!product) throw new NotFoundError('No such product.');
    const stored = await models.StoredFile.create(
      {
        filename: file.name.replace(/[^\w.\- ]+/g, '_').slice(0, 200) || 'photo',
        contentType,
        sizeBytes: file.bytes.byteLength,
        sha256: createHash('sha256').update(file.bytes).digest('hex'),
        data: Buffer.from(file.bytes),
        uploadedBy: actorUserId,
      },
      { transaction: t },
    );
    const oldPhotoId = product.photoId ?? null;
    await product.update({ photoId: stored.id }, { transaction: t });
    if (oldPhotoId) await models.StoredFile.destroy({ where: { id: oldPhotoId }, transaction: t });
    await recordAudit(
      {
        actorUserId,
        action: 'product.photo',
        entityType: 'product',
        entityId: productId,
        before: { photoId: oldPhotoId },
        after: { photoId: stored.id, contentType, sizeBytes: stored.sizeBytes },
      },
      t,
    );
    return { photoId: stored.id };
  });
}

/** A product's photo for the public route (only photos attached to a product are served). */
export async function getProductPhoto(
  productId: number,
): Promise<{ contentType: string; data: Buffer; sha256: string } | null> {
  const { Product, StoredFile } = getDb().models;
  const product = await Product.findByPk(productId, { attributes: ['id', 'photoId'] });
  if (!product?.photoId) return null;
  const file = await StoredFile.findByPk(product.photoId);
  return file ? { contentType: file.contentType, data: file.data, sha256: file.sha256 } : null;
}
