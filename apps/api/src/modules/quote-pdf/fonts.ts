import { existsSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
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

let registered = false;

/** Register the shipped fonts once per process (or worker). No network, no system fonts. */
export function registerPdfFonts(): void {
  if (registered) return;
  const dir = fontsDir();
  Font.register({
    family: PDF_FONT,
    fonts: [
      { src: resolve(dir, 'ibm-plex-sans-latin-400-normal.woff'), fontWeight: 400 },
      { src: resolve(dir, 'ibm-plex-sans-latin-400-italic.woff'), fontWeight: 400, fontStyle: 'italic' },
      { src: resolve(dir, 'ibm-plex-sans-latin-600-normal.woff'), fontWeight: 600 },
      { src: resolve(dir, 'ibm-plex-sans-latin-700-normal.woff'), fontWeight: 700 },
    ],
  });
  // words are wrapped whole; the default hyphenation splits trade words badly
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
