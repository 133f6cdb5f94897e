import { writeFile } from 'node:fs/promises';
import type { EstimateContent, EstimateLine } from '@gloaming/contracts';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote, CUSTOMER_NAME, GARDEN_DEPOSIT_TEXT, GARDEN_TOTAL_TEXT, gardenEstimate } from './estimate-fixture';
import { gardenJpeg, tinyPng } from './image-fixtures';
import { binary, pdfPages, pdfText } from './support/pdf-text';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());


const words = (text: string) => text.split(/\s+/).filter(Boolean);

/**
 * Whether the description's words all appear, in order, from its unique reference on: the
 * cells of a row come out interleaved with the description's wrapped lines, so a plain
 * substring test would miss a description that is there.
 */
function readsInOrder(pageWords: string[], description: string): boolean {
  const wanted = words(description);
  const start = pageWords.indexOf(wanted[0]!);
  if (start < 0) return false;
  let at = start;
  for (const w of wanted) {
    at = pageWords.indexOf(w, at);
    if (at < 0 || at - start > wanted.length * 6) return false;
    at += 1;
  }
  return true;
}

const TRADE_WORDS = ['bollard', 'spike', 'uplighter', 'driver', 'IP65', 'recessed', 'deck', 'warm-white', 'cable', 'gland'];

/**
 * An invented long quote: `lines` lines over `sections` areas, every description starting
 * with its own reference (LINE-n), some long with long notes, some optional or pick-one.
 */
function longEstimate(lines: number, sections: number): EstimateContent {
  const base = gardenEstimate();
  const template = base.sections[0]!.lines[0]!;
  const per = Math.ceil(lines / sections);
  let n = 0;
  return {
    ...base,
    sections: Array.from({ length: sections }, (_, si) => ({
      id: `area-${si + 1}`,
      name: `Garden area ${si + 1}`,
      lines: Array.from({ length: Math.max(0, Math.min(per, lines - si * per)) }, (): EstimateLine => {
        n += 1;
        const length = n % 9 === 0 ? 60 : 4 + (n % 5);
        const group = n >= 13 && n % 13 <= 1 ? `Driver choice ${n - (n % 13)}` : null;
        const description = [`LINE-${n}`, ...Array.from({ length }, (_, i) => TRADE_WORDS[(n + i) % TRADE_WORDS.length])].join(
          ' ',
        );
        return {
          ...template,
          id: `long-${n}`,
          description,
          note: n % 9 === 0 ? `Fixing detail for LINE-${n}: ${TRADE_WORDS.join(' ').repeat(3)}` : '',
          quantityMilli: 1000 + (n % 4) * 1000,
          unitPriceMinor: 1200 + n,
          // pick-one pairs (LINE-13 chosen over LINE-14, ...), optional extras elsewhere
          optional: group === null && n % 11 === 0,
          selected: group === null ? n % 11 !== 0 || n % 2 === 0 : n % 13 === 0,
          alternativeGroup: group,
        };
      }),
    })),
  };
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

  // Our own layout rules for a multi-page quote (the page count is the document's own): every
  // page carries the firm, the reference and "Page N of M"; every line's description is printed
  // once, whole; a section heading never ends a page; a continued table repeats its column heads.
  it.each([
    [1, 1],
    [160, 7],
  ])('prints every one of %i lines once, and the footer on every page (%i areas)', async (lineCount, sections) => {
    const content = longEstimate(lineCount, sections);
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA, { content });
    const agent = await t.signIn('estimator');
    const res = await agent.get(`/api/quotes/${g.quote.id}/revisions/${g.revision.id}/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const pages = await pdfPages(res.body as Buffer);
    if (lineCount > 100) expect(pages.length).toBeGreaterThan(4);
    pages.forEach((text, i) => {
      expect(text, `page ${i + 1}`).toContain(`Page ${i + 1} of ${pages.length}`);
      expect(text, `page ${i + 1}`).toContain('Firm A Lighting');
    });
    const pageWords = pages.map(words);
    for (const section of content.sections)
      for (const line of section.lines) {
        const ref = words(line.description)[0]!;
        const on = pageWords.flatMap((w, i) => (w.filter((x) => x === ref).length ? [i] : []));
        expect(on, `${ref} printed on exactly one page`).toHaveLength(1);
        expect(
          pageWords[on[0]!]!.filter((x) => x === ref),
          `${ref} printed once`,
        ).toHaveLength(1);
        expect(readsInOrder(pageWords[on[0]!]!, line.description), `${ref} printed whole`).toBe(true);
      }
    for (const [i, text] of pages.entries()) {
      const body = text
        .split('\n')
        .map((l) => l.trim())
        .filter((l) => l && !l.includes('Firm A Lighting'));
      expect(body.at(-1), `page ${i + 1} ends with a heading`).not.toMatch(/^(Garden area \d+|Terms)$/);
      if (i > 0 && !/^Garden area \d+$/.test(body[0]!) && body[0]!.startsWith('LINE-'))
        throw new Error(`page ${i + 1} continues a table without its column heads: ${body[0]}`);
    }
    const all = pages.join('\n');
    expect(all).toMatch(/licensed electrician/);
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
