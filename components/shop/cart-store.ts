'use client';
/**
 * The cart lives in the browser (localStorage) until checkout; the server re-reads every price and
 * stock level then, so nothing here is trusted. A window event keeps header and pages in step.
 */
export type CartItem = { productId: number; slug: string; name: string; priceCents: number; quantity: number };

const KEY = 'combtrace-cart-v1';
const EVENT = 'combtrace-cart';

export function readCart(): CartItem[] {
  if (typeof window === 'undefined') return [];
  try {
    const raw: unknown = JSON.parse(window.localStorage.getItem(KEY) ?? '[]');
    if (!Array.isArray(raw)) return [];
    return raw.filter(
      (i): i is CartItem =>
        Boolean(i) && Number.isInteger(i.productId) && Number.isInteger(i.quantity) && i.quantity > 0,
    );
  } catch {
    return [];
  }
}

let snapshot: { raw: string | null; items: CartItem[] } = { raw: null, items: [] };

/** The cart, the same array until it changes (for useSyncExternalStore). */
export function cartSnapshot(): CartItem[] {
  const raw = window.localStorage.getItem(KEY);
  if (raw !== snapshot.raw) snapshot = { raw, items: readCart() };
  return snapshot.items;
}

export function writeCart(items: CartItem[]): void {
  window.localStorage.setItem(KEY, JSON.stringify(items.filter((i) => i.quantity > 0)));
  window.dispatchEvent(new Event(EVENT));
}

export function addToCart(item: Omit<CartItem, 'quantity'>, quantity: number): void {
  const items = readCart();
  const found = items.find((i) => i.productId === item.productId);
  if (found) Object.assign(found, item, { quantity: found.quantity + quantity });
  else items.push({ ...item, quantity });
  writeCart(items);
}

export function onCartChange(fn: () => void): () => void {
  window.addEventListener(EVENT, fn);
  window.addEventListener('storage', fn);
  return () => {
    window.removeEventListener(EVENT, fn);
    window.removeEventListener('storage', fn);
  };
}
