'use client';
import { useState } from 'react';
import Link from 'next/link';
import { addToCart } from './cart-store';

type Props = { productId: number; slug: string; name: string; priceCents: number; available: number };

export function AddToCart({ productId, slug, name, priceCents, available }: Props) {
  const [quantity, setQuantity] = useState(1);
  const [added, setAdded] = useState(false);
  if (available <= 0) return <p className="font-semibold text-bad-fg">Sold out</p>;
  const max = Math.min(available, 48);
  return (
    <form
      className="flex flex-wrap items-end gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        addToCart({ productId, slug, name, priceCents }, quantity);
        setAdded(true);
      }}
    >
      <label className="field w-28" htmlFor={`qty-${productId}`}>
        <span>Jars</span>
        <input
          id={`qty-${productId}`}
          className="input"
          type="number"
          inputMode="numeric"
          min={1}
          max={max}
          value={quantity}
          onChange={(e) => setQuantity(Math.max(1, Math.min(max, Math.floor(Number(e.target.value) || 1))))}
        />
      </label>
      <button type="submit" className="btn-primary">
        Add to cart
      </button>
      {added ? (
        <p role="status" className="text-sm text-ok-fg">
          Added. <Link href="/cart">View cart</Link>
        </p>
      ) : null}
    </form>
  );
}
