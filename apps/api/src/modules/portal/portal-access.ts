/**
 * Opening a quote from a homeowner's link. The raw token is hashed and looked up; only the
 * hash is stored. Exported for every module behind a portal link (the portal's own routes,
 * the deposit payment):
 *
 * - resolvePortalAccess(em, rawToken, now?)  { token, revision, quote, organization } or throws PortalAccessError
 * - PortalAccessError                          an HttpError whose body names the link state and the firm
 * - firmContact(em, quote)                     who to talk to at the firm
 *
 * Rules, in order: an unknown token is 404 and says nothing about any firm; a revoked one is
 * 410 with the firm's contact details; a revision the homeowner already approved or declined
 * stays open to them (to see their decision and pay the deposit) even after its validity;
 * otherwise a superseded revision is 410 pointing at the newer revision's live link when
 * there is one, and a revision past its validity is 410 (an `expired` event is recorded once,
 * the first time anyone notices).
 */
import type { RequestHandler, Response } from 'express';
import { rateLimit, type Store } from 'express-rate-limit';
import { storeOption } from '../../auth/throttle';
import { portalQuotePath, type PortalFirmContact, type PortalLinkState } from '@gloaming/contracts';
import {
  Organization,
  PortalToken,
  QuoteApproval,
  QuoteEvent,
  QuoteRevision,
  User,
  newSecretToken,
  type EntityManager,
  type Quote,
} from '@gloaming/db';
import { hashToken } from '../../auth/tokens';
import { HttpError, tooManyRequests } from '../../http/problem';
import { appendQuoteEvent } from '../quotes/service';

export interface PortalAccess {
  token: PortalToken;
  revision: QuoteRevision;
  quote: Quote;
  organization: Organization;
}

const LINK_PROBLEMS: Record<PortalLinkState, { status: number; slug: string; title: string; detail: string }> = {
  unknown: {
    status: 404,
    slug: 'portal-link-unknown',
    title: 'We could not find this quote',
    detail:
      'This link does not open a quote. Check that the whole link was copied from the e-mail, or ask the firm that sent it for a new one.',
  },
  revoked: {
    status: 410,
    slug: 'portal-link-revoked',
    title: 'This link has been withdrawn',
    detail: 'The firm withdrew this link. Contact them and they can send you a new one.',
  },
  expired: {
    status: 410,
    slug: 'portal-quote-expired',
    title: 'This quote has expired',
    detail: 'The quote is past the date it was valid until. Contact the firm for an up-to-date quote.',
  },
  superseded: {
    status: 410,
    slug: 'portal-quote-superseded',
    title: 'There is a newer version of this quote',
    detail: 'The firm has sent you an updated quote, which replaces this one.',
  },
};

/**
 * A link that does not open a quote. The body is RFC 9457 problem+json with extension members
 * (`linkState`, `firm`, `currentLink`): the error handler spreads `extra` into the body.
 */
export class PortalAccessError extends HttpError {
  constructor(
    readonly linkState: PortalLinkState,
    readonly firm?: PortalFirmContact,
    readonly currentLink?: string,
  ) {
    const p = LINK_PROBLEMS[linkState];
    const extensions: Record<string, unknown> = {
      linkState,
      ...(firm ? { firm } : {}),
      ...(currentLink ? { currentLink } : {}),
    };
    // `extra` is spread into the body as it is; these members are this problem type's own.
    super(p.status, p.slug, p.title, p.detail, extensions as HttpError['extra']);
  }
}

function splitLines(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter(Boolean);
}

/** The firm's name and address and the estimator who prepared the quote. */
export async function firmContact(em: EntityManager, quote: Quote): Promise<PortalFirmContact> {
  const firm = await em.findOneOrFail(Organization, quote.organization.id);
  const estimator = await em.findOne(User, quote.estimator.id);
  return {
    name: firm.name,
    addressLines: splitLines(firm.addressLines),
    contactName: estimator?.name ?? '',
    contactEmail: estimator?.email ?? '',
  };
}

/** Whether the homeowner approved or declined this revision (their decision keeps it open to them). */
async function decided(em: EntityManager, revision: QuoteRevision): Promise<boolean> {
  if ((await em.count(QuoteApproval, { revision: revision.id })) > 0) return true;
  return (await em.count(QuoteEvent, { revision: revision.id, type: 'declined' })) > 0;
}

/**
 * The newer revision's link for someone holding a superseded one. Only hashes are stored, so an
 * old link cannot be turned into an existing new one: when the newer sent revision has a live
 * link, a fresh link to it is issued to the same recipient with the same expiry. Nothing is
 * issued when the firm revoked the newer revision's links or they expired.
 */
async function currentLinkFor(em: EntityManager, old: PortalToken, quote: Quote, now: Date): Promise<string | undefined> {
  const current = await em.findOne(QuoteRevision, { quote: quote.id, state: 'sent' }, { orderBy: { number: 'desc' } });
  if (!current) return undefined;
  const live = await em.findOne(
    PortalToken,
    { revision: current.id, revokedAt: null, expiresAt: { $gt: now } },
    { orderBy: { expiresAt: 'desc' } },
  );
  if (!live) return undefined;
  const raw = newSecretToken();
  em.create(PortalToken, {
    organization: quote.organization,
    revision: current,
    tokenHash: hashToken(raw),
    sentTo: old.sentTo,
    expiresAt: live.expiresAt,
    revokedAt: null,
  });
  await em.flush();
  return portalQuotePath(raw);
}

/** Record `expired` for a revision once (lazily on access, or from the hourly sweep). */
export async function recordExpiryOnce(em: EntityManager, quote: Quote, revision: QuoteRevision): Promise<boolean> {
  if ((await em.count(QuoteEvent, { revision: revision.id, type: 'expired' })) > 0) return false;
  appendQuoteEvent(
    em,
    quote,
    'expired',
    null,
    { revisionNumber: revision.number, validUntil: quote.validUntil?.toISOString() ?? null },
    revision,
  );
  await em.flush();
  return true;
}

/** The link or the quote it opens is past its date. */
export function isPastValidity(token: PortalToken, quote: Quote, now: Date): boolean {
  const t = now.getTime();
  return token.expiresAt.getTime() <= t || (quote.validUntil ? quote.validUntil.getTime() <= t : false);
}

export async function resolvePortalAccess(em: EntityManager, rawToken: string, now: Date = new Date()): Promise<PortalAccess> {
  const token = rawToken ? await em.findOne(PortalToken, { tokenHash: hashToken(rawToken) }) : null;
  if (!token) throw new PortalAccessError('unknown');
  const revision = await em.findOneOrFail(QuoteRevision, token.revision.id, { populate: ['quote'] });
  const quote = revision.quote;
  await em.populate(quote, ['organization', 'customer', 'site', 'estimator']);
  const organization = quote.organization;
  if (token.revokedAt) throw new PortalAccessError('revoked', await firmContact(em, quote));
  if (revision.state === 'draft') throw new PortalAccessError('unknown'); // a link is only ever made for a sent revision
  if (await decided(em, revision)) return { token, revision, quote, organization };
  if (revision.state === 'superseded')
    throw new PortalAccessError('superseded', await firmContact(em, quote), await currentLinkFor(em, token, quote, now));
  if (isPastValidity(token, quote, now)) {
    if (quote.validUntil && quote.validUntil.getTime() <= now.getTime()) await recordExpiryOnce(em, quote, revision);
    throw new PortalAccessError('expired', await firmContact(em, quote));
  }
  return { token, revision, quote, organization };
}

/**
 * Counts failed openings (unknown, withdrawn or expired links) per client IP; working links are
 * not counted. Over the limit, every portal request from that IP answers 429 with a wait time.
 * Give it `deps.rateLimits('portal-link')` so every api process shares the count.
 * Handlers mark a failure with `markLinkFailure(res)`.
 */
export function portalLinkThrottle(s: { maxFailedPerIp: number; windowMs: number }, store?: Store): RequestHandler {
  return rateLimit({
    ...storeOption(store),
    windowMs: s.windowMs,
    limit: s.maxFailedPerIp,
    skipSuccessfulRequests: true,
    requestWasSuccessful: (_req, res) => res.locals.portalLinkFailed !== true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (req, _res, next) => {
      const reset = (req as typeof req & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const wait = Math.max(1, Math.ceil((reset ? reset.getTime() - Date.now() : s.windowMs) / 1000));
      const minutes = Math.ceil(wait / 60);
      next(
        tooManyRequests(
          `Too many links that do not work were opened from this network. Try again in ${minutes <= 1 ? 'a minute' : `${minutes} minutes`}, or contact the firm that sent your quote.`,
          wait,
        ),
      );
    },
  });
}

export function markLinkFailure(res: Response, err: unknown): void {
  if (err instanceof PortalAccessError && err.linkState !== 'superseded') res.locals.portalLinkFailed = true;
}
