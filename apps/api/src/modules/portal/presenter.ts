/**
 * The homeowner's view of a sent revision: sell prices and the firm's words only. Costs,
 * markups, margins, product ids and circuit links never leave this file.
 */
import {
  formatQuoteNumber,
  type EstimateContent,
  type PortalApprovalSummary,
  type PortalMessage,
  type PortalQuoteState,
  type PortalQuoteView,
  type PortalSection,
  PortalTotals,
} from '@gloaming/contracts';
import {
  Customer,
  Photo,
  QuoteApproval,
  QuoteEvent,
  QuoteMessage,
  Site,
  type EntityManager,
  type QuoteRevision,
} from '@gloaming/db';
import { ELECTRICAL_SAFETY_NOTE } from '../quote-pdf/pdf-model';
import { THUMBNAIL_EDGE } from '../photos/image-intake';
import { priceForCustomer } from '../quote-pdf/build-pdf-model';
import { revisionContent, revisionSettings } from '../quotes/service';
import { firmContact, type PortalAccess } from './portal-access';
import { homeownerTotals, suggestedSelection } from './homeowner-choice';

function splitLines(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter(Boolean);
}

/**
 * The homeowner's figures of an approval: the frozen totals (cost and margin dropped). Stored
 * totals that do not read as totals are worked out again by the engine for the frozen choice.
 */
function approvalTotals(a: QuoteApproval, revision: QuoteRevision): PortalTotals {
  const stored = PortalTotals.safeParse(a.totals);
  if (stored.success) return stored.data;
  return homeownerTotals(priceForCustomer(withSelection(revisionContent(revision), a.selection), revisionSettings(revision)));
}

export function presentApproval(a: QuoteApproval, revision: QuoteRevision): PortalApprovalSummary {
  return {
    signedName: a.signedName,
    approvedAt: a.approvedAt.toISOString(),
    selection: a.selection,
    totals: approvalTotals(a, revision),
    totalMinor: a.totalMinor,
    depositMinor: a.depositMinor,
    currency: a.currency,
  };
}

export function presentMessage(m: QuoteMessage, customerName: string): PortalMessage {
  return {
    id: m.id,
    from: m.from,
    authorName: m.from === 'homeowner' ? customerName : (m.author?.name ?? ''),
    body: m.body,
    at: m.at.toISOString(),
  };
}

function withSelection(content: EstimateContent, selection: Record<string, boolean>): EstimateContent {
  return {
    ...content,
    sections: content.sections.map((s) => ({
      ...s,
      lines: s.lines.map((l) => (l.id in selection ? { ...l, selected: selection[l.id]! } : l)),
    })),
  };
}

export async function presentPortalQuote(em: EntityManager, access: PortalAccess, tokenPath: string): Promise<PortalQuoteView> {
  const { quote, revision, organization: firm } = access;
  const settings = revisionSettings(revision);
  const sent = revisionContent(revision);
  const approval = await em.findOne(QuoteApproval, { revision: revision.id });
  const declinedEvent = approval
    ? null
    : await em.findOne(QuoteEvent, { revision: revision.id, type: 'declined' }, { orderBy: { at: 'desc' } });
  const selection = approval ? approval.selection : suggestedSelection(sent);
  const content = withSelection(sent, selection);
  const engineTotals = priceForCustomer(content, settings);
  const lineTotals = new Map(engineTotals.lines.map((l) => [l.id, l]));

  const sections: PortalSection[] = content.sections
    .filter((s) => s.lines.length > 0)
    .map((s) => ({
      id: s.id,
      name: s.name,
      lines: s.lines.map((l) => {
        const t = lineTotals.get(l.id)!;
        return {
          id: l.id,
          description: l.description,
          note: l.note,
          quantityMilli: l.quantityMilli,
          unit: l.unit,
          unitPriceMinor: l.unitPriceMinor,
          vatRateBp: l.vatRateBp,
          discount: l.discount,
          amountMinor: t.grossMinor - t.lineDiscountMinor,
          kind: l.alternativeGroup ? 'alternative' : l.optional ? 'optional' : 'standard',
          group: l.alternativeGroup,
          selected: l.optional || l.alternativeGroup ? l.selected : true,
        };
      }),
    }));

  const shown = settings.sentPhotos ?? [];
  const photos = new Map(
    (await em.find(Photo, { id: { $in: shown.map((p) => p.photoId) }, quote: quote.id })).map((p) => [p.id, p] as const),
  );
  const customer = await em.findOneOrFail(Customer, quote.customer.id);
  const site = quote.site ? await em.findOne(Site, quote.site.id) : null;
  const messages = await em.find(QuoteMessage, { quote: quote.id }, { orderBy: { at: 'asc', id: 'asc' }, populate: ['author'] });
  const contact = await firmContact(em, quote);

  let state: PortalQuoteState = 'open';
  if (approval) state = 'approved';
  else if (declinedEvent) state = 'declined';
  const reason = declinedEvent?.data.reason;

  return {
    reference: formatQuoteNumber(quote.number),
    title: quote.title,
    revisionNumber: revision.number,
    state,
    issuedOn: (revision.sentAt ?? revision.createdAt).toISOString(),
    validUntil: (quote.validUntil ?? access.token.expiresAt).toISOString(),
    currency: settings.currency,
    locale: settings.locale,
    vatRounding: settings.vatRounding,
    firm: { ...contact, vatNumber: firm.vatNumber ?? '', hasLogo: Boolean(firm.logoPath) },
    customer: { name: customer.name },
    site: site
      ? { label: site.label, addressLines: [...splitLines(site.addressLines), ...(site.postcode ? [site.postcode] : [])] }
      : null,
    introduction: content.introduction,
    sections,
    photos: shown.flatMap((f) => {
      const p = photos.get(f.photoId);
      if (!p) return [];
      const scale = Math.min(1, THUMBNAIL_EDGE / Math.max(p.width, p.height));
      return [
        {
          id: p.id,
          caption: f.caption,
          url: `/api${tokenPath}/photos/${p.id}`,
          width: Math.round(p.width * scale),
          height: Math.round(p.height * scale),
        },
      ];
    }),
    discount: content.discount,
    deposit: content.deposit,
    selection,
    totals: approval ? approvalTotals(approval, revision) : homeownerTotals(engineTotals),
    terms: settings.termsText,
    safetyNote: ELECTRICAL_SAFETY_NOTE,
    pdfUrl: `/api${tokenPath}/pdf`,
    approval: approval ? presentApproval(approval, revision) : null,
    declined: declinedEvent
      ? { at: declinedEvent.at.toISOString(), reason: typeof reason === 'string' && reason ? reason : null }
      : null,
    messages: messages.map((m) => presentMessage(m, customer.name)),
  };
}
