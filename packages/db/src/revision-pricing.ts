/**
 * The two mappings every revision is stored with, shared by the api (on create, save and
 * revise) and the demo seeder: the firm's pricing settings as a revision snapshots them, and
 * the engine's totals without the per-line amounts.
 */
import { DEFAULT_DESIGN_SETTINGS, DesignSettings, RevisionSettings, type RevisionTotals } from '@gloaming/contracts';
import type { QuoteTotals } from '@gloaming/engine';
import type { Organization } from './entities';

/** The firm's circuit-design settings; the defaults until the owner saves their own. */
export function designSettingsOf(firm: Pick<Organization, 'designSettings'>): DesignSettings {
  const parsed = DesignSettings.safeParse(firm.designSettings);
  return parsed.success ? parsed.data : DEFAULT_DESIGN_SETTINGS;
}

export function revisionSettingsOf(firm: Organization): RevisionSettings {
  return RevisionSettings.parse({
    currency: firm.currency,
    locale: firm.locale,
    vatRounding: firm.vatRounding,
    defaultVatRateBp: firm.vatRateBp,
    markupPercentBp: firm.markupPercentBp,
    depositPercentBp: firm.depositPercentBp,
    labourRateMinorPerHour: firm.labourRateMinorPerHour,
    quoteValidityDays: firm.quoteValidityDays,
    termsText: firm.termsText,
    design: designSettingsOf(firm),
  });
}

export function revisionTotalsOf(totals: QuoteTotals): RevisionTotals {
  return {
    grossMinor: totals.grossMinor,
    lineDiscountMinor: totals.lineDiscountMinor,
    quoteDiscountMinor: totals.quoteDiscountMinor,
    netMinor: totals.netMinor,
    vatByRate: totals.vatByRate.map((r) => ({ rateBp: r.rateBp, netMinor: r.netMinor, vatMinor: r.vatMinor })),
    vatMinor: totals.vatMinor,
    totalMinor: totals.totalMinor,
    costMinor: totals.costMinor,
    grossMarginMinor: totals.grossMarginMinor,
    grossMarginBp: totals.grossMarginBp,
    deposit: totals.deposit,
    findings: totals.findings.map((f) => ({ code: f.code, severity: f.severity, message: f.message })),
  };
}
