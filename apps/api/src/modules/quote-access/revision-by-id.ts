import { QuoteRevision, type EntityManager } from '@gloaming/db';
import { notFound } from '../../http/problem';
import { loadQuoteForFirm } from '../quotes/service';

/**
 * A firm's quote and one of its revisions by id (the PDF and sending routes name revisions by
 * id, so a link or attachment can never point at a different revision after a renumbering).
 * Another firm's ids answer 404.
 */
export async function loadFirmRevision(em: EntityManager, organizationId: string, quoteId: string, revisionId: string) {
  const quote = await loadQuoteForFirm(em, organizationId, quoteId);
  const revision = await em.findOne(QuoteRevision, { id: revisionId, quote: quote.id, organization: organizationId });
  if (!revision) throw notFound('That quote revision');
  return { quote, revision };
}
