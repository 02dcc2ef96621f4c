import { z } from 'zod';

const text = (max: number) => z.string().trim().max(max);

export const checkoutInput = z
  .object({
    items: z
      .array(
        z.object({
          productId: z.number().int().positive(),
          quantity: z.number().int().min(1, 'At least one jar').max(48, 'At most 48 jars per product'),
        }),
      )
      .min(1, 'Your cart is empty.')
      .max(30),
    email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254),
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
    if (v.fulfilment !== 'ship') return;
    for (const key of ['line1', 'city', 'postalCode'] as const) {
      if (!v.address?.[key]) ctx.addIssue({ code: 'custom', path: ['address', key], message: 'Needed for shipping' });
    }
  });
export type CheckoutInput = z.input<typeof checkoutInput>;
export type CheckoutData = z.output<typeof checkoutInput>;
