import { describe, expect, it } from 'vitest';
import { ALLOCATION_WORDS } from '@/components/orders/order-lines';
import { paidAfterReleaseMail } from '@/lib/mail/order-mails';
import type { OrderDetail } from '@/lib/data/orders/read';

describe('order words', () => {
  it('a reserved allocation reads "reserved", never the lot stage word "held"', () => {
    expect(ALLOCATION_WORDS.reserved).toBe('reserved');
    expect(Object.values(ALLOCATION_WORDS)).not.toContain('held');
  });

  it('the refund-needed e-mail names the back office Orders page, not an "order desk"', () => {
    const order = {
      id: 1,
      number: 'W-1',
      email: 'a@example.test',
      name: 'A',
      currency: 'usd',
      lines: [],
    } as unknown as OrderDetail;
    const mail = paidAfterReleaseMail(order, {
      business: 'Test',
      link: 'http://t/admin/orders/1',
      to: 'owner@example.test',
    });
    expect(mail.text).toContain('Orders page of the back office');
    expect(mail.text).not.toMatch(/order desk/i);
  });
});
