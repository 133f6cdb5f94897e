import { estimateQuoteInput, formatQuoteNumber, type EstimateContent, type RevisionSettings } from '@gloaming/contracts';
import { Customer, Organization, Photo, Site, User, type EntityManager, type Quote, type QuoteRevision } from '@gloaming/db';
import {
  computeQuoteTotals,
  formatBasisPoints,
  formatMoney,
  formatQuantityMilli,
  isEngineInputError,
  type QuoteTotals,
} from '@gloaming/engine';
import { HttpError } from '../../http/problem';
import type { FileStorage } from '../../storage/storage';
import { THUMBNAIL_EDGE } from '../photos/image-intake';
import { revisionContent, revisionSettings } from '../quotes/service';
import {
  ELECTRICAL_SAFETY_NOTE,
  type PdfLine,
  type PdfPhoto,
  type PdfSection,
  type PdfTotalRow,
  type QuotePdfModel,
} from './pdf-model';

const DAY_MS = 24 * 3600_000;

function splitLines(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter(Boolean);
}

/** When the quote stops being valid: the quote's own date once sent, else that many days from `from`. */
export function validUntilFor(quote: Quote, revision: QuoteRevision, settings: RevisionSettings, from: Date): Date {
  if (revision.state !== 'draft' && quote.validUntil) return quote.validUntil;
  return new Date(from.getTime() + settings.quoteValidityDays * DAY_MS);
}

/**
 * The engine's totals for a document that goes to the homeowner. Content the engine refuses
 * (say, a line both optional and in a pick-one group) is a 422 naming the problem, not a crash.
 */
export function priceForCustomer(content: EstimateContent, settings: RevisionSettings): QuoteTotals {
  try {
    return computeQuoteTotals(estimateQuoteInput(content, settings));
  } catch (err) {
    if (isEngineInputError(err))
      throw new HttpError(
        422,
        'estimate-not-priceable',
        'The estimate cannot be priced',
        `${err.message} Fix it in the estimate first.`,
      );
    throw err;
  }
}

/**
 * The photos a revision shows: once sent, the ones frozen in its settings (in that order, with
 * those captions); a draft shows the quote's photos chosen for the quote, as they are now.
 */
async function photosShown(
  em: EntityManager,
  quote: Quote,
  settings: RevisionSettings,
): Promise<{ photo: Photo; caption: string }[]> {
  if (settings.sentPhotos) {
    const ids = settings.sentPhotos.map((f) => f.photoId);
    const found = new Map(
      (await em.find(Photo, { id: { $in: ids }, quote: quote.id, organization: quote.organization.id })).map((p) => [p.id, p]),
    );
    return settings.sentPhotos.flatMap((f) => {
      const photo = found.get(f.photoId);
      return photo ? [{ photo, caption: f.caption }] : [];
    });
  }
  const chosen = await em.find(Photo, { quote: quote.id, onQuote: true }, { orderBy: { position: 'asc', createdAt: 'asc' } });
  return chosen.map((photo) => ({ photo, caption: photo.caption }));
}

export interface PdfDates {
  /** The date printed as issued; defaults to when the revision was sent, else now. */
  issuedOn?: Date;
  /** Defaults to the quote's validity once sent, else the firm's validity days from issue. */
  validUntil?: Date;
}

/** Gather and format everything the PDF shows for one revision. */
export async function buildQuotePdfModel(
  em: EntityManager,
  storage: FileStorage,
  quote: Quote,
  revision: QuoteRevision,
  dates: PdfDates = {},
): Promise<QuotePdfModel> {
  const content = revisionContent(revision);
  const settings = revisionSettings(revision);
  const firm = await em.findOneOrFail(Organization, quote.organization.id);
  const customer = await em.findOneOrFail(Customer, quote.customer.id);
  const site = quote.site ? await em.findOne(Site, quote.site.id) : null;
  const estimator = await em.findOne(User, quote.estimator.id);
  const totals = priceForCustomer(content, settings);
  const { currency, locale } = settings;
  const money = (minor: number) => formatMoney(minor, currency, locale);
  const date = (d: Date) =>
    new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(d);
  const lineTotals = new Map(totals.lines.map((l) => [l.id, l]));

  const sections: PdfSection[] = content.sections
    .filter((s) => s.lines.length > 0)
    .map((s) => {
      let subtotal = 0;
      const lines: PdfLine[] = s.lines.map((l) => {
        const t = lineTotals.get(l.id)!;
        const amount = t.grossMinor - t.lineDiscountMinor;
        if (t.included) subtotal += amount;
        const discount =
          l.discount === null
            ? ''
            : l.discount.kind === 'percent'
              ? `less ${formatBasisPoints(l.discount.bp, locale)}`
              : `less ${money(l.discount.amountMinor)}`;
        return {
          description: l.description,
          note: l.note,
          quantity: `${formatQuantityMilli(l.quantityMilli)}${l.unit ? ` ${l.unit}` : ''}`,
          unitPrice: money(l.unitPriceMinor),
          lineTotal: money(amount),
          vatRate: formatBasisPoints(l.vatRateBp, locale),
          discount,
          kind: l.alternativeGroup ? 'alternative' : l.optional ? 'optional' : 'standard',
          included: t.included,
          group: l.alternativeGroup ?? '',
        };
      });
      return { name: s.name, lines, subtotal: money(subtotal) };
    });

  const rows: PdfTotalRow[] = [{ label: 'Subtotal', amount: money(totals.grossMinor - totals.lineDiscountMinor) }];
  if (totals.quoteDiscountMinor > 0) {
    const d = content.discount;
    const label = d?.kind === 'percent' ? `Discount (${formatBasisPoints(d.bp, locale)})` : 'Discount';
    rows.push({ label, amount: `− ${money(totals.quoteDiscountMinor)}` });
    rows.push({ label: 'Total before VAT', amount: money(totals.netMinor) });
  }
  for (const r of totals.vatByRate)
    rows.push({ label: `VAT at ${formatBasisPoints(r.rateBp, locale)} on ${money(r.netMinor)}`, amount: money(r.vatMinor) });
  rows.push({ label: 'Total including VAT', amount: money(totals.totalMinor), strong: true });

  const all = content.sections.flatMap((s) => s.lines);
  const hasOptional = all.some((l) => l.optional);
  const hasAlternative = all.some((l) => l.alternativeGroup);
  const choicesNote = [
    hasOptional ? 'Optional extras are priced for you to choose; only those marked “included” are in the total.' : '',
    hasAlternative
      ? 'Where there is a choice of one (marked “choose one”), the total includes the option marked “included”; the others show the price of each alternative.'
      : '',
  ]
    .filter(Boolean)
    .join(' ');

  const photos: PdfPhoto[] = [];
  for (const { photo: p, caption } of await photosShown(em, quote, settings)) {
    try {
      const jpeg = await storage.get(p.thumbnailKey);
      const scale = Math.min(1, THUMBNAIL_EDGE / Math.max(p.width, p.height));
      photos.push({ caption, jpeg, width: Math.round(p.width * scale), height: Math.round(p.height * scale) });
    } catch {
      // a missing file should not stop the quote going out; the photo is simply left off
    }
  }

  let logo: QuotePdfModel['firm']['logo'] = null;
  if (firm.logoPath) {
    try {
      const bytes = await storage.get(firm.logoPath);
      logo = { bytes, format: bytes[0] === 0x89 ? 'png' : 'jpg' };
    } catch {
      logo = null;
    }
  }

  const issued = dates.issuedOn ?? revision.sentAt ?? new Date();
  return {
    firm: { name: firm.name, addressLines: splitLines(firm.addressLines), vatNumber: firm.vatNumber ?? '', logo },
    quote: {
      reference: formatQuoteNumber(quote.number),
      title: quote.title,
      revision: revision.number,
      issuedOn: date(issued),
      validUntil: date(dates.validUntil ?? validUntilFor(quote, revision, settings, issued)),
      preparedBy: estimator?.name ?? '',
    },
    customer: { name: customer.name, email: customer.email ?? '', phone: customer.phone ?? '' },
    site: site
      ? { label: site.label, addressLines: [...splitLines(site.addressLines), ...(site.postcode ? [site.postcode] : [])] }
      : null,
    introduction: content.introduction,
    sections,
    totals: rows,
    deposit: totals.deposit
      ? {
          deposit: money(totals.deposit.depositMinor),
          balance: money(totals.deposit.balanceMinor),
          note: 'Payable when you accept this quotation.',
        }
      : null,
    choicesNote,
    terms: settings.termsText,
    safetyNote: ELECTRICAL_SAFETY_NOTE,
    photos,
    currency,
  };
}
