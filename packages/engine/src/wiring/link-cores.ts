/**
 * Where each link-cable core's two ends land, for the wiring check. The common case (cores
 * 1 and 2 of links 1..maxLink, each end written once) sits in two flat number arrays, so a
 * schedule of thousands of links keeps no list per core; anything else (a third core, a link
 * number past the schedule's size, an end written twice) keeps its own lists, as before.
 */
const NONE = -1;
/** Slot moved to `others` (an end was written twice). */
const MOVED = -2;

export interface LinkCoreEnds {
  link: number;
  core: number;
  /** Terminals its A end lands on, in schedule order. */
  a: number[];
  /** Terminals its B end lands on. */
  b: number[];
}

export class LinkCores {
  private readonly endA: Int32Array;
  private readonly endB: Int32Array;
  private readonly others = new Map<number | string, LinkCoreEnds>();

  constructor(private readonly maxLink: number) {
    this.endA = new Int32Array(2 * maxLink).fill(NONE);
    this.endB = new Int32Array(2 * maxLink).fill(NONE);
  }

  private slot(link: number, core: number): number {
    return link >= 1 && link <= this.maxLink && (core === 1 || core === 2) ? 2 * (link - 1) + core - 1 : -1;
  }

  private record(link: number, core: number): LinkCoreEnds {
    const key = link < 1e6 && core < 1e6 ? link * 1e6 + core : `${link}/${core}`;
    let rec = this.others.get(key);
    if (!rec) this.others.set(key, (rec = { link, core, a: [], b: [] }));
    return rec;
  }

  /** Core `core` of link `link` has its A (or B) end on `terminal`. */
  add(link: number, core: number, endB: boolean, terminal: number): void {
    const s = this.slot(link, core);
    if (s >= 0) {
      const ends = endB ? this.endB : this.endA;
      if (ends[s] === NONE) {
        ends[s] = terminal;
        return;
      }
      if (ends[s] !== MOVED) {
        // A second landing of this end: the core keeps lists of its own from here on.
        const rec = this.record(link, core);
        if (this.endA[s] !== NONE) rec.a.push(this.endA[s]!);
        if (this.endB[s] !== NONE) rec.b.push(this.endB[s]!);
        this.endA[s] = MOVED;
        this.endB[s] = MOVED;
      }
    }
    const rec = this.record(link, core);
    (endB ? rec.b : rec.a).push(terminal);
  }

  /**
   * Every core, in link then core order. `joined(a, b)` takes a core with each end landed
   * exactly once (the common case, no lists made); `other(rec)` every other core.
   */
  forEach(joined: (a: number, b: number) => void, other: (rec: LinkCoreEnds) => void): void {
    const slots = 2 * this.maxLink;
    const core = (s: number): LinkCoreEnds | null => {
      const a = this.endA[s]!;
      const b = this.endB[s]!;
      if (a === MOVED || (a === NONE && b === NONE)) return null;
      return { link: (s >> 1) + 1, core: (s & 1) + 1, a: a === NONE ? [] : [a], b: b === NONE ? [] : [b] };
    };
    if (this.others.size === 0) {
      for (let s = 0; s < slots; s++) {
        const a = this.endA[s]!;
        const b = this.endB[s]!;
        if (a !== NONE && b !== NONE) joined(a, b);
        else if (a !== NONE || b !== NONE) other(core(s)!);
      }
      return;
    }
    const all = [...this.others.values()];
    for (let s = 0; s < slots; s++) {
      const rec = core(s);
      if (rec) all.push(rec);
    }
    for (const rec of all.sort((x, y) => x.link - y.link || x.core - y.core)) {
      if (rec.a.length === 1 && rec.b.length === 1) joined(rec.a[0]!, rec.b[0]!);
      else other(rec);
    }
  }
}
