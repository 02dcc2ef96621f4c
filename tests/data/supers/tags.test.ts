import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { closeDb } from '@/lib/db/index';
import { DEMO, setRequestHeaders, signInAs } from '@/tests/support/session';
import { createTagBatchAction } from '@/app/(back-office)/admin/supers/actions';
import { GET } from '@/app/api/super-tags/sheet/route';

afterAll(closeDb);
beforeEach(() => setRequestHeaders({}));

describe('super tag sheet', () => {
  it('the owner creates a batch of tags and downloads them as a PDF', async () => {
    await signInAs(DEMO.owner);
    const made = await createTagBatchAction({ prefix: 'TGT', from: 7, count: 3, depth: 'shallow', frameCount: 8 });
    expect(made).toMatchObject({ ok: true, data: { codes: ['TGT-0007', 'TGT-0008', 'TGT-0009'], created: 3 } });
    // Again: nothing new, the same codes.
    expect(
      await createTagBatchAction({ prefix: 'TGT', from: 7, count: 3, depth: 'shallow', frameCount: 8 }),
    ).toMatchObject({ ok: true, data: { created: 0 } });
    const res = await GET(new Request('http://127.0.0.1:3100/api/super-tags/sheet?prefix=TGT'));
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toBe('attachment; filename="super-tags-TGT.pdf"');
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect(new TextDecoder().decode(bytes.slice(0, 5))).toBe('%PDF-');
  });

  it('an unknown layout is a readable 422; a keeper may not print', async () => {
    await signInAs(DEMO.owner);
    const bad = await GET(new Request('http://127.0.0.1:3100/api/super-tags/sheet?layout=Nope'));
    expect(bad.status).toBe(422);
    expect((await bad.json()).error).toMatch(/Unknown label layout/);
    await signInAs(DEMO.keeper);
    expect((await GET(new Request('http://127.0.0.1:3100/api/super-tags/sheet'))).status).toBe(403);
  });
});
