/**
 * Driver and fitting ends grouped by electrical node, keyed by the node's root terminal.
 * Built in two passes so each node's list has exactly its own size: a schedule of thousands
 * of joints then costs one small array per joint.
 */
export class NodeEnds {
  private readonly lists: (number[] | undefined)[];
  private readonly roots: number[] = [];

  constructor(terminalCount: number) {
    this.lists = new Array<number[] | undefined>(terminalCount);
  }

  /** `nodeOf[e]` is element end e's node root, or -1 when the end is not landed. */
  static group(nodeOf: Int32Array, terminalCount: number): NodeEnds {
    const out = new NodeEnds(terminalCount);
    const degree = new Int32Array(terminalCount);
    for (let e = 0; e < nodeOf.length; e++) if (nodeOf[e]! >= 0) degree[nodeOf[e]!]!++;
    const fill = new Int32Array(terminalCount);
    for (let e = 0; e < nodeOf.length; e++) {
      const r = nodeOf[e]!;
      if (r < 0) continue;
      let list = out.lists[r];
      if (!list) {
        list = new Array<number>(degree[r]!);
        out.lists[r] = list;
        out.roots.push(r);
      }
      list[fill[r]!++] = e;
    }
    return out;
  }

  get(root: number): number[] | undefined {
    return this.lists[root];
  }

  set(root: number, ends: number[]): void {
    if (!this.lists[root]) this.roots.push(root);
    this.lists[root] = ends;
  }

  /** Nodes in the order their first end was met. */
  forEach(visit: (ends: number[], root: number) => void): void {
    for (const r of this.roots) visit(this.lists[r]!, r);
  }

  keys(): number[] {
    return [...this.roots];
  }
}
