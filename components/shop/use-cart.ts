'use client';
import { useEffect, useState, useSyncExternalStore } from 'react';
import { cartSnapshot, onCartChange, type CartItem } from './cart-store';

const NO_ITEMS: CartItem[] = [];
const noSubscription = () => () => {};

export type LiveProduct = {
  id: number;
  slug: string;
  name: string;
  netGrams: number;
  containerGrams: number;
  priceCents: number;
  available: number;
};

/** The browser's cart plus the server's current names, prices and stock for it. */
export function useCart(): { items: CartItem[]; live: Map<number, LiveProduct> | null; ready: boolean } {
  const items = useSyncExternalStore(onCartChange, cartSnapshot, () => NO_ITEMS);
  // false while rendering on the server and hydrating, true once the browser's cart is read.
  const ready = useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
  const [live, setLive] = useState<Map<number, LiveProduct> | null>(null);
  useEffect(() => {
    let stop = false;
    fetch('/api/products', { cache: 'no-store' })
      .then((r) => r.json() as Promise<{ products: LiveProduct[] }>)
      .then((j) => {
        if (!stop) setLive(new Map(j.products.map((p) => [p.id, p])));
      })
      .catch(() => undefined);
    return () => {
      stop = true;
    };
  }, [items.length]);
  return { items, live, ready };
}
