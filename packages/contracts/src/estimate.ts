import { z } from 'zod';
import { DesignSettings } from './design-settings';

/**
 * The estimate document stored in a quote revision: sections (areas of the garden) with
 * lines. Money is integer minor units, quantities are thousandths (12.5 m -> 12500), rates
 * are basis points (20 % -> 2000). The engine's `computeQuoteTotals` prices it: use
 * `estimateQuoteInput` to flatten it.
 */
const MAX_MINOR = 1_000_000_000_00; // £1bn in pence: far beyond any garden, far below 2^53
const Minor = z.number().int('Use whole pence.').min(0, 'Cannot be negative.').max(MAX_MINOR, 'That amount is too large.');
const BasisPoints = z.number().int().min(0, 'Cannot be negative.').max(10_000, 'Cannot be more than 100 %.');
const ShortText = (max: number) => z.string().max(max, `At most ${max} characters.`);

export const Discount = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('percent'), bp: BasisPoints }),
  z.object({ kind: z.literal('fixed'), amountMinor: Minor }),
]);
export type Discount = z.infer<typeof Discount>;

export const Deposit = Discount;
export type Deposit = Discount;

export const VAT_ROUNDINGS = ['line-down-0.1p', 'line-nearest-1p', 'line-nearest-0.5p', 'invoice-down-1p'] as const;
export const VatRounding = z.enum(VAT_ROUNDINGS);
export type VatRounding = z.infer<typeof VatRounding>;

/** How the unit price was set: from cost by markup, from cost by margin, or typed in. */
export const PRICING_MODES = ['markup', 'margin', 'fixed'] as const;
export const PricingMode = z.enum(PRICING_MODES);
export type PricingMode = z.infer<typeof PricingMode>;

export const EstimateLine = z.object({
  id: z.string().min(1).max(64),
  /** Catalogue product, or null for free text. */
  productId: z.string().max(64).nullable(),
  /** The supplier's code of that product as picked, shown in the grid (optional: older lines lack it). */
  productCode: z.string().max(80).optional(),
  description: ShortText(2000),
  quantityMilli: z.number().int().min(0, 'Cannot be negative.').max(1_000_000_000, 'That quantity is too large.'),
  unit: ShortText(16),
  unitCostMinor: Minor,
  pricingMode: PricingMode,
  /** Markup or margin in basis points when pricingMode is markup / margin. */
  pricingBp: z.number().int().min(0).max(1_000_000),
  unitPriceMinor: Minor,
  vatRateBp: BasisPoints,
  discount: Discount.nullable(),
  optional: z.boolean(),
  alternativeGroup: ShortText(64).nullable(),
  selected: z.boolean(),
  note: ShortText(2000),
  /** Set on lines derived from a circuit; such lines are read-only unless overridden. */
  circuitId: z.string().max(64).nullable(),
  /** A derived line the estimator changed by hand: kept and flagged on regeneration. */
  overridden: z.boolean(),
});
export type EstimateLine = z.infer<typeof EstimateLine>;

export const EstimateSection = z.object({
  id: z.string().min(1).max(64),
  name: ShortText(200),
  lines: z.array(EstimateLine).max(10_000),
});
export type EstimateSection = z.infer<typeof EstimateSection>;

export const EstimateContent = z
  .object({
    sections: z.array(EstimateSection).max(200),
    discount: Discount.nullable(),
    deposit: Deposit.nullable(),
    /** Shown on the quote above the terms. */
    introduction: ShortText(5000),
  })
  .superRefine((content, ctx) => {
    const seen = new Set<string>();
    content.sections.forEach((s, si) =>
      s.lines.forEach((l, li) => {
        if (seen.has(l.id)) ctx.addIssue({ code: 'custom', path: ['sections', si, 'lines', li, 'id'], message: 'Line ids must be unique.' });
        seen.add(l.id);
      }),
    );
    const total = content.sections.reduce((n, s) => n + s.lines.length, 0);
    if (total > 10_000) ctx.addIssue({ code: 'custom', path: ['sections'], message: 'A quote has at most 10,000 lines.' });
  });
export type EstimateContent = z.infer<typeof EstimateContent>;

/** The firm settings a revision was priced with, frozen when it is sent. */
export const RevisionSettings = z.object({
  currency: z.string().length(3),
  locale: z.string().max(35),
  vatRounding: VatRounding,
  defaultVatRateBp: BasisPoints,
  markupPercentBp: z.number().int().min(0).max(1_000_000),
  depositPercentBp: BasisPoints,
  labourRateMinorPerHour: Minor,
  quoteValidityDays: z.number().int().min(1).max(365),
  termsText: ShortText(20_000),
  /**
   * The firm's circuit-design settings when the revision was made (labour minutes, cable slack
   * and cut length, limits): derived lines use them. Absent on revisions made before firms
   * kept them; readers fall back to the defaults.
   */
  design: DesignSettings.optional(),
  /**
   * Set when the revision is sent: the photos it shows, in order, with the captions they had.
   * The PDF of a sent revision prints these (a photo a sent revision shows cannot be deleted).
   * Absent on drafts, which show the quote's photos as they are.
   */
  sentPhotos: z
    .array(z.object({ photoId: z.string().min(1).max(64), caption: z.string().max(300) }))
    .max(200)
    .optional(),
});
export type RevisionSettings = z.infer<typeof RevisionSettings>;

/** What the engine's computeQuoteTotals takes (structurally; contracts do not import the engine). */
export interface EstimateQuoteInput {
  lines: {
    id: string;
    quantityMilli: number;
    unitPriceMinor: number;
    unitCostMinor: number;
    vatRateBp: number;
    discount?: Discount;
    optional?: boolean;
    alternativeGroup?: string;
    selected?: boolean;
  }[];
  vatRounding: VatRounding;
  discount?: Discount;
  deposit?: Deposit;
}

/** Flatten an estimate for the engine. The one mapping, shared by the api and the clients. */
export function estimateQuoteInput(content: EstimateContent, settings: Pick<RevisionSettings, 'vatRounding'>): EstimateQuoteInput {
  const lines: EstimateQuoteInput['lines'] = [];
  for (const section of content.sections)
    for (const l of section.lines)
      lines.push({
        id: l.id,
        quantityMilli: l.quantityMilli,
        unitPriceMinor: l.unitPriceMinor,
        unitCostMinor: l.unitCostMinor,
        vatRateBp: l.vatRateBp,
        ...(l.discount ? { discount: l.discount } : {}),
        ...(l.optional ? { optional: true } : {}),
        ...(l.alternativeGroup ? { alternativeGroup: l.alternativeGroup } : {}),
        selected: l.selected,
      });
  return {
    lines,
    vatRounding: settings.vatRounding,
    ...(content.discount ? { discount: content.discount } : {}),
    ...(content.deposit ? { deposit: content.deposit } : {}),
  };
}
