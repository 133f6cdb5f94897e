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
