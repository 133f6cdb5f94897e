import { writeFile } from 'node:fs/promises';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote, CUSTOMER_NAME, GARDEN_DEPOSIT_TEXT, GARDEN_TOTAL_TEXT, gardenEstimate } from './estimate-fixture';
import { gardenJpeg, tinyPng } from './image-fixtures';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());

async function pdfText(bytes: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

function binary(res: { on: (e: string, cb: (c?: Buffer) => void) => void }, cb: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (c) => chunks.push(c!));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
}

describe('GET /api/quotes/:id/revisions/:revisionId/pdf', () => {
  it('renders the quotation with the customer, the total and the deposit, never a cost', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA);
    const agent = await t.signIn('estimator');
    const res = await agent.get(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toContain('attachment; filename="Quotation Q-');
    const body = res.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');
    if (process.env.GLOAMING_PDF_OUT) await writeFile(process.env.GLOAMING_PDF_OUT, body);

    const text = await pdfText(body);
    expect(text).toContain(CUSTOMER_NAME);
    expect(text).toContain(GARDEN_TOTAL_TEXT);
    expect(text).toContain(GARDEN_DEPOSIT_TEXT);
    expect(text).toContain('Firm A Lighting');
    expect(text).toMatch(/Optional extra/i);
    expect(text).toMatch(/Choose one: Terrace driver/i);
    expect(text).toMatch(/licensed electrician/);
    // the unit cost of every line is £17.17: neither it nor any margin may reach the homeowner
    expect(text).not.toContain('17.17');
    expect(text.toLowerCase()).not.toContain('margin');
    expect(text.toLowerCase()).not.toContain('cost');
  });

  it('prints the photos chosen for the quote, in order, and leaves the others out', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA);
    const agent = await t.signIn('owner');
    const up = (bytes: Buffer, caption: string) =>
      agent
        .post(`/api/quotes/${g.quote.id}/photos`)
        .field('caption', caption)
        .attach('file', bytes, { filename: 'x.jpg', contentType: 'image/jpeg' });
    const shown = (await up(await gardenJpeg(), 'Front path at dusk')).body.photo;
    const hidden = (await up(await tinyPng(), 'Inside the shed')).body.photo;
    const plan = (await up(await tinyPng(), 'Cable route plan')).body.photo;
    expect(
      (await agent.patch(`/api/quotes/${g.quote.id}/photos/${hidden.id}`).send({ onQuote: false, version: hidden.version }))
        .status,
    ).toBe(200);
    await agent.put(`/api/quotes/${g.quote.id}/photos/order`).send({ photoIds: [plan.id, hidden.id, shown.id] });

    const res = await agent.get(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const text = await pdfText(res.body as Buffer);
    expect(text).toContain('photos and plans');
    expect(text).not.toContain('Inside the shed');
    expect(text.indexOf('Cable route plan')).toBeGreaterThan(-1);
    expect(text.indexOf('Cable route plan')).toBeLessThan(text.indexOf('Front path at dusk'));
  });

  it('answers 422 with the reason, not a crash, for an estimate the engine cannot price', async () => {
    const content = gardenEstimate();
    content.sections[1]!.lines[1]!.alternativeGroup = 'Tree'; // optional and pick-one at once
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { content });
    const agent = await t.signIn('estimator');
    const res = await agent.get(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/pdf`);
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect(res.body.detail).toContain('both optional and part of a pick-one group');
  });

  it("answers 404 for another firm's quote or a revision of another quote, and 403 for installers", async () => {
    const mine = await createGardenQuote(t.orm.em.fork(), t.firmA);
    const theirs = await createGardenQuote(t.orm.em.fork(), t.firmB);
    const estimator = await t.signIn('estimator');
    const foreign = await estimator.get(`/api/quotes/${theirs.quote.id}/revisions/${theirs.revision.id}/pdf`);
    expect(foreign.status).toBe(404);
    expect(foreign.headers['content-type']).toContain('application/problem+json');
    const mixed = await estimator.get(`/api/quotes/${mine.quote.id}/revisions/${theirs.revision.id}/pdf`);
    expect(mixed.status).toBe(404);
    const installer = await t.signIn('installer');
    expect((await installer.get(`/api/quotes/${mine.quote.id}/revisions/${mine.revision.id}/pdf`)).status).toBe(403);
    const bad = await estimator.get(`/api/quotes/not-an-id/revisions/${mine.revision.id}/pdf`);
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('params.id');
  });
});
