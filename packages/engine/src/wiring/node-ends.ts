/**
 * Driver and fitting ends grouped by electrical node, keyed by the node's root terminal.
 * Flat: one list of every end, node after node, with each node's start and size by its
 * root, all in typed arrays. A schedule of thousands of joints then costs four number
 * arrays, not one small list per joint kept until the check returns.
 */
export class NodeEnds {
  private constructor(
    /** Roots in the order their first end was met; `rootCount` of them are used. */
    private readonly roots: Int32Array,
    private readonly rootCount: number,
    /** By root terminal: where its ends start in `ends`, and how many (0: no node there). */
    private readonly start: Int32Array,
    private readonly size: Int32Array,
    private readonly ends: Int32Array,
  ) {}

  /** `nodeOf[e]` is element end e's node root, or -1 when the end is not landed. */
  static group(nodeOf: Int32Array, terminalCount: number): NodeEnds {
    const size = new Int32Array(terminalCount);
    let total = 0;
    for (let e = 0; e < nodeOf.length; e++) {
      const r = nodeOf[e]!;
      if (r >= 0) {
        size[r]!++;
        total++;
      }
    }
    const start = new Int32Array(terminalCount);
    const fill = new Int32Array(terminalCount);
    const roots = new Int32Array(terminalCount);
    const ends = new Int32Array(total);
    let rootCount = 0;
    let next = 0;
    for (let e = 0; e < nodeOf.length; e++) {
      const r = nodeOf[e]!;
      if (r < 0) continue;
      if (fill[r] === 0) {
        roots[rootCount++] = r;
        start[r] = next;
        next += size[r]!;
      }
      ends[start[r]! + fill[r]!++] = e;
    }
    return new NodeEnds(roots, rootCount, start, size, ends);
  }

  /** Ends on the node at `root` (0 when no end is there). */
  count(root: number): number {
    return root >= 0 && root < this.size.length ? this.size[root]! : 0;
  }

  /** The i-th end (in element order) on the node at `root`. */
  end(root: number, i: number): number {
    return this.ends[this.start[root]! + i]!;
  }

  /** The node's ends as a new list (for messages and other rare paths). */
  list(root: number): number[] {
    const out = new Array<number>(this.count(root));
    for (let i = 0; i < out.length; i++) out[i] = this.end(root, i);
    return out;
  }

  /** The same nodes keeping only the ends `keep` accepts; nodes left empty drop out, order kept. */
  filtered(keep: (e: number) => boolean): NodeEnds {
    const n = this.size.length;
    const start = new Int32Array(n);
    const size = new Int32Array(n);
    const roots = new Int32Array(n);
    const ends = new Int32Array(this.ends.length);
    let rootCount = 0;
    let next = 0;
    for (let i = 0; i < this.rootCount; i++) {
      const r = this.roots[i]!;
      const from = next;
      for (let j = 0; j < this.size[r]!; j++) {
        const e = this.end(r, j);
        if (keep(e)) ends[next++] = e;
      }
      if (next > from) {
        roots[rootCount++] = r;
        start[r] = from;
        size[r] = next - from;
      }
    }
    return new NodeEnds(roots, rootCount, start, size, ends);
  }

  /** Node roots in the order their first end was met. */
  forEachRoot(visit: (root: number) => void): void {
    for (let i = 0; i < this.rootCount; i++) visit(this.roots[i]!);
  }

  keys(): number[] {
    return Array.from(this.roots.subarray(0, this.rootCount));
  }
}
