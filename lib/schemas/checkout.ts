import { z } from 'zod';
import { plainText as text, safeString } from './fields';

/** The most jars of one product in one order (the cart, and the same product on several lines, summed). */
export const MAX_JARS_PER_PRODUCT = 48;

export const checkoutInput = z
  .object({
    items: z
      .array(
        z.object({
          productId: z.number().int().positive(),
          quantity: z
            .number()
            .int()
            .min(1, 'At least one jar')
            .max(MAX_JARS_PER_PRODUCT, `At most ${MAX_JARS_PER_PRODUCT} jars per product`),
        }),
      )
      .min(1, 'Your cart is empty.')
      .max(30),
    email: safeString().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
    name: text(120).min(1, 'Enter your name'),
    phone: text(40).default(''),
    fulfilment: z.enum(['pickup', 'ship']),
    address: z
      .object({
        line1: text(120),
        line2: text(120).default(''),
        city: text(80),
        region: text(80).default(''),
        postalCode: text(20),
        country: text(60).default(''),
      })
      .optional(),
  })
  .superRefine((v, ctx) => {
    // Lines of the same product count together: two lines of 48 are one order of 96 jars.
    const perProduct = new Map<number, number>();
    for (const i of v.items) perProduct.set(i.productId, (perProduct.get(i.productId) ?? 0) + i.quantity);
    v.items.forEach((i, n) => {
      if ((perProduct.get(i.productId) ?? 0) > MAX_JARS_PER_PRODUCT)
        ctx.addIssue({
          code: 'custom',
          path: ['items', n, 'quantity'],
          message: `At most ${MAX_JARS_PER_PRODUCT} jars per product`,
        });
    });
    if (v.fulfilment !== 'ship') return;
    for (const key of ['line1', 'city', 'postalCode'] as const) {
      if (!v.address?.[key]) ctx.addIssue({ code: 'custom', path: ['address', key], message: 'Needed for shipping' });
    }
  })
  .transform((v) => {
    // One line per product from here on (startCheckout, Stripe's line items).
    const merged = new Map<number, number>();
    for (const i of v.items) merged.set(i.productId, (merged.get(i.productId) ?? 0) + i.quantity);
    return { ...v, items: [...merged].map(([productId, quantity]) => ({ productId, quantity })) };
  });
export type CheckoutInput = z.input<typeof checkoutInput>;
export type CheckoutData = z.output<typeof checkoutInput>;
