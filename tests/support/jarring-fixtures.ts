import { randomUUID } from 'node:crypto';
import { getDb } from '@/lib/db/index';

let n = 0;
const tag = () => `${Date.now().toString(36).slice(-5)}${(n++).toString(36)}`.toUpperCase();

/** A released lot with `netGrams` of honey, made directly (the honey-house screens are another feature). */
export async function releasedLot(
  netGrams: number,
  extra: { extractedOn?: string; floralSource?: string; stage?: 'released' | 'held' | 'extracted' } = {},
) {
  const { Lot } = getDb().models;
  return Lot.create({
    code: `TJ-${tag()}`,
    floralSource: extra.floralSource ?? 'Linden',
    extractedOn: extra.extractedOn ?? '2026-07-15',
    stage: extra.stage ?? 'released',
    netGrams,
    usedGrams: 0,
    createdBy: null,
  });
}

/** An active product; 340 g in a 200 g glass jar unless told otherwise. */
export async function product(
  extra: {
    netGrams?: number;
    declaredUnit?: 'g' | 'oz';
    declaredAmount?: number;
    containerGrams?: number;
    gtin?: string | null;
    active?: boolean;
  } = {},
) {
  const { Product } = getDb().models;
  const t = tag().toLowerCase();
  const netGrams = extra.netGrams ?? 340;
  return Product.create({
    slug: `test-jar-${t}`,
    name: `Test jar ${t}`,
    netGrams,
    declaredUnit: extra.declaredUnit ?? 'g',
    declaredAmount: extra.declaredAmount ?? netGrams,
    containerKind: 'glass jar',
    containerGrams: extra.containerGrams ?? 200,
    priceCents: 900,
    gtin: extra.gtin ?? null,
    active: extra.active ?? true,
  });
}

export const key = () => randomUUID();

/** Samples typed as in the form. */
export const samples = (...grams: number[]) => grams.join(', ');

/** n sample weights taking `grams` in turn, typed as in the form: enough jars for the reference test. */
export const weighed = (n: number, ...grams: number[]) =>
  samples(...Array.from({ length: n }, (_, i) => grams[i % grams.length]));
