import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { closeDb, getDb } from '@/lib/db';
import { getOrderDetail } from '@/lib/data/orders/read';
import { orderConfirmationMail } from '@/lib/mail/order-mails';
import { passwordMail } from '@/lib/mail/templates';
import { GET as packingSlip } from '@/app/(back-office)/admin/orders/[id]/packing-slip/route';
import { DEMO, signInAs, setRequestHeaders } from '@/tests/support/session';
import { hasPoppler, pdfText } from '../pdf/poppler';

afterAll(closeDb);

// Output encoding (ASVS 1.2.1): what people type is shown as text everywhere it goes out. (Pages: React
// escapes; tests/e2e/auth.test.ts checks a product description with markup in the browser.)
const MARKUP = '<img src=x onerror="alert(1)">Ada & <b>Bee</b>';

async function paidOrderId(): Promise<number> {
  const [row] = await getDb().sequelize.query<{ id: number }>(
    `SELECT id FROM orders WHERE status = 'paid' ORDER BY id LIMIT 1`,
    { type: QueryTypes.SELECT },
  );
  return row.id;
}

describe('markup in names and notes goes out as text', () => {
  it('in e-mails: the HTML part carries it escaped, the text part as typed', async () => {
    const order = (await getOrderDetail(await paidOrderId()))!;
    const mail = orderConfirmationMail(
      { ...order, name: MARKUP, lines: order.lines.map((l) => ({ ...l, productName: MARKUP })) },
      { business: MARKUP, link: 'http://127.0.0.1:3100/orders/x' },
    );
    expect(mail.html).not.toContain('<img');
    expect(mail.html).not.toContain('<b>Bee');
    expect(mail.html).toContain('&lt;img src=x onerror=&quot;alert(1)&quot;&gt;Ada &amp; &lt;b&gt;Bee&lt;/b&gt;');
    expect(mail.text).toContain(MARKUP);
    const reset = passwordMail({
      kind: 'reset',
      to: 'a@b.test',
      name: MARKUP,
      business: 'Hollowmere',
      link: 'http://127.0.0.1:3100/reset?t="><script>',
    });
    expect(reset.html).not.toMatch(/<img|<script/);
  });

  it.skipIf(!hasPoppler)('in PDFs: the packing slip prints the name literally', async () => {
    const id = await paidOrderId();
    const { Order } = getDb().models;
    const order = await Order.findByPk(id);
    const before = order!.name;
    await order!.update({ name: MARKUP });
    try {
      await signInAs(DEMO.owner);
      setRequestHeaders({});
      const res = await packingSlip(new Request(`http://127.0.0.1:3100/admin/orders/${id}/packing-slip`), {
        params: Promise.resolve({ id: String(id) }),
      });
      expect(res.status).toBe(200);
      const text = pdfText(new Uint8Array(await res.arrayBuffer())).replace(/\s+/g, ' ');
      expect(text).toContain('<img src=x onerror="alert(1)">Ada & <b>Bee</b>');
    } finally {
      await order!.update({ name: before });
    }
  });
});
