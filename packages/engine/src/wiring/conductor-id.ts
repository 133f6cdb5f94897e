/**
 * Conductor ends as they are written on a terminal schedule. One plain text form, so a
 * schedule typed by a person and one the engine generates read the same:
 *
 * - `driver+`, `driver-`: the driver's (or constant-voltage supply's) output lead;
 * - `fitting:3+`, `fitting:3-`: the tail of the 3rd fitting along the string (1-based);
 * - `link:2/core:1/end:A`: core 1 of link cable 2, its A end (B is the far end).
 *
 * Parsing is forgiving about case, spaces and the typographic minus (−, –), strict about
 * everything else.
 */
import { flatText } from './flat-text';

export type EndPolarity = '+' | '-';

export type ConductorEnd =
  | { kind: 'driver'; polarity: EndPolarity }
  | { kind: 'fitting'; fitting: number; polarity: EndPolarity }
  | { kind: 'link'; link: number; core: number; end: 'A' | 'B' };

/** Parse a conductor end; `null` when the text is not one of the three forms. */
export function parseConductorEnd(text: string): ConductorEnd | null {
  const s = scratch;
  if (!scanConductorEnd(text, s)) return null;
  const polarity: EndPolarity = s.minus ? '-' : '+';
  if (s.kind === 'driver') return { kind: 'driver', polarity };
  if (s.kind === 'fitting') return { kind: 'fitting', fitting: s.fitting, polarity };
  return { kind: 'link', link: s.link, core: s.core, end: s.endB ? 'B' : 'A' };
}

/** What `scanConductorEnd` found; one object reused across calls in hot loops. */
export interface ConductorScan {
  kind: 'driver' | 'fitting' | 'link';
  fitting: number;
  minus: boolean;
  link: number;
  core: number;
  endB: boolean;
  /** The text was already in canonical form. */
  canonical: boolean;
}

export function newConductorScan(): ConductorScan {
  return { kind: 'driver', fitting: 0, minus: false, link: 0, core: 0, endB: false, canonical: true };
}

const scratch = newConductorScan();

/**
 * Read a conductor end into `out` without allocating when the text is canonical (what the
 * generator writes); other spellings are normalised first. False when unreadable.
 */
export function scanConductorEnd(text: string, out: ConductorScan): boolean {
  if (typeof text !== 'string') return false;
  out.canonical = scanCanonical(text, out);
  return out.canonical || scanCanonical(text.toLowerCase().replace(/[\u2212\u2013]/g, '-').replace(/\s+/g, ''), out);
}

const CODE_0 = 48;
const CODE_9 = 57;
const CODE_PLUS = 43;
const CODE_MINUS = 45;

let digitsEnd = 0;

/** Digits from `from` to the next non-digit (end index left in `digitsEnd`); -1 when none or too many. */
function digits(t: string, from: number): number {
  let i = from;
  let value = 0;
  while (i < t.length) {
    const c = t.charCodeAt(i);
    if (c < CODE_0 || c > CODE_9) break;
    value = value * 10 + (c - CODE_0);
    i++;
  }
  digitsEnd = i;
  return i === from || i - from > 9 ? -1 : value;
}

/** The polarity sign as the last character at `i`: sets `out.minus`; false when absent. */
function polarityAt(t: string, i: number, out: ConductorScan): boolean {
  if (i !== t.length - 1) return false;
  const c = t.charCodeAt(i);
  out.minus = c === CODE_MINUS;
  return c === CODE_MINUS || c === CODE_PLUS;
}

/**
 * Does `t` have `prefix` at `at`? The same as `t.startsWith(prefix, at)`, read a character at a
 * time: the optimising compiler keeps this inline, where the built-in is a call each time
 * (four a terminal in the check and the step list).
 */
export function hasTextAt(t: string, prefix: string, at = 0): boolean {
  if (at + prefix.length > t.length) return false;
  for (let i = 0; i < prefix.length; i++) if (t.charCodeAt(at + i) !== prefix.charCodeAt(i)) return false;
  return true;
}

function scanCanonical(t: string, out: ConductorScan): boolean {
  if (hasTextAt(t, 'fitting:')) {
    const fitting = digits(t, 8);
    if (fitting < 1) return false;
    out.kind = 'fitting';
    out.fitting = fitting;
    return polarityAt(t, digitsEnd, out);
  }
  if (hasTextAt(t, 'driver')) {
    out.kind = 'driver';
    return polarityAt(t, 6, out);
  }
  if (hasTextAt(t, 'link:')) {
    const link = digits(t, 5);
    if (link < 1 || !hasTextAt(t, '/core:', digitsEnd)) return false;
    const core = digits(t, digitsEnd + 6);
    const at = digitsEnd;
    if (core < 1 || !hasTextAt(t, '/end:', at) || at + 6 !== t.length) return false;
    const e = t[at + 5];
    if (e !== 'A' && e !== 'a' && e !== 'B' && e !== 'b') return false;
    out.kind = 'link';
    out.link = link;
    out.core = core;
    out.endB = e === 'B' || e === 'b';
    return true;
  }
  return false;
}

/** The canonical text of a conductor end (what the schedule generator writes). */
export function formatConductorEnd(end: ConductorEnd): string {
  switch (end.kind) {
    case 'driver':
      return `driver${end.polarity}`;
    case 'fitting':
      return `fitting:${end.fitting}${end.polarity}`;
    case 'link':
      return `link:${end.link}/core:${end.core}/end:${end.end}`;
  }
}

/**
 * Canonical texts of the generator's conductor ends, made once per process and shared by
 * every schedule after (like the other tables the engine reuses from call to call). Written
 * with a template literal, a text of 13 characters or more (`fitting:1000+` on) is a chain of
 * fragments, and whoever first reads it (the wiring check) makes a flat copy of it, so a
 * schedule of thousands of ends paid for each end twice on every call. Fitting numbers up to
 * TEXT_TABLE_LIMIT are kept (a string of up to 100 fittings is what a circuit holds; the
 * table for 65,536 fittings is about 8 MB), higher ones are written fresh each time.
 */
const TEXT_TABLE_LIMIT = 65_536;
/** Fitting k: `fitting:k` at 3k, `fitting:k+` at 3k+1, `fitting:k-` at 3k+2. */
const fittingTexts: string[] = ['', '', ''];
/** Link j: `link:j` at 5j, then `/core:1/end:A`, `/core:1/end:B`, `/core:2/end:A`, `/core:2/end:B`. */
const linkTexts: string[] = ['', '', '', '', ''];

function tableIndex(x: number): boolean {
  return Number.isInteger(x) && x >= 1 && x < TEXT_TABLE_LIMIT;
}

/** `fitting:3+` or `fitting:3-` (sign `+` / `-`), or `fitting:3` (the tail itself, sign ''). */
export function fittingEndText(fitting: number, sign: EndPolarity | ''): string {
  const slot = sign === '' ? 0 : sign === '+' ? 1 : 2;
  if (!tableIndex(fitting)) return flatText(`fitting:${fitting}${sign}`);
  while (fittingTexts.length <= 3 * fitting) {
    const name = flatText(`fitting:${fittingTexts.length / 3}`);
    fittingTexts.push(name, flatText(`${name}+`), flatText(`${name}-`));
  }
  return fittingTexts[3 * fitting + slot]!;
}

/** `link:2`: the link cable itself (its cable entry). */
export function linkText(link: number): string {
  return linkEndText(link, 0, 'A');
}

/** `link:2/core:1/end:A` (core 0: `link:2`, see linkText). */
export function linkEndText(link: number, core: number, end: 'A' | 'B'): string {
  if (!tableIndex(link) || !(core === 0 || core === 1 || core === 2)) {
    return core === 0 ? `link:${link}` : flatText(`link:${link}/core:${core}/end:${end}`);
  }
  while (linkTexts.length <= 5 * link) {
    const name = `link:${linkTexts.length / 5}`;
    linkTexts.push(
      name,
      flatText(`${name}/core:1/end:A`),
      flatText(`${name}/core:1/end:B`),
      flatText(`${name}/core:2/end:A`),
      flatText(`${name}/core:2/end:B`),
    );
  }
  return linkTexts[5 * link + (core === 0 ? 0 : 2 * core - (end === 'A' ? 1 : 0))]!;
}

/** Plain words for a conductor end, e.g. "fitting 3 -" or "link cable 2 core 1 (end A)". */
export function describeConductorEnd(end: ConductorEnd, fittingLabels?: readonly string[]): string {
  switch (end.kind) {
    case 'driver':
      return `driver lead ${end.polarity}`;
    case 'fitting': {
      const label = fittingLabels?.[end.fitting - 1];
      return `fitting ${end.fitting}${label ? ` (${label})` : ''} ${end.polarity}`;
    }
    case 'link':
      return `link cable ${end.link} core ${end.core} (end ${end.end})`;
  }
}
