import { crc32, deflateSync } from 'node:zlib';
import sharp from 'sharp';
import { QuoteRevision, type EntityManager } from '@gloaming/db';
import { addQuotePhoto } from '../src/modules/photos/service';
import { loadQuoteForFirm } from '../src/modules/quotes/service';
import { LocalFileStorage } from '../src/storage/storage';

/** A real photo-like JPEG: a dusk gradient with a lit path, made by sharp. */
export async function gardenJpeg(width = 1600, height = 1200): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}">
    <defs><linearGradient id="sky" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#1b2552"/><stop offset="1" stop-color="#4a5cab"/></linearGradient></defs>
    <rect width="100%" height="100%" fill="url(#sky)"/>
    <rect y="${height * 0.6}" width="100%" height="${height * 0.4}" fill="#23351f"/>
    <path d="M ${width * 0.45} ${height} L ${width * 0.5} ${height * 0.6} L ${width * 0.55} ${height * 0.6} L ${width * 0.7} ${height} Z" fill="#8f7a5a"/>
    ${[0.62, 0.72, 0.84].map((y) => `<circle cx="${width * 0.44}" cy="${height * y}" r="${width * 0.02}" fill="#ffd899"/>`).join('')}
  </svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 85 }).toBuffer();
}

export function tinyPng(): Promise<Buffer> {
  return sharp({ create: { width: 40, height: 30, channels: 3, background: '#e08c1a' } })
    .png()
    .toBuffer();
}

export function tinyWebp(): Promise<Buffer> {
  return sharp({ create: { width: 40, height: 30, channels: 3, background: '#7182c8' } })
    .webp()
    .toBuffer();
}

export function tinyGif(): Promise<Buffer> {
  return sharp({ create: { width: 8, height: 8, channels: 3, background: '#000000' } })
    .gif()
    .toBuffer();
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

/**
 * A decompression bomb: a valid PNG header declaring 60,000 x 60,000 pixels (3.6 gigapixels,
 * about 10 GB decoded) in a file of a few hundred bytes. Only the header is real work.
 */
export function pngBomb(): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(60_000, 0);
  ihdr.writeUInt32BE(60_000, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // truecolour
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  const firstRows = deflateSync(Buffer.alloc(60_001 * 4));
  return Buffer.concat([signature, chunk('IHDR', ihdr), chunk('IDAT', firstRows), chunk('IEND', Buffer.alloc(0))]);
}

/** A stored photo on a quote (through the real intake), and the quote's first revision id. */
export async function createQuoteMediaFixture(em: EntityManager, organizationId: string, quoteId: string, dataDir: string) {
  const quote = await loadQuoteForFirm(em, organizationId, quoteId);
  const photo = await addQuotePhoto(em, new LocalFileStorage(dataDir), quote, await tinyPng(), 'Fixture photo');
  const revision = await em.findOneOrFail(QuoteRevision, { quote: quote.id, number: 1 });
  return { photoId: photo.id, revisionId: revision.id };
}
