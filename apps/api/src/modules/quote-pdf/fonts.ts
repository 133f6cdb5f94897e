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

const FACES = [
  { file: 'ibm-plex-sans-latin-400-normal.woff', fontWeight: 400, fontStyle: 'normal' },
  { file: 'ibm-plex-sans-latin-400-italic.woff', fontWeight: 400, fontStyle: 'italic' },
  { file: 'ibm-plex-sans-latin-600-normal.woff', fontWeight: 600, fontStyle: 'normal' },
  { file: 'ibm-plex-sans-latin-700-normal.woff', fontWeight: 700, fontStyle: 'normal' },
] as const;

/**
 * How many characters of shaped strings a face keeps (a glyph run costs some tens of bytes a
 * character; the bench's 30-circuit pack shapes 7,837 characters of distinct strings in its
 * regular face).
 */
const SHAPED_CHARS_KEPT = 200_000;

/** The part of a fontkit font the cache wraps: `layout` shapes a string into a glyph run. */
interface ShapingFont {
  layout: (text: string, ...options: unknown[]) => unknown;
}

/**
 * Remember each face's shaped strings. react-pdf shapes every text run through fontkit's
 * `layout` afresh, and a pack repeats a few hundred strings thousands of times (the bench's
 * 30-circuit pack: 6,017 runs in the regular face, 345 distinct). The glyph run is only read
 * afterwards: react-pdf scales its positions into new objects and copies its glyph list before
 * changing it.
 */
function rememberShaping(font: ShapingFont): void {
  const shape = font.layout.bind(font);
  const shaped = new Map<string, unknown>();
  let kept = 0;
  font.layout = (text, ...options) => {
    const key = `${JSON.stringify(options)}\u0000${text}`;
    let run = shaped.get(key);
    if (run === undefined) {
      if (kept + text.length > SHAPED_CHARS_KEPT) {
        shaped.clear();
        kept = 0;
      }
      run = shape(text, ...options);
      shaped.set(key, run);
      kept += text.length;
    }
    return run;
  };
}

let ready: Promise<void> | null = null;

/**
 * Register the shipped fonts once per process (or worker) and load them, each face's shaping
 * remembered. No network, no system fonts.
 */
export function preparePdfFonts(): Promise<void> {
  ready ??= (async () => {
    const dir = fontsDir();
    Font.register({
      family: PDF_FONT,
      fonts: FACES.map((f) => ({ src: fontSource(dir, f.file), fontWeight: f.fontWeight, fontStyle: f.fontStyle })),
    });
    // words are wrapped whole; the default hyphenation splits trade words badly
    Font.registerHyphenationCallback((word) => [word]);
    for (const f of FACES) {
      const descriptor = { fontFamily: PDF_FONT, fontWeight: f.fontWeight, fontStyle: f.fontStyle };
      await Font.load(descriptor);
      const font = Font.getFont(descriptor).data as unknown as ShapingFont | null;
      if (!font || typeof font.layout !== 'function') throw new Error(`The PDF font ${f.file} did not load.`);
      rememberShaping(font);
    }
  })();
  return ready;
}
