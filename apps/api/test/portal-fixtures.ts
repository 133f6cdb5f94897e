import { PortalToken, Quote, QuoteRevision, newSecretToken, type EntityManager } from '@gloaming/db';
import type { FirmFixture } from '@gloaming/db/testing';
import { hashToken } from '../src/auth/tokens';
import { markRevisionSent } from '../src/modules/quotes/service';
import { createGardenQuote } from './estimate-fixture';

/** A sent garden quote of the firm with one working portal link; returns the link's raw token. */
export async function createPortalLinkFixture(em: EntityManager, f: FirmFixture): Promise<string> {
  const g = await createGardenQuote(em, f);
  const quote = await em.findOneOrFail(Quote, g.quote.id, { populate: ['organization'] });
  const revision = await em.findOneOrFail(QuoteRevision, g.revision.id);
  await markRevisionSent(em, quote, revision, null);
  const raw = newSecretToken();
  em.create(PortalToken, {
    organization: quote.organization,
    revision,
    tokenHash: hashToken(raw),
    sentTo: 'matrix@home.example',
    expiresAt: quote.validUntil!,
    revokedAt: null,
  });
  await em.flush();
  return raw;
}
