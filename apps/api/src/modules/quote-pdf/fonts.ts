import { existsSync, readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { inflateSync } from 'node:zlib';
import { Font } from '@react-pdf/renderer';

/** The family name the document uses. IBM Plex Sans (SIL OFL 1.1), .woff from @fontsource. */
export const PDF_FONT = 'Plex Sans';

/** apps/api/assets/fonts, from the sources (src/modules/quote-pdf) or from the bundle (dist/). */
function fontsDir(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  const candidates = [resolve(here, '../../../assets/fonts'), resolve(here, '../assets/fonts')];
  const found = candidates.find((d) => existsSync(resolve(d, 'ibm-plex-sans-latin-400-normal.woff')));
  if (!found) throw new Error(`The PDF fonts are missing; looked in ${candidates.join(', ')}`);
  return found;
}

/**
 * A WOFF 1.0 file as the plain TrueType/OpenType font it wraps (each table inflated, the
 * directory rebuilt). fontkit reads a WOFF table by inflating it again on every read, and the
 * PDF writer reads the glyph table once per glyph it embeds: on the 67-page installer's pack
 * that was about 4 % of the render.
 */
export function sfntFromWoff(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('Not a WOFF 1.0 font.');
  const flavor = woff.readUInt32BE(4);
  const count = woff.readUInt16BE(12);
  const tables = Array.from({ length: count }, (_, i) => {
    const at = 44 + i * 20;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(stored) : stored;
    if (data.length !== origLength) throw new Error('A WOFF table did not inflate to its stated length.');
    return { tag: woff.readUInt32BE(at), checksum: woff.readUInt32BE(at + 16), data };
  });
  const pad = (n: number) => (n + 3) & ~3;
  const headerLength = 12 + count * 16;
  const out = Buffer.alloc(tables.reduce((sum, t) => sum + pad(t.data.length), headerLength));
  const entrySelector = Math.floor(Math.log2(count));
  const searchRange = 2 ** entrySelector * 16;
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(count, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(count * 16 - searchRange, 10);
  let offset = headerLength;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
    offset += pad(t.data.length);
  });
  return out;
}

/** A shipped .woff as a data URL of the font it wraps (react-pdf takes a path, URL or data URL). */
function fontSource(dir: string, file: string): string {
  return `data:font/ttf;base64,${sfntFromWoff(readFileSync(resolve(dir, file))).toString('base64')}`;
}

let registered = false;

/** Register the shipped fonts once per process (or worker). No network, no system fonts. */
export function registerPdfFonts(): void {
  if (registered) return;
  const dir = fontsDir();
  Font.register({
    family: PDF_FONT,
    fonts: [
      { src: fontSource(dir, 'ibm-plex-sans-latin-400-normal.woff'), fontWeight: 400 },
      { src: fontSource(dir, 'ibm-plex-sans-latin-400-italic.woff'), fontWeight: 400, fontStyle: 'italic' },
      { src: fontSource(dir, 'ibm-plex-sans-latin-600-normal.woff'), fontWeight: 600 },
      { src: fontSource(dir, 'ibm-plex-sans-latin-700-normal.woff'), fontWeight: 700 },
    ],
  });
  // words are wrapped whole; the default hyphenation splits trade words badly
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
