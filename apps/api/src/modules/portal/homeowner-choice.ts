/**
 * The homeowner's choice of optional lines and pick-one alternatives, applied to a sent
 * revision's estimate. Whatever the client claims about prices or totals, only the choice
 * is taken from it: the lines, prices and totals always come from the stored revision.
 */
import type { EstimateContent, PortalSelection, PortalTotals, RevisionSettings } from '@gloaming/contracts';
import type { QuoteTotals } from '@gloaming/engine';
import { badRequest } from '../../http/problem';
import { priceForCustomer } from '../quote-pdf/build-pdf-model';

/** Every optional line and alternative of the estimate with its suggested (stored) choice. */
export function suggestedSelection(content: EstimateContent): PortalSelection {
  const out: PortalSelection = {};
  for (const s of content.sections) for (const l of s.lines) if (l.optional || l.alternativeGroup) out[l.id] = l.selected;
  return out;
}

/**
 * The estimate with the homeowner's choice applied, and the full choice it comes to. A line
 * left out keeps its suggestion; choosing an alternative un-chooses the rest of its group;
 * a group must end with exactly one chosen. Unknown ids and ids of fixed lines are a 400.
 */
export function applySelection(
  content: EstimateContent,
  requested: PortalSelection,
): { content: EstimateContent; selection: PortalSelection } {
  const lines = new Map(content.sections.flatMap((s) => s.lines.map((l) => [l.id, l] as const)));
  const errors: { path: string; message: string }[] = [];
  for (const id of Object.keys(requested)) {
    const line = lines.get(id);
    if (!line) errors.push({ path: `body.selection.${id}`, message: 'This quote has no such line.' });
    else if (!line.optional && !line.alternativeGroup)
      errors.push({
        path: `body.selection.${id}`,
        message: `“${line.description}” is part of the quote and cannot be left out.`,
      });
  }
  if (errors.length) throw badRequest(errors[0]!.message, errors);

  const chosen = new Map<string, boolean>();
  const pickedInGroup = new Map<string, string[]>();
  for (const line of lines.values()) {
    if (line.alternativeGroup && requested[line.id] === true)
      pickedInGroup.set(line.alternativeGroup, [...(pickedInGroup.get(line.alternativeGroup) ?? []), line.id]);
  }
  for (const [group, ids] of pickedInGroup)
    if (ids.length > 1)
      throw badRequest(`Choose one option for “${group}”, not ${ids.length}.`, [
        { path: `body.selection.${ids[1]}`, message: `Choose one option for “${group}”.` },
      ]);
  for (const line of lines.values()) {
    if (line.alternativeGroup) {
      const picked = pickedInGroup.get(line.alternativeGroup)?.[0];
      chosen.set(line.id, picked ? picked === line.id : (requested[line.id] ?? line.selected));
    } else if (line.optional) chosen.set(line.id, requested[line.id] ?? line.selected);
  }
  const groups = new Map<string, number>();
  for (const line of lines.values())
    if (line.alternativeGroup)
      groups.set(line.alternativeGroup, (groups.get(line.alternativeGroup) ?? 0) + (chosen.get(line.id) ? 1 : 0));
  for (const [group, count] of groups)
    if (count !== 1)
      throw badRequest(`Choose one option for “${group}”.`, [
        { path: 'body.selection', message: `Choose one option for “${group}”.` },
      ]);

  const applied: EstimateContent = {
    ...content,
    sections: content.sections.map((s) => ({
      ...s,
      lines: s.lines.map((l) => (chosen.has(l.id) ? { ...l, selected: chosen.get(l.id)! } : l)),
    })),
  };
  return { content: applied, selection: Object.fromEntries(chosen) };
}

/** The engine's totals without cost or margin: what a homeowner may see. */
export function homeownerTotals(totals: QuoteTotals): PortalTotals {
  return {
    grossMinor: totals.grossMinor,
    lineDiscountMinor: totals.lineDiscountMinor,
    quoteDiscountMinor: totals.quoteDiscountMinor,
    netMinor: totals.netMinor,
    vatByRate: totals.vatByRate.map((r) => ({ rateBp: r.rateBp, netMinor: r.netMinor, vatMinor: r.vatMinor })),
    vatMinor: totals.vatMinor,
    totalMinor: totals.totalMinor,
    deposit: totals.deposit ? { depositMinor: totals.deposit.depositMinor, balanceMinor: totals.deposit.balanceMinor } : null,
  };
}

/** Price the revision for a choice: the engine on the stored lines, the server's figures. */
export function priceChoice(content: EstimateContent, settings: RevisionSettings, requested: PortalSelection) {
  const applied = applySelection(content, requested);
  const engineTotals = priceForCustomer(applied.content, settings);
  return { ...applied, engineTotals, totals: homeownerTotals(engineTotals) };
}
