import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RevisionSettings } from '@gloaming/contracts';
import { Photo, QuoteRevision } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote } from './estimate-fixture';
import { gardenJpeg, tinyPng } from './image-fixtures';
import { binary, pdfText } from './support/pdf-text';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());



describe('photos of a sent revision', () => {
  it('are frozen on send: later captions, order, additions and unticking do not change its PDF; a photo it shows cannot be deleted', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { email: 'photos-frozen@home.example' });
    const agent = await t.signIn('estimator');
    const photos = `/api/quotes/${g.quote.id}/photos`;
    const up = async (bytes: Buffer, caption: string) =>
      (await agent.post(photos).field('caption', caption).attach('file', bytes, { filename: 'x.jpg', contentType: 'image/jpeg' }))
        .body.photo as { id: string; version: number };
    const path = await up(await gardenJpeg(), 'Front path at dusk');
    const plan = await up(await tinyPng(), 'Cable route plan');
    const shed = await up(await tinyPng(), 'Inside the shed');
    expect((await agent.patch(`${photos}/${shed.id}`).send({ onQuote: false, version: shed.version })).status).toBe(200);

    const sent = await agent.post(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/send`).send({});
    expect(sent.status).toBe(201);
    const frozen = RevisionSettings.parse((await t.orm.em.fork().findOneOrFail(QuoteRevision, g.revision.id)).settings);
    expect(frozen.sentPhotos).toEqual([
      { photoId: path.id, caption: 'Front path at dusk' },
      { photoId: plan.id, caption: 'Cable route plan' },
    ]);

    // After sending: rename, reorder, untick, tick the shed back on and add a new one.
    const now = (id: string) => t.orm.em.fork().findOneOrFail(Photo, id);
    expect(
      (
        await agent
          .patch(`${photos}/${path.id}`)
          .send({ caption: 'Renamed after sending', version: (await now(path.id)).version })
      ).status,
    ).toBe(200);
    expect(
      (await agent.patch(`${photos}/${plan.id}`).send({ onQuote: false, version: (await now(plan.id)).version })).status,
    ).toBe(200);
    expect(
      (await agent.patch(`${photos}/${shed.id}`).send({ onQuote: true, version: (await now(shed.id)).version })).status,
    ).toBe(200);
    const later = await up(await tinyPng(), 'Added after sending');
    expect((await agent.put(`${photos}/order`).send({ photoIds: [later.id, shed.id, plan.id, path.id] })).status).toBe(200);

    const res = await agent.get(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const text = await pdfText(res.body as Buffer);
    expect(text).toContain('Front path at dusk');
    expect(text).toContain('Cable route plan');
    expect(text.indexOf('Front path at dusk')).toBeLessThan(text.indexOf('Cable route plan'));
    for (const caption of ['Renamed after sending', 'Inside the shed', 'Added after sending'])
      expect(text).not.toContain(caption);

    // The sent revision still shows the plan, so it stays (409, saying why); the others can go.
    const refused = await agent.delete(`${photos}/${plan.id}`);
    expect(refused.status).toBe(409);
    expect(refused.headers['content-type']).toContain('application/problem+json');
    expect(refused.body.detail).toMatch(/revision 1 as sent to the customer.*Untick “on quote”/);
    expect(await t.orm.em.fork().count(Photo, { id: plan.id })).toBe(1);
    expect((await agent.delete(`${photos}/${later.id}`)).status).toBe(204);
    expect((await agent.delete(`${photos}/${shed.id}`)).status).toBe(204);

    // A new draft shows the photos as they are now, not the frozen list.
    expect((await agent.post(`/api/quotes/${g.quote.id}/revisions`)).status).toBe(201);
    const r2 = await t.orm.em.fork().findOneOrFail(QuoteRevision, { quote: g.quote.id, number: 2 });
    expect(RevisionSettings.parse(r2.settings).sentPhotos).toBeUndefined();
    const draftPdf = await agent.get(`/api/quotes/${g.quote.id}/revisions/${r2.id}/pdf`).buffer(true).parse(binary);
    const draftText = await pdfText(draftPdf.body as Buffer);
    expect(draftText).toContain('Renamed after sending');
    expect(draftText).not.toContain('Cable route plan'); // unticked after the send
    // and the first revision's PDF is unchanged by all that
    const again = await pdfText(
      (await agent.get(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/pdf`).buffer(true).parse(binary)).body as Buffer,
    );
    expect(again).toContain('Cable route plan');
    expect(again).toContain('Front path at dusk');
  });
});
