import { createHash } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  DEMO_FIRM,
  Organization,
  PortalToken,
  Quote,
  QuoteRevision,
  User,
  contentHash,
  migrate,
  newSecretToken,
  openDatabase,
  seedDemoIfEmpty,
} from '@gloaming/db';

export interface BulkFirm {
  dataDir: string;
  quoteCount: number;
  /** Raw portal tokens of sent quotes (only their SHA-256 is stored, as sending does). */
  portalTokens: string[];
  /** Draft quotes for grid saves: id, revision number, current version and content. */
  drafts: Array<{ quoteId: string; revisionNumber: number; version: number; content: Record<string, unknown> }>;
}

const DAY = 86_400_000;

/**
 * A data directory holding the demo firm grown to `total` quotes, for load runs: the demo
 * seed first, then copies of its quotes (each with its own number, customer and revision),
 * `sent` of them sent with a live portal link. Written straight to the database before the
 * server starts.
 */
export async function createBulkFirm(total: number, sent: number, drafts: number): Promise<BulkFirm> {
  const dataDir = mkdtempSync(join(tmpdir(), 'gloaming-load-'));
  const orm = await openDatabase({ file: join(dataDir, 'gloaming.sqlite') });
  try {
    await migrate(orm);
    await seedDemoIfEmpty(orm);
    const em = orm.em.fork();
    const firm = await em.findOneOrFail(Organization, { name: DEMO_FIRM.name });
    const estimators = await em.find(User, { organization: firm, role: 'estimator' });
    const templates = await em.find(
      QuoteRevision,
      { organization: firm, number: 1 },
      { populate: ['quote', 'quote.customer', 'quote.site'] },
    );
    if (!templates.length || !estimators.length) throw new Error('the demo seed has no quotes or estimators to copy');
    const existing = await em.find(Quote, { organization: firm }, { fields: ['number'] });
    let number = Math.max(0, ...existing.map((q) => q.number)) + 1;
    let count = existing.length;
    const portalTokens: string[] = [];
    const draftQuotes: Array<{ quote: Quote; revision: QuoteRevision }> = [];
    const now = Date.now();
    for (let i = 0; count < total; i++, number++, count++) {
      const t = templates[i % templates.length]!;
      const isSent = portalTokens.length < sent;
      const isDraft = !isSent && draftQuotes.length < drafts;
      const sentAt = isSent ? new Date(now - DAY) : null;
      const quote = em.create(Quote, {
        organization: firm,
        number,
        title: `${t.quote.title} (${number})`,
        customer: t.quote.customer,
        site: t.quote.site ?? null,
        estimator: estimators[i % estimators.length]!,
        status: isSent ? 'sent' : 'draft',
        valueMinor: t.quote.valueMinor,
        sentAt,
        validUntil: isSent ? new Date(now + 30 * DAY) : null,
      });
      const content = t.content;
      const revision = em.create(QuoteRevision, {
        organization: firm,
        quote,
        number: 1,
        state: isSent ? 'sent' : 'draft',
        content,
        settings: isSent ? { ...t.settings, sentPhotos: [] } : t.settings,
        totals: t.totals,
        contentHash: isSent ? contentHash(content) : null,
        sentAt,
      });
      if (isSent) {
        const token = newSecretToken();
        em.create(PortalToken, {
          organization: firm,
          revision,
          tokenHash: createHash('sha256').update(token).digest('hex'),
          sentTo: 'homeowner@example.test',
          expiresAt: new Date(now + 30 * DAY),
          revokedAt: null,
        });
        portalTokens.push(token);
      }
      if (isDraft) draftQuotes.push({ quote, revision });
      if (i % 250 === 249) await em.flush();
    }
    await em.flush();
    return {
      dataDir,
      quoteCount: await em.count(Quote, { organization: firm }),
      portalTokens,
      drafts: draftQuotes.map(({ quote, revision }) => ({
        quoteId: quote.id,
        revisionNumber: revision.number,
        version: revision.version,
        content: revision.content,
      })),
    };
  } finally {
    await orm.close(true);
  }
}
