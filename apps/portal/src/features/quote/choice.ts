/**
 * The homeowner's choice in the browser: the same rules as the server (choosing one
 * alternative un-chooses the rest of its group) and the engine's money functions for instant
 * totals. The server prices every choice again; its figures replace these when they arrive.
 */
import type { PortalQuoteView, PortalSelection, PortalTotals } from '@gloaming/contracts';
import { computeQuoteTotals, type QuoteLineInput } from '@gloaming/engine';

export function choose(view: PortalQuoteView, selection: PortalSelection, lineId: string, chosen: boolean): PortalSelection {
  const lines = view.sections.flatMap((s) => s.lines);
  const line = lines.find((l) => l.id === lineId);
  if (!line || line.kind === 'standard') return selection;
  if (line.kind === 'optional') return { ...selection, [lineId]: chosen };
  const next: PortalSelection = { ...selection };
  for (const other of lines) if (other.kind === 'alternative' && other.group === line.group) next[other.id] = other.id === lineId;
  return next;
}

export function localTotals(view: PortalQuoteView, selection: PortalSelection): PortalTotals {
  const lines: QuoteLineInput[] = view.sections.flatMap((s) =>
    s.lines.map((l) => ({
      id: l.id,
      quantityMilli: l.quantityMilli,
      unitPriceMinor: l.unitPriceMinor,
      vatRateBp: l.vatRateBp,
      ...(l.discount ? { discount: l.discount } : {}),
      ...(l.kind === 'optional' ? { optional: true } : {}),
      ...(l.kind === 'alternative' && l.group ? { alternativeGroup: l.group } : {}),
      selected: l.kind === 'standard' ? true : (selection[l.id] ?? l.selected),
    })),
  );
  const t = computeQuoteTotals({
    lines,
    vatRounding: view.vatRounding,
    ...(view.discount ? { discount: view.discount } : {}),
    ...(view.deposit ? { deposit: view.deposit } : {}),
  });
  return {
    grossMinor: t.grossMinor,
    lineDiscountMinor: t.lineDiscountMinor,
    quoteDiscountMinor: t.quoteDiscountMinor,
    netMinor: t.netMinor,
    vatByRate: t.vatByRate.map((r) => ({ rateBp: r.rateBp, netMinor: r.netMinor, vatMinor: r.vatMinor })),
    vatMinor: t.vatMinor,
    totalMinor: t.totalMinor,
    deposit: t.deposit,
  };
}

export const sameSelection = (a: PortalSelection, b: PortalSelection): boolean =>
  Object.keys(a).length === Object.keys(b).length && Object.entries(a).every(([k, v]) => b[k] === v);
