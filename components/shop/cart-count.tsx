'use client';
import { useEffect, useState } from 'react';
import { onCartChange, readCart } from './cart-store';

/** Jars in the browser's cart, beside the header's Cart link. */
export function CartCount() {
  const [n, setN] = useState(0);
  useEffect(() => {
    const sync = () => setN(readCart().reduce((s, i) => s + i.quantity, 0));
    sync();
    return onCartChange(sync);
  }, []);
  if (n === 0) return null;
  return (
    <span className="chip bg-amber-100 text-amber-800" aria-label={`${n} jars`}>
      {n}
    </span>
  );
}
