'use client';
import { useEffect } from 'react';
import { writeCart } from './cart-store';

/** Empties the browser cart once the buyer is back from a completed payment. */
export function ClearCart() {
  useEffect(() => writeCart([]), []);
  return null;
}
