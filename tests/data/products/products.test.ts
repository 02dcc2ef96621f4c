import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, getDb } from '@/lib/db/index';
import { DEMO, signInAs } from '@/tests/support/session';
import { saveProductAction } from '@/app/(back-office)/admin/products/actions';
import { GET as photoGet, POST as photoPost } from '@/app/api/products/[id]/photo/route';
import { isValidGtin, makeGtin } from '@/lib/domain/gs1';
import { TINY_PNG } from '@/tests/support/files';

afterAll(closeDb);

const base = {
  description: '',
  netUnit: 'g' as const,
  containerKind: 'glass jar',
  containerGrams: 190,
  price: '8.50',
  active: true,
};
let n = 0;
const unique = () => `${Date.now().toString(36)}${n++}`;

describe('products', () => {
  it('makes the GTIN from the owner’s GS1 company prefix and an item reference', async () => {
    await signInAs(DEMO.owner);
    await getDb().models.BusinessSetting.update({ gs1CompanyPrefix: '0614141' }, { where: { id: 1 } });
    const res = await saveProductAction({
      ...base,
      name: `Spring blossom ${unique()}`,
      netAmount: 340,
      gtinMode: 'made',
      itemReference: '12345',
    });
    expect(res.ok).toBe(true);
    // 0614141 + 12345 → data 061414112345; GS1 General Specifications §7.9.1 weights 3,1,3,1… from the right:
    // 5·3+4+3·3+2+1·3+1+4·3+1+4·3+1+6·3+0 = 78 → check digit (10 − 8) mod 10 = 2.
    expect(res.ok && res.data.gtin).toBe('0614141123452');
    expect(isValidGtin('0614141123452')).toBe(true);
    const row = await getDb().models.Product.findByPk(res.ok ? res.data.id : 0);
    expect(row).toMatchObject({ netGrams: 340, declaredUnit: 'g', priceCents: 850, containerGrams: 190 });
  });

  it('stores ounces as grams with the declared unit, and money as cents', async () => {
    await signInAs(DEMO.owner);
    const res = await saveProductAction({
      ...base,
      name: `Linden ${unique()}`,
      netAmount: 12,
      netUnit: 'oz',
      price: '12.99',
      gtinMode: 'none',
    });
    const row = await getDb().models.Product.findByPk(res.ok ? res.data.id : 0);
    // 12 oz × 28.349523125 g = 340.19 g → 340 g stored
    expect(row).toMatchObject({ netGrams: 340, declaredUnit: 'oz', declaredAmount: 12, priceCents: 1299, gtin: null });
  });

  it('refuses a typed GTIN with a wrong check digit, and a GTIN another product has', async () => {
    await signInAs(DEMO.owner);
    // GS1 General Specifications worked example: 629104150021 → check digit 3, so …4 is wrong.
    const bad = await saveProductAction({
      ...base,
      name: `Bad ${unique()}`,
      netAmount: 250,
      gtinMode: 'typed',
      gtin: '6291041500214',
    });
    expect(bad).toMatchObject({ ok: false, fieldErrors: { gtin: expect.stringMatching(/check digit/) } });
    const gtin = makeGtin('0614141', `8${String(Date.now() % 10_000).padStart(4, '0')}`);
    const good = await saveProductAction({
      ...base,
      name: `Good ${unique()}`,
      netAmount: 250,
      gtinMode: 'typed',
      gtin,
    });
    expect(good).toMatchObject({ ok: true, data: { gtin } });
    const twice = await saveProductAction({
      ...base,
      name: `Twice ${unique()}`,
      netAmount: 250,
      gtinMode: 'typed',
      gtin,
    });
    expect(twice).toMatchObject({ ok: false, message: expect.stringMatching(/already has this GTIN/) });
  });

  it('only the owner manages products', async () => {
    await signInAs(DEMO.crew);
    const res = await saveProductAction({ ...base, name: `Crew ${unique()}`, netAmount: 250, gtinMode: 'none' });
    expect(res).toMatchObject({ ok: false, message: expect.stringMatching(/not allowed/) });
  });

  describe('photo upload', () => {
    const png = TINY_PNG;
    async function upload(id: number, bytes: Uint8Array<ArrayBuffer>, type: string, name = 'photo.png') {
      const form = new FormData();
      form.set('photo', new File([bytes], name, { type }));
      return photoPost(new Request(`http://test/api/products/${id}/photo`, { method: 'POST', body: form }), {
        params: Promise.resolve({ id: String(id) }),
      });
    }

    it('stores a PNG checked by content and serves it with its own type and nosniff', async () => {
      await signInAs(DEMO.owner);
      const created = await saveProductAction({ ...base, name: `Photo ${unique()}`, netAmount: 250, gtinMode: 'none' });
      const id = created.ok ? created.data.id : 0;
      const res = await upload(id, png, 'image/png');
      expect(res.status).toBe(201);
      await signInAs(null);
      const got = await photoGet(new Request(`http://test/api/products/${id}/photo`), {
        params: Promise.resolve({ id: String(id) }),
      });
      expect(got.status).toBe(200);
      expect(got.headers.get('content-type')).toBe('image/png');
      expect(got.headers.get('x-content-type-options')).toBe('nosniff');
      expect(Buffer.from(await got.arrayBuffer()).equals(png)).toBe(true);
    });

    it('refuses HTML claiming to be an image, files over 5 MB, and non-owners', async () => {
      await signInAs(DEMO.owner);
      const created = await saveProductAction({
        ...base,
        name: `Photo2 ${unique()}`,
        netAmount: 250,
        gtinMode: 'none',
      });
      const id = created.ok ? created.data.id : 0;
      const html = await upload(
        id,
        new TextEncoder().encode('<html><script>alert(1)</script></html>'),
        'image/jpeg',
        'x.jpg',
      );
      expect(html.status).toBe(415);
      const big = new Uint8Array(5 * 1024 * 1024 + 1);
      big.set([0xff, 0xd8, 0xff]);
      expect((await upload(id, big, 'image/jpeg', 'big.jpg')).status).toBe(413);
      await signInAs(DEMO.crew);
      expect((await upload(id, png, 'image/png')).status).toBe(403);
    });
  });
});
