'use client';
import { useEffect, useState } from 'react';
import { onCartChange, readCart, type CartItem } from './cart-store';

export type LiveProduct = { id: number; slug: string; name: string; netGrams: number; containerGrams: number; priceCents: number; available: number };

/** The browser's cart plus the server's current names, prices and stock for it. */
export function useCart(): { items: CartItem[]; live: Map<number, LiveProduct> | null; ready: boolean } {
  const [items, setItems] = useState<CartItem[]>([]);
  const [ready, setReady] = useState(false);
  const [live, setLive] = useState<Map<number, LiveProduct> | null>(null);
  useEffect(() => {
    const sync = () => setItems(readCart());
    sync();
    setReady(true);
    return onCartChange(sync);
  }, []);
  useEffect(() => {
    let stop = false;
    fetch('/api/products', { cache: 'no-store' })
      .then((r) => r.json() as Promise<{ products: LiveProduct[] }>)
      .then((j) => { if (!stop) setLive(new Map(j.products.map((p) => [p.id, p]))); })
      .catch(() => undefined);
    return () => { stop = true; };
  }, [items.length]);
  return { items, live, ready };
}
