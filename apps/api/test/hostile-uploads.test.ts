/**
 * Hostile uploads on every upload route (quote photos, the firm logo, supplier price lists):
 * names with path traversal and odd Unicode never reach the file system, bytes that do not
 * match the claimed type are refused, an oversized file is refused with 413, and a small PNG
 * declaring 30,000 x 30,000 pixels (a decompression bomb, 2.7 GB of RGB once decoded) is
 * refused from its header while the process's memory stays flat.
 */
import { readdirSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { crc32, deflateSync } from 'node:zlib';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LOGO_MAX_BYTES, PHOTO_MAX_BYTES } from '@gloaming/contracts';
import { ImportJob, Photo } from '@gloaming/db';
import { startTestServer, type TestServer } from './harness';
import { createGardenQuote } from './estimate-fixture';
import { gardenJpeg, tinyPng } from './image-fixtures';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(async () => t.close());

type Agent = ReturnType<typeof request.agent>;

/** Names people (or attackers) give files: traversal both ways, control and bidi characters, decomposed accents. */
const HOSTILE_NAMES = [
  '../../../../etc/passwd.jpg',
  '..\\..\\..\\windows\\win.ini.jpg',
  '/absolute/path/photo.jpg',
  'photo\u202Egpj.exe', // right-to-left override: shows as "photoexe.jpg"
  'garde\u0301n \u{1F33F}.jpg', // a combining accent and an emoji
  'CON.jpg',
  `${'x'.repeat(400)}.jpg`,
];

/** A PNG whose header declares `size` x `size` pixels over a few kilobytes of real data. */
function declaredPng(size: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(body));
    return Buffer.concat([len, body, crc]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // truecolour RGB
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([signature, chunk('IHDR', ihdr), chunk('IDAT', deflateSync(Buffer.alloc((size * 3 + 1) * 4))), chunk('IEND', Buffer.alloc(0))]);
}

/** Every file under `dir`, relative to it. */
function filesUnder(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    for (const name of readdirSync(d)) {
      const p = join(d, name);
      if (statSync(p).isDirectory()) walk(p);
      else out.push(relative(dir, p));
    }
  };
  walk(dir);
  return out;
}

/** Run `work` while sampling the resident set every 2 ms; the peak rise above the start, in MB. */
async function peakRssRiseMb<T>(work: () => Promise<T>): Promise<{ result: T; riseMb: number }> {
  const start = process.memoryUsage().rss;
  let peak = start;
  const timer = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage().rss);
  }, 2);
  try {
    const result = await work();
    peak = Math.max(peak, process.memoryUsage().rss);
    return { result, riseMb: (peak - start) / 1024 / 1024 };
  } finally {
    clearInterval(timer);
  }
}

describe('photo uploads', () => {
  it('stores a photo with a hostile name under a key of its own; the name never becomes a path', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA);
    const agent: Agent = await t.signIn('estimator');
    const jpeg = await gardenJpeg(320, 240);
    for (const name of HOSTILE_NAMES) {
      const res = await agent.post(`/api/quotes/${g.quote.id}/photos`).attach('file', jpeg, { filename: name, contentType: 'image/jpeg' });
      expect(res.status, name).toBe(201);
    }
    const photos = await t.orm.em.fork().find(Photo, { quote: g.quote.id });
    expect(photos).toHaveLength(HOSTILE_NAMES.length);
    const files = filesUnder(join(t.config.dataDir, 'files'));
    for (const p of photos) {
      expect(p.storageKey).toMatch(/^[A-Za-z0-9/_.-]+$/);
      expect(p.storageKey).not.toContain('..');
      expect(files).toContain(p.storageKey);
    }
    // nothing was written outside the uploads folder, nor named after an upload
    expect(files.every((f) => !f.startsWith('..') && !/passwd|win\.ini|absolute|gpj|CON/.test(f))).toBe(true);
    // a NUL byte in the part header makes the upload unreadable: a clear 400, nothing stored
    const nul = await agent.post(`/api/quotes/${g.quote.id}/photos`).attach('file', jpeg, { filename: 'garden\u0000.jpg', contentType: 'image/jpeg' });
    expect(nul.status).toBe(400);
    expect(nul.headers['content-type']).toContain('application/problem+json');
    expect(await t.orm.em.fork().count(Photo, { quote: g.quote.id })).toBe(HOSTILE_NAMES.length);
    const served = await agent.get(`/api/quotes/${g.quote.id}/photos/${photos[0]!.id}/image`).expect(200);
    expect(served.headers['content-disposition']).toMatch(/^inline; filename="photo-\d+\.jpg"$/);
  });

  it('goes by the bytes: a PNG called .jpg is a PNG; a PDF, a zip and an HTML page called .jpg are refused', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA);
    const agent = await t.signIn('estimator');
    const png = await agent.post(`/api/quotes/${g.quote.id}/photos`).attach('file', await tinyPng(), { filename: 'garden.jpg', contentType: 'image/jpeg' });
    expect(png.status).toBe(201);
    const stored = await t.orm.em.fork().findOneOrFail(Photo, { quote: g.quote.id });
    expect(stored.storageKey.endsWith('.png')).toBe(true);
    const impostors = {
      pdf: Buffer.from('%PDF-1.7\n1 0 obj << >> endobj\ntrailer << >>\n%%EOF\n'),
      zip: Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(60)]),
      html: Buffer.from('<!doctype html><script>alert(1)</script>'),
    };
    for (const [kind, bytes] of Object.entries(impostors)) {
      const res = await agent.post(`/api/quotes/${g.quote.id}/photos`).attach('file', bytes, { filename: `${kind}.jpg`, contentType: 'image/jpeg' });
      expect(res.status, kind).toBe(415);
      expect(res.body.type).toBe('/problems/unsupported-image-type');
    }
  });

  it('refuses a file past the size limit with 413', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA);
    const agent = await t.signIn('estimator');
    const big = Buffer.concat([await gardenJpeg(200, 150), Buffer.alloc(PHOTO_MAX_BYTES + 1)]);
    const res = await agent.post(`/api/quotes/${g.quote.id}/photos`).attach('file', big, { filename: 'huge.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(413);
  });

  it('refuses a 30,000 x 30,000 PNG from its header, without the memory to decode it', async () => {
    const g = await createGardenQuote(t.orm.em.fork(), t.firmA);
    const agent = await t.signIn('estimator');
    const bomb = declaredPng(30_000);
    const { result: res, riseMb } = await peakRssRiseMb(() =>
      agent.post(`/api/quotes/${g.quote.id}/photos`).attach('file', bomb, { filename: 'plan.png', contentType: 'image/png' }),
    );
    console.log(`decompression bomb (photo): ${bomb.length} bytes declaring 30000 x 30000 (${((30_000 * 30_000 * 3) / 1e9).toFixed(1)} GB as RGB); answered ${res.status}; peak RSS rise ${riseMb.toFixed(1)} MB`);
    expect(res.status).toBe(422);
    expect(res.body.type).toBe('/problems/image-too-many-pixels');
    expect(res.body.detail).toContain('30000 x 30000');
    // decoding would need 2.7 GB; a header check costs next to nothing
    expect(riseMb).toBeLessThan(150);
    expect(await t.orm.em.fork().count(Photo, { quote: g.quote.id })).toBe(0);
  });
});

describe('the firm logo', () => {
  it('refuses the bomb, an impostor and an oversized file; a hostile name is harmless', async () => {
    const owner = await t.signIn('owner');
    const { result: bomb, riseMb } = await peakRssRiseMb(() =>
      owner.put('/api/organization/logo').attach('file', declaredPng(30_000), { filename: 'logo.png', contentType: 'image/png' }),
    );
    console.log(`decompression bomb (logo): answered ${bomb.status}; peak RSS rise ${riseMb.toFixed(1)} MB`);
    expect(bomb.status).toBe(422);
    expect(bomb.body.type).toBe('/problems/image-too-many-pixels');
    expect(riseMb).toBeLessThan(150);

    const pdf = await owner.put('/api/organization/logo').attach('file', Buffer.from('%PDF-1.4\n%%EOF\n'), { filename: 'logo.png', contentType: 'image/png' });
    expect(pdf.status).toBe(415);
    const big = await owner.put('/api/organization/logo').attach('file', Buffer.concat([await tinyPng(), Buffer.alloc(LOGO_MAX_BYTES)]), 'logo.png');
    expect(big.status).toBe(413);

    const named = await owner.put('/api/organization/logo').attach('file', await tinyPng(), { filename: '../../../logo\u202Egnp.exe', contentType: 'image/png' });
    expect(named.status).toBe(200);
    const files = filesUnder(join(t.config.dataDir, 'files'));
    expect(files.filter((f) => f.includes('/logo/'))).toHaveLength(1);
    expect(files.every((f) => !f.startsWith('..') && !f.includes('exe'))).toBe(true);
  });
});

describe('supplier price lists', () => {
  it('refuses images, PDFs and workbooks called .csv, and keeps a hostile file name as data only', async () => {
    const agent = await t.signIn('estimator');
    const cases: [string, Buffer, RegExp][] = [
      ['png', await tinyPng(), /PNG image/],
      ['pdf', Buffer.from('%PDF-1.7\n%%EOF\n'), /PDF/],
      ['xlsx', Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(200, 1)]), /workbook/],
      ['binary', Buffer.concat([Buffer.from('code,name\r\n'), Buffer.from([0x00, 0x01, 0x02, 0x03]), Buffer.from('\r\nA1,x\r\n')]), /binary/],
    ];
    for (const [kind, bytes, message] of cases) {
      const res = await agent.post('/api/product-imports').field('supplier', 'Kestrel Lighting Supply').attach('file', bytes, `${kind}.csv`);
      expect(res.status, kind).toBe(400);
      expect(res.body.errors[0]).toMatchObject({ path: 'body.file' });
      expect(res.body.detail, kind).toMatch(message);
    }
    expect(await t.orm.em.fork().count(ImportJob, {})).toBe(0);

    const name = '../../../prices\u202Evsc.exe';
    const ok = await agent
      .post('/api/product-imports')
      .field('supplier', 'Kestrel Lighting Supply')
      .attach('file', Buffer.from('Code,Name,Price\r\nKL-1,Deck light,12.50\r\n'), name);
    expect(ok.status).toBe(201);
    // busboy keeps only the last path segment; the odd characters survive intact, as text only
    expect(ok.body.job.fileName).toBe('prices\u202Evsc.exe');
    const job = await t.orm.em.fork().findOneOrFail(ImportJob, ok.body.job.id);
    expect(job.storageKey).not.toContain('..');
    expect(filesUnder(join(t.config.dataDir, 'files'))).toContain(job.storageKey);
  });
});
