import { finding, type Finding } from '../findings';

/**
 * IP code per IEC 60529 ("IP" + first numeral + second numeral + optional additional letter
 * + optional supplementary letters), with ISO 20653's 9K and dual (multiple) codes such as
 * IP66/IP68.
 */

/** First characteristic numeral: protection against solid objects (0-6); null for X. */
export type SolidsDigit = 0 | 1 | 2 | 3 | 4 | 5 | 6;
/** Second characteristic numeral: protection against water (0-9); null for X. */
export type WaterDigit = 0 | 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8 | 9;
/** Additional letter: protection of persons against access to hazardous parts. */
export type AccessLetter = 'A' | 'B' | 'C' | 'D';
/** Supplementary letters: H high-voltage apparatus, M/S water test with parts moving/stationary, W weather. */
export type SupplementaryLetter = 'H' | 'M' | 'S' | 'W';

export interface IpRating {
  solids: SolidsDigit | null;
  water: WaterDigit | null;
  /** ISO 20653 9K (high-pressure, high-temperature jets). */
  water9K: boolean;
  access: AccessLetter | null;
  supplementary: SupplementaryLetter[];
}

export interface IpCode {
  /** Canonical text, e.g. "IP66/IP68". */
  text: string;
  /** One rating per part of a dual (multiple) code, in the order written. */
  ratings: IpRating[];
}

export type IpParseResult = { ok: true; code: IpCode } | { ok: false; findings: Finding[] };

const PART = /^IP([0-6X])([0-9X])(K?)([A-D])?([HMSW]*)$/;

function malformed(text: string, why: string, subject?: string): IpParseResult {
  return {
    ok: false,
    findings: [
      finding(
        'ip-code-malformed',
        'error',
        `"${text}" is not a valid IP code: ${why} Write it like IP65, IPX7, IP6X or IP66/IP68.`,
        subject === undefined ? { values: { ipCode: text } } : { subject, values: { ipCode: text } },
      ),
    ],
  };
}

export function formatIpRating(r: IpRating): string {
  const s = r.solids === null ? 'X' : String(r.solids);
  const w = r.water === null ? 'X' : String(r.water);
  return `IP${s}${w}${r.water9K ? 'K' : ''}${r.access ?? ''}${r.supplementary.join('')}`;
}

function parsePart(raw: string, original: string, subject?: string): IpRating | IpParseResult {
  const part = raw.startsWith('IP') ? raw : `IP${raw}`;
  const m = PART.exec(part);
  if (!m) {
    if (!/^IP[0-9X][0-9X]/.test(part)) return malformed(original, 'it needs two numerals (or X) after "IP".', subject);
    if (/^IP[7-9]/.test(part)) return malformed(original, 'the first numeral (solids) runs from 0 to 6.', subject);
    return malformed(original, 'after the two numerals only one letter A-D and then H, M, S or W may follow.', subject);
  }
  const [, s, w, k, access, supp] = m;
  if (k === 'K' && w !== '9') return malformed(original, 'the K suffix is only defined for 9K (ISO 20653).', subject);
  const letters = (supp ?? '').split('') as SupplementaryLetter[];
  if (new Set(letters).size !== letters.length) {
    return malformed(original, 'a supplementary letter is repeated.', subject);
  }
  if (letters.includes('M') && letters.includes('S')) {
    return malformed(original, 'M (moving) and S (stationary) cannot both apply to one water test.', subject);
  }
  return {
    solids: s === 'X' ? null : (Number(s) as SolidsDigit),
    water: w === 'X' ? null : (Number(w) as WaterDigit),
    water9K: k === 'K',
    access: (access as AccessLetter | undefined) ?? null,
    supplementary: letters,
  };
}

/**
 * Parse an IP code. Accepts upper or lower case and surrounding spaces; dual codes are
 * separated by "/" and the second part may omit "IP" (IP66/68). Never throws.
 */
export function parseIpCode(text: unknown, subject?: string): IpParseResult {
  if (typeof text !== 'string' || text.trim() === '') {
    return malformed(String(text ?? ''), 'it is empty.', subject);
  }
  const cleaned = text.trim().toUpperCase().replace(/\s+/g, '');
  if (!cleaned.startsWith('IP')) return malformed(text, 'it must start with "IP".', subject);
  const parts = cleaned.split('/');
  const ratings: IpRating[] = [];
  for (const p of parts) {
    if (p === '') return malformed(text, 'one side of the "/" is empty.', subject);
    const r = parsePart(p, text, subject);
    if ('ok' in r) return r;
    ratings.push(r);
  }
  return { ok: true, code: { text: ratings.map(formatIpRating).join('/'), ratings } };
}

/** Parse or throw-free shortcut for fixed, known-good codes in tables: returns null when malformed. */
export function ipCodeOrNull(text: string): IpCode | null {
  const r = parseIpCode(text);
  return r.ok ? r.code : null;
}

/**
 * Whether a tested water numeral `have` covers a required numeral `need`.
 * - 0-6 are cumulative: a higher numeral covers every lower one (IEC 60529 clause 6).
 * - 7 and 8 (immersion) do not cover 5 or 6 (jets) unless dual-coded (IEC 60529 clause 6, from
 *   memory); they are taken to cover 0-4 [memory], and 8 (more severe immersion) covers 7.
 * - 9 (IEC 60529 Amd 2) does not cover 5-8 unless multiple-coded; taken to cover 0-4 [memory].
 *   ISO 20653 9K covers a 9 requirement; a 9K requirement needs 9K.
 */
export function waterNumeralCovers(have: WaterDigit, have9K: boolean, need: WaterDigit, need9K: boolean): boolean {
  if (need9K) return have === 9 && have9K;
  if (have <= 6) return need <= have;
  if (need <= 4) return true;
  if (have === 8) return need === 7 || need === 8;
  if (have === 7) return need === 7;
  return need === 9;
}

const ACCESS_ORDER: Record<AccessLetter, number> = { A: 1, B: 2, C: 3, D: 4 };

/** Access protection implied by the first numeral (1 → A, 2 → B, 3 → C, 4-6 → D), IEC 60529 Table 1 & 7. */
function accessLevel(r: IpRating): number {
  const fromDigit = r.solids === null ? 0 : Math.min(r.solids, 4);
  return Math.max(fromDigit, r.access ? ACCESS_ORDER[r.access] : 0);
}

function ratingSatisfies(code: IpCode, need: IpRating): boolean {
  if (need.solids !== null && need.solids > 0) {
    const best = Math.max(...code.ratings.map((r) => r.solids ?? -1));
    if (best < need.solids) return false;
  }
  if (need.water !== null && need.water > 0) {
    const needW = need.water;
    const ok = code.ratings.some((r) => r.water !== null && waterNumeralCovers(r.water, r.water9K, needW, need.water9K));
    if (!ok) return false;
  }
  if (need.access !== null) {
    const best = Math.max(...code.ratings.map(accessLevel));
    if (best < ACCESS_ORDER[need.access]) return false;
  }
  for (const letter of need.supplementary) {
    if (!code.ratings.some((r) => r.supplementary.includes(letter))) return false;
  }
  return true;
}

/**
 * Whether `code` meets `requirement`. Every part of a dual-coded requirement must be met;
 * a dual-coded product meets a water requirement when any of its parts does. X in a
 * requirement asks nothing; X in a product's code offers nothing.
 */
export function satisfies(code: IpCode | string, requirement: IpCode | string): boolean {
  const c = typeof code === 'string' ? ipCodeOrNull(code) : code;
  const r = typeof requirement === 'string' ? ipCodeOrNull(requirement) : requirement;
  if (c === null || r === null) return false;
  return r.ratings.every((need) => ratingSatisfies(c, need));
}
