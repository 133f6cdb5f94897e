/**
 * Spotting a line id used twice, in the same pass that reads the lines. A JavaScript Set of
 * the ids does this correctly, but on a long estimate it is most of the totals' time, and
 * the part that grows faster than the line count: its table is rebuilt as it grows and every
 * id lands at a random place in it. This register keeps one flat table of line numbers that
 * is reused from call to call and sized once per call, and hashes only the length and the
 * tail of each id (where generated ids differ), comparing whole ids when two meet.
 *
 * A set of ids built to collide (equal lengths and tails) would make the probing slow, so
 * the register counts its probes and, past a linear budget, starts again with a Set: the
 * answer is always exact, and the work never worse than linear plus the Set's.
 */

/** Characters hashed from the end of an id. */
const TAIL = 12;
/** Probes allowed per id on average before falling back to a Set. */
const PROBES_PER_ID = 4;

/** Two numbers a slot: the id's hash, then 1 + the line's index (0: empty). Reused by every call. */
let slots = new Int32Array(2 << 10);

export class LineIdRegister {
  private readonly ids: readonly { readonly id: string }[];
  private mask = 0;
  private probes = 0;
  private budget = 0;
  private fallback: Map<string, number> | null = null;

  /** Ready for `count` ids; `lines` is where the earlier ids are read back from. */
  constructor(lines: readonly { readonly id: string }[], count: number) {
    this.ids = lines;
    let size = 1 << 4;
    while (size < count * 2) size <<= 1;
    if (slots.length < 2 * size) slots = new Int32Array(2 * size);
    slots.fill(0, 0, 2 * size);
    this.mask = size - 1;
    this.budget = PROBES_PER_ID * count + 64;
  }

  /** Record line `index`'s id; the index of an earlier line with the same id, or -1. */
  add(id: string, index: number): number {
    if (this.fallback !== null) return this.addToMap(id, index);
    let h = id.length | 0;
    for (let c = id.length > TAIL ? id.length - TAIL : 0; c < id.length; c++) h = Math.imul(h ^ id.charCodeAt(c), 0x01000193);
    h ^= h >>> 15;
    let slot = h & this.mask;
    for (;;) {
      const at = slots[2 * slot + 1]!;
      if (at === 0) {
        slots[2 * slot] = h;
        slots[2 * slot + 1] = index + 1;
        return -1;
      }
      // the stored hash first: the earlier line (elsewhere in memory) is read only when it matches
      if (slots[2 * slot] === h && this.ids[at - 1]!.id === id) return at - 1;
      if (++this.probes > this.budget) return this.switchToMap(id, index);
      slot = (slot + 1) & this.mask;
    }
  }

  /** Too many collisions: carry on with a Map of every id seen so far. */
  private switchToMap(id: string, index: number): number {
    const map = new Map<string, number>();
    for (let i = 0; i < index; i++) map.set(this.ids[i]!.id, i);
    this.fallback = map;
    return this.addToMap(id, index);
  }

  private addToMap(id: string, index: number): number {
    const earlier = this.fallback!.get(id);
    if (earlier !== undefined) return earlier;
    this.fallback!.set(id, index);
    return -1;
  }
}
