import express from 'express';
import {
  CreateQuoteRequest,
  IdParams,
  QuoteListQuery,
  RevisionParams,
  SaveRevisionRequest,
  type QuoteDetailResponse,
  type QuoteListResponse,
  type QuoteRevisionView,
  type SaveRevisionResponse,
} from '@gloaming/contracts';
import { containsIgnoringCase, Quote, User, readRevisionsWithCurrent, type EntityManager, type QuoteRow } from '@gloaming/db';
import type { ModuleDeps } from '../../app-deps';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { sendJsonText, withJsonText, type JsonText } from '../../http/json-text';
import { validatedBody } from '../../http/validate';
import { notFound } from '../../http/problem';
import { presentQuoteEvent, presentQuoteSummary, presentRevisionSummary, revisionViewJson } from './presenter';
import { createQuote, listQuoteEvents, loadQuoteForFirm, readQuoteForFirm, readRevisionOf, reviseQuote, saveRevisionContent } from './service';

/** Quotes carry prices: owners and estimators only, never installers. */
const quoteStaff = allowRoles('owner', 'estimator');

/**
 * A whole estimate of up to 10,000 lines is a few MB of JSON: the quotes routes read bodies up
 * to this size (the api's default is 1 MB). Mounted before the api's own JSON parser.
 */
export const QUOTE_BODY_LIMIT = '12mb';
export const quoteBodyParser = express.json({ limit: QUOTE_BODY_LIMIT });


/** A quote with its current revision (the estimate passed through as stored) and the list of revisions. */
async function detail(em: EntityManager, quote: QuoteRow): Promise<JsonText<QuoteDetailResponse>> {
  const revisions = await readRevisionsWithCurrent(em, quote.id);
  if (!revisions) throw notFound('That quote revision');
  return withJsonText<QuoteDetailResponse, 'revision'>(
    { quote: presentQuoteSummary(quote), revisions: revisions.summaries.map(presentRevisionSummary) },
    'revision',
    revisionViewJson(revisions.current),
  );
}

export function quotesRouter(_deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/quotes', registry, [
    route({
      method: 'get',
      path: '/',
      summary: "The firm's quotes, newest first: filter by status and estimator, search, pages",
      policy: quoteStaff,
      schemas: { query: QuoteListQuery },
      handler: async ({ res, em, input, auth }) => {
        const { status, estimatorId, q, page, pageSize } = input.query;
        const where: Record<string, unknown> = { organization: auth.organizationId };
        if (status) where.status = status;
        if (estimatorId) where.estimator = estimatorId;
        if (q) {
          const or: Record<string, unknown>[] = [
            containsIgnoringCase(em, 'title', q),
            { customer: containsIgnoringCase(em, 'name', q) },
            { site: containsIgnoringCase(em, 'address_lines', q) },
            { site: containsIgnoringCase(em, 'postcode', q) },
          ];
          const n = /^(?:q-?)?0*(\d{1,9})$/i.exec(q);
          if (n) or.push({ number: Number(n[1]) });
          where.$or = or;
        }
        const [quotes, total] = await em.findAndCount(Quote, where, {
          populate: ['customer', 'site', 'estimator', 'organization'],
          orderBy: { number: 'desc' },
          limit: pageSize,
          offset: (page - 1) * pageSize,
        });
        const estimators = await em.find(
          User,
          { organization: auth.organizationId, role: { $in: ['owner', 'estimator'] } },
          { orderBy: { name: 'asc' }, fields: ['id', 'name'] },
        );
        const body: QuoteListResponse = {
          quotes: quotes.map(presentQuoteSummary),
          total,
          page,
          pageSize,
          estimators: estimators.map((u) => ({ id: u.id, name: u.name })),
        };
        res.json(body);
      },
    }),
    route({
      method: 'post',
      path: '/',
      summary: 'Start a quote for a customer (and site): its first draft revision takes the firm’s settings',
      policy: quoteStaff,
      schemas: { body: CreateQuoteRequest },
      handler: async ({ res, em, input, auth }) => {
        const quote = await createQuote(em, auth.organizationId, auth.user.id, input.body);
        res.status(201);
        sendJsonText(res, await detail(em, await readQuoteForFirm(em, auth.organizationId, quote.id)));
      },
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'One quote with its current revision and the list of revisions',
      policy: quoteStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        sendJsonText(res, await detail(em, await readQuoteForFirm(em, auth.organizationId, input.params.id)));
      },
    }),
    route({
      method: 'post',
      path: '/:id/revisions',
      summary: 'Revise a sent quote: a new draft revision from the current one',
      policy: quoteStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        await reviseQuote(em, quote, { id: auth.user.id });
        res.status(201);
        sendJsonText(res, await detail(em, await readQuoteForFirm(em, auth.organizationId, quote.id)));
      },
    }),
    route({
      method: 'get',
      path: '/:id/revisions/:revisionNumber',
      summary: 'One revision of a quote, earlier ones included',
      policy: quoteStaff,
      schemas: { params: RevisionParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await readQuoteForFirm(em, auth.organizationId, input.params.id);
        const revision = await readRevisionOf(em, quote, input.params.revisionNumber, { content: true });
        sendJsonText(res, withJsonText<{ revision: QuoteRevisionView }, 'revision'>({}, 'revision', revisionViewJson(revision)));
      },
    }),
    route({
      method: 'put',
      path: '/:id/revisions/:revisionNumber',
      summary: 'Save the whole estimate of a draft revision (optimistic lock on version); totals recomputed',
      policy: quoteStaff,
      schemas: { params: RevisionParams },
      handler: async ({ req, res, em, input, auth }) => {
        // Scope first, so another firm's quote is a 404 whatever the body holds; then the body.
        const quote = await readQuoteForFirm(em, auth.organizationId, input.params.id);
        const revision = await readRevisionOf(em, quote, input.params.revisionNumber);
        const body = validatedBody(req, SaveRevisionRequest);
        const saved = await saveRevisionContent(em, quote, revision, body.version, body.content);
        const response: SaveRevisionResponse = {
          revision: {
            id: revision.id,
            number: revision.number,
            version: saved.version,
            totals: saved.totals,
            updatedAt: saved.updatedAt.toISOString(),
          },
          quote: presentQuoteSummary(saved.quote),
        };
        res.json(response);
      },
    }),
    route({
      method: 'get',
      path: '/:id/events',
      summary: 'The history of a quote, oldest first',
      policy: quoteStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        res.json({ events: (await listQuoteEvents(em, quote)).map(presentQuoteEvent) });
      },
    }),
  ]);
}
