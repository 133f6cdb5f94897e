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

export type EndPolarity = '+' | '-';

export type ConductorEnd =
  | { kind: 'driver'; polarity: EndPolarity }
  | { kind: 'fitting'; fitting: number; polarity: EndPolarity }
  | { kind: 'link'; link: number; core: number; end: 'A' | 'B' };

const DRIVER = /^driver([+-])$/;
const FITTING = /^fitting:(\d{1,9})([+-])$/;
const LINK = /^link:(\d{1,9})\/core:(\d{1,9})\/end:([ab])$/;

/** Parse a conductor end; `null` when the text is not one of the three forms. */
export function parseConductorEnd(text: string): ConductorEnd | null {
  if (typeof text !== 'string') return null;
  const t = text.toLowerCase().replace(/[\u2212\u2013]/g, '-').replace(/\s+/g, '');
  let m = DRIVER.exec(t);
  if (m) return { kind: 'driver', polarity: m[1] as EndPolarity };
  m = FITTING.exec(t);
  if (m) {
    const fitting = Number(m[1]);
    return fitting >= 1 ? { kind: 'fitting', fitting, polarity: m[2] as EndPolarity } : null;
  }
  m = LINK.exec(t);
  if (m) {
    const link = Number(m[1]);
    const core = Number(m[2]);
    if (link < 1 || core < 1) return null;
    return { kind: 'link', link, core, end: m[3] === 'a' ? 'A' : 'B' };
  }
  return null;
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

/** Plain words for a conductor end, e.g. "fitting 3 −" or "link cable 2 core 1 (end A)". */
export function describeConductorEnd(end: ConductorEnd, fittingLabels?: readonly string[]): string {
  switch (end.kind) {
    case 'driver':
      return `driver lead ${sign(end.polarity)}`;
    case 'fitting': {
      const label = fittingLabels?.[end.fitting - 1];
      return `fitting ${end.fitting}${label ? ` (${label})` : ''} ${sign(end.polarity)}`;
    }
    case 'link':
      return `link cable ${end.link} core ${end.core} (end ${end.end})`;
  }
}

function sign(p: EndPolarity): string {
  return p === '+' ? '+' : '−';
}
