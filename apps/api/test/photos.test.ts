import request from 'supertest';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PHOTO_MAX_BYTES } from '@gloaming/contracts';
import { Photo } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote } from './estimate-fixture';
import { gardenJpeg, pngBomb, tinyGif, tinyPng, tinyWebp } from './image-fixtures';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());

function binary(res: { on: (e: string, cb: (c?: Buffer) => void) => void }, cb: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (c) => chunks.push(c!));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
}

async function quoteOf(firm: 'A' | 'B') {
  return createGardenQuote(t.orm.em.fork(), firm === 'A' ? t.firmA : t.firmB);
}

type Agent = ReturnType<typeof request.agent>;
const upload = (agent: Agent, quoteId: string, bytes: Buffer, filename: string, contentType = 'image/jpeg', caption?: string) => {
  const req = agent.post(`/api/quotes/${quoteId}/photos`);
  if (caption !== undefined) req.field('caption', caption);
  return req.attach('file', bytes, { filename, contentType });
};

describe('quote photos', () => {
  it('stores a JPEG with its size, a JPEG thumbnail, and a key that is not the file name', async () => {
    const g = await quoteOf('A');
    const agent = await t.signIn('estimator');
    const jpeg = await gardenJpeg();
    const res = await upload(agent, g.quote.id, jpeg, 'front path at dusk.jpg', 'image/jpeg', 'Front path at dusk');
    expect(res.status).toBe(201);
    expect(res.body.photo).toMatchObject({
      caption: 'Front path at dusk',
      contentType: 'image/jpeg',
      width: 1600,
      height: 1200,
      bytes: jpeg.length,
      onQuote: true,
      position: 0,
    });

    const stored = await t.orm.em.fork().findOneOrFail(Photo, res.body.photo.id);
    expect(stored.storageKey).toMatch(new RegExp(`^org/${t.firmA.firm.id}/quotes/${g.quote.id}/photos/[0-9a-f-]{36}\\.jpg$`));
    expect(stored.storageKey).not.toContain('dusk');

    const image = await agent.get(res.body.photo.imageUrl).buffer(true).parse(binary);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    expect(Buffer.compare(image.body as Buffer, jpeg)).toBe(0);

    const thumb = await agent.get(res.body.photo.thumbnailUrl).buffer(true).parse(binary);
    expect(thumb.status).toBe(200);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
    const meta = await sharp(thumb.body as Buffer).metadata();
    expect(meta.format).toBe('jpeg');
    expect(Math.max(meta.width!, meta.height!)).toBe(720);
    expect(meta.width! / meta.height!).toBeCloseTo(4 / 3, 2);
  });

  it('accepts PNG and WebP by their bytes, whatever they are called', async () => {
    const g = await quoteOf('A');
    const agent = await t.signIn('owner');
    const png = await upload(agent, g.quote.id, await tinyPng(), 'plan.webp', 'application/octet-stream');
    expect(png.status).toBe(201);
    expect(png.body.photo.contentType).toBe('image/png');
    const webp = await upload(agent, g.quote.id, await tinyWebp(), 'plan.png', 'image/png');
    expect(webp.status).toBe(201);
    expect(webp.body.photo.contentType).toBe('image/webp');
    expect(webp.body.photo.position).toBe(1);
  });

  it('refuses a text file named .jpg, a GIF and a damaged JPEG with clear problems', async () => {
    const g = await quoteOf('A');
    const agent = await t.signIn('estimator');
    const text = await upload(agent, g.quote.id, Buffer.from('not really a photo, just words'), 'holiday.jpg', 'image/jpeg');
    expect(text.status).toBe(415);
    expect(text.headers['content-type']).toContain('application/problem+json');
    expect(text.body.type).toBe('/problems/unsupported-image-type');
    const gif = await upload(agent, g.quote.id, await tinyGif(), 'anim.jpg');
    expect(gif.status).toBe(415);
    const jpeg = await gardenJpeg(400, 300);
    const truncated = await upload(agent, g.quote.id, jpeg.subarray(0, 400), 'cut.jpg');
    expect([415, 422]).toContain(truncated.status);
    expect(truncated.headers['content-type']).toContain('application/problem+json');
    const none = await agent.post(`/api/quotes/${g.quote.id}/photos`).field('caption', 'no file');
    expect(none.status).toBe(400);
    expect(none.body.errors[0].path).toBe('body.file');
    const json = await agent.post(`/api/quotes/${g.quote.id}/photos`).send({ file: 'x' });
    expect(json.status).toBe(400);
    const long = await upload(agent, g.quote.id, jpeg, 'a.jpg', 'image/jpeg', 'x'.repeat(301));
    expect(long.status).toBe(400);
    expect(long.body.errors[0].path).toBe('body.caption');
    expect(await t.orm.em.fork().count(Photo, { quote: g.quote.id })).toBe(0);
  });

  it('answers 413 past the size limit', async () => {
    const g = await quoteOf('A');
    const agent = await t.signIn('estimator');
    const big = Buffer.concat([await gardenJpeg(200, 150), Buffer.alloc(PHOTO_MAX_BYTES + 1)]);
    const res = await upload(agent, g.quote.id, big, 'huge.jpg');
    expect(res.status).toBe(413);
    expect(res.body.type).toBe('/problems/file-too-large');
  });

  it('refuses a decompression bomb from its header, before decoding it', async () => {
    const g = await quoteOf('A');
    const agent = await t.signIn('estimator');
    const bomb = pngBomb();
    expect(bomb.length).toBeLessThan(20_000);
    const res = await upload(agent, g.quote.id, bomb, 'plan.png', 'image/png');
    expect(res.status).toBe(422);
    expect(res.body.type).toBe('/problems/image-too-many-pixels');
    expect(res.body.detail).toContain('60000 x 60000');
  });

  it('changes captions and the on-quote choice with a version check, reorders and deletes', async () => {
    const g = await quoteOf('A');
    const agent = await t.signIn('estimator');
    const ids: string[] = [];
    for (const name of ['a', 'b', 'c']) ids.push((await upload(agent, g.quote.id, await tinyPng(), `${name}.png`)).body.photo.id);
    const first = (await agent.get(`/api/quotes/${g.quote.id}/photos`)).body.photos[0];
    const patched = await agent
      .patch(`/api/quotes/${g.quote.id}/photos/${ids[0]}`)
      .send({ caption: 'Side gate', onQuote: false, version: first.version });
    expect(patched.status).toBe(200);
    expect(patched.body.photo).toMatchObject({ caption: 'Side gate', onQuote: false });
    const stale = await agent
      .patch(`/api/quotes/${g.quote.id}/photos/${ids[0]}`)
      .send({ caption: 'Old', version: first.version });
    expect(stale.status).toBe(409);
    const empty = await agent.patch(`/api/quotes/${g.quote.id}/photos/${ids[0]}`).send({ version: 1 });
    expect(empty.status).toBe(400);

    const order = await agent.put(`/api/quotes/${g.quote.id}/photos/order`).send({ photoIds: [ids[2], ids[0], ids[1]] });
    expect(order.status).toBe(200);
    expect(order.body.photos.map((p: { id: string }) => p.id)).toEqual([ids[2], ids[0], ids[1]]);
    const partial = await agent.put(`/api/quotes/${g.quote.id}/photos/order`).send({ photoIds: [ids[2], ids[0]] });
    expect(partial.status).toBe(400);
    const twice = await agent.put(`/api/quotes/${g.quote.id}/photos/order`).send({ photoIds: [ids[2], ids[2], ids[1]] });
    expect(twice.status).toBe(400);

    const del = await agent.delete(`/api/quotes/${g.quote.id}/photos/${ids[1]}`);
    expect(del.status).toBe(204);
    expect((await agent.get(`/api/quotes/${g.quote.id}/photos/${ids[1]}/image`)).status).toBe(404);
    expect((await agent.get(`/api/quotes/${g.quote.id}/photos`)).body.photos).toHaveLength(2);
  });

  it("keeps another firm's photos and installers out", async () => {
    const theirs = await quoteOf('B');
    const ownerB = await t.signIn('owner', 'B');
    const photo = (await upload(ownerB, theirs.quote.id, await tinyPng(), 'b.png')).body.photo;
    const mine = await quoteOf('A');
    const estimator = await t.signIn('estimator');
    expect((await estimator.get(`/api/quotes/${theirs.quote.id}/photos`)).status).toBe(404);
    expect((await estimator.get(photo.imageUrl)).status).toBe(404);
    expect((await estimator.get(photo.thumbnailUrl)).status).toBe(404);
    // another firm's photo under my own quote is not found either
    expect((await estimator.get(`/api/quotes/${mine.quote.id}/photos/${photo.id}/image`)).status).toBe(404);
    expect((await upload(estimator, theirs.quote.id, await tinyPng(), 'x.png')).status).toBe(404);
    expect(
      (await estimator.patch(`/api/quotes/${theirs.quote.id}/photos/${photo.id}`).send({ caption: 'mine now', version: 1 }))
        .status,
    ).toBe(404);
    expect((await estimator.delete(`/api/quotes/${theirs.quote.id}/photos/${photo.id}`)).status).toBe(404);
    const installer = await t.signIn('installer');
    expect((await installer.get(`/api/quotes/${mine.quote.id}/photos`)).status).toBe(403);
    expect((await upload(installer, mine.quote.id, await tinyPng(), 'x.png')).status).toBe(403);
    expect((await request(t.app).get(photo.imageUrl)).status).toBe(401);
  });
});
