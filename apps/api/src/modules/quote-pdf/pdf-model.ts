/**
 * The quote PDF's content as plain data: every string already formatted, images as bytes.
 * Built on the request thread from the database; rendered elsewhere (render-quote-pdf.tsx)
 * so the layout work can move to a worker thread without touching the ORM. Never carries
 * costs or margins: the homeowner's document has prices only.
 */
export interface PdfLine {
  description: string;
  note: string;
  quantity: string;
  unitPrice: string;
  lineTotal: string;
  vatRate: string;
  /** e.g. "less 10 %"; empty when no line discount. */
  discount: string;
  kind: 'standard' | 'optional' | 'alternative';
  /** Counted in the total: standard lines, chosen options and chosen alternatives. */
  included: boolean;
  /** The pick-one group's label for alternatives. */
  group: string;
}

export interface PdfSection {
  name: string;
  lines: PdfLine[];
  /** Included lines of this section, ex VAT, before any quote discount. */
  subtotal: string;
}

export interface PdfTotalRow {
  label: string;
  amount: string;
  strong?: boolean;
}

export interface PdfPhoto {
  caption: string;
  /** JPEG bytes (the stored thumbnail). */
  jpeg: Uint8Array;
  width: number;
  height: number;
}

export interface QuotePdfModel {
  firm: { name: string; addressLines: string[]; vatNumber: string; logo: { bytes: Uint8Array; format: 'png' | 'jpg' } | null };
  quote: { reference: string; title: string; revision: number; issuedOn: string; validUntil: string; preparedBy: string };
  customer: { name: string; email: string; phone: string };
  site: { label: string; addressLines: string[] } | null;
  introduction: string;
  sections: PdfSection[];
  totals: PdfTotalRow[];
  /** "Deposit on acceptance" and the balance; null when no deposit is asked. */
  deposit: { deposit: string; balance: string; note: string } | null;
  /** Counted options and alternatives explained under the table; empty when none. */
  choicesNote: string;
  terms: string;
  safetyNote: string;
  photos: PdfPhoto[];
  currency: string;
}

/** Printed on every quote: a design aid, never a substitute for the electrician. */
export const ELECTRICAL_SAFETY_NOTE =
  'Electrical safety: any mains work in this quotation (new outdoor circuits, RCD protection, isolation, testing and certification) ' +
  'follows the local wiring rules and is carried out and certified by a licensed electrician. Gloaming prices that work and reminds ' +
  'you of it; it does not design or approve it. The garden lighting itself runs at extra-low voltage from the drivers and supplies listed.';
