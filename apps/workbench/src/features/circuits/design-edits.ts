/**
 * Small pure edits of a circuit design, as the editor applies them: reorder, add and remove
 * fittings and links. Every edit returns a new design; the live check reruns on it.
 */
import type { CcCircuitDesign, CcFittingPlacement, Product } from '@gloaming/contracts';

/** Move the item at `from` by `by` places (clamped); the same list back when it cannot move. */
export function moveItem<T>(items: readonly T[], from: number, by: number): T[] {
  const to = Math.max(0, Math.min(items.length - 1, from + by));
  if (to === from || from < 0 || from >= items.length) return [...items];
  const next = [...items];
  const [item] = next.splice(from, 1);
  next.splice(to, 0, item!);
  return next;
}

/** The drive current a fitting product suggests: its lowest rated current (constant current), else 0.35 A. */
export function defaultDriveCurrentA(product: Product | undefined): number {
  if (product?.kind === 'fitting' && product.spec.driveMode === 'constant-current')
    return Math.min(...product.spec.ratings.map((r) => r.currentA));
  return 0.35;
}

function nextId(existing: readonly { id: string }[], prefix: string): string {
  const used = new Set(existing.map((x) => x.id));
  for (let n = existing.length + 1; ; n++) if (!used.has(`${prefix}${n}`)) return `${prefix}${n}`;
}

/** A new fitting at the end of the string, like the last one (or the given product). */
export function addFitting(design: CcCircuitDesign, product: Product | undefined): CcCircuitDesign {
  const last = design.fittings.at(-1);
  const fitting: CcFittingPlacement = {
    id: nextId(design.fittings, 'f'),
    productId: product?.id ?? last?.productId ?? '',
    label: '',
    location: last?.location ?? 'exposed-outdoor',
    driveCurrentA: last?.driveCurrentA ?? defaultDriveCurrentA(product),
  };
  return { ...design, fittings: [...design.fittings, fitting], assignment: null };
}

export function removeFitting(design: CcCircuitDesign, index: number): CcCircuitDesign {
  return { ...design, fittings: design.fittings.filter((_, i) => i !== index), assignment: null };
}

export function moveFitting(design: CcCircuitDesign, index: number, by: number): CcCircuitDesign {
  return { ...design, fittings: moveItem(design.fittings, index, by), assignment: null };
}

export function updateFitting(design: CcCircuitDesign, index: number, patch: Partial<CcFittingPlacement>): CcCircuitDesign {
  return { ...design, fittings: design.fittings.map((f, i) => (i === index ? { ...f, ...patch } : f)) };
}

/** As many links as the block plan needs (blocks − 1), new ones on the lead's cable. */
export function fitLinks(design: CcCircuitDesign, blockCount: number): CcCircuitDesign {
  const want = Math.max(0, blockCount - 1);
  if (design.links.length === want) return design;
  const links =
    design.links.length > want
      ? design.links.slice(0, want)
      : [
          ...design.links,
          ...Array.from({ length: want - design.links.length }, () => ({
            cableProductId: design.driverLead?.cableProductId ?? null,
            lengthM: 5,
            method: design.driverLead?.method ?? ('buried-trench' as const),
          })),
        ];
  return { ...design, links };
}

/**
 * Each fitting's connector block (1-based): from the design's own assignment when it has one,
 * else where the engine's plan put it; null for a fitting in no block (no plan yet).
 */
export function fittingBlocks(
  design: CcCircuitDesign,
  plan: readonly { fittings: readonly number[] }[] | null,
): (number | null)[] {
  if (design.assignment) {
    const blockOf = new Map<string, number>();
    design.assignment.forEach((ids, b) => ids.forEach((id) => blockOf.set(id, b + 1)));
    return design.fittings.map((f) => blockOf.get(f.id) ?? null);
  }
  const byPosition = new Map<number, number>();
  (plan ?? []).forEach((b, k) => b.fittings.forEach((position) => byPosition.set(position, k + 1)));
  return design.fittings.map((_, i) => byPosition.get(i + 1) ?? null);
}

/**
 * Put fitting `index` in block `block` (1-based), the others where they are now. A series
 * string runs through its blocks in order, so a fitting before it never sits in a later block
 * and one after it never in an earlier one; blocks left empty are dropped and the rest renumbered.
 * Fittings in no block yet follow the one before them.
 */
export function assignFittingToBlock(
  design: CcCircuitDesign,
  current: readonly (number | null)[],
  index: number,
  block: number,
): CcCircuitDesign {
  if (index < 0 || index >= design.fittings.length || !(block >= 1)) return design;
  const blocks: number[] = [];
  design.fittings.forEach((_, i) => blocks.push(current[i] ?? blocks[i - 1] ?? 1));
  blocks[index] = block;
  for (let i = index + 1; i < blocks.length; i++) blocks[i] = Math.max(blocks[i]!, block);
  for (let i = index - 1; i >= 0; i--) blocks[i] = Math.min(blocks[i]!, block);
  const numbers = [...new Set(blocks)].sort((a, b) => a - b);
  const assignment: string[][] = numbers.map(() => []);
  design.fittings.forEach((f, i) => assignment[numbers.indexOf(blocks[i]!)]!.push(f.id));
  return { ...design, assignment };
}

/** Let the engine fill the blocks in order again. */
export function letEngineAssign(design: CcCircuitDesign): CcCircuitDesign {
  return design.assignment === null ? design : { ...design, assignment: null };
}
