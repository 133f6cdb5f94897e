import type { Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import {
  IdParams,
  PortalApprovalRequest,
  PortalDeclineRequest,
  PortalPhotoParams,
  PortalQuestionRequest,
  PortalTokenParams,
  PortalTotalsRequest,
  QuoteReplyRequest,
  formatQuoteNumber,
} from '@gloaming/contracts';
import { Customer, Photo, QuoteMessage, User } from '@gloaming/db';
import type { ModuleDeps } from '../../app-deps';
import { notFound } from '../../http/problem';
import { allowRoles, moduleRouter, publicRoute, route, type RegisteredRoute } from '../../http/routes';
import { parsed, validate } from '../../http/validate';
import { buildQuotePdfModel } from '../quote-pdf/build-pdf-model';
import { sharedPdfRenderer } from '../quote-pdf/pdf-renderer';
import { quotePdfFileName } from '../quote-sending/quote-mail';
import { loadQuoteForFirm, revisionContent, revisionSettings } from '../quotes/service';
import { priceChoice } from './homeowner-choice';
import { markLinkFailure, portalLinkThrottle, resolvePortalAccess, type PortalAccess } from './portal-access';
import { presentApproval, presentMessage, presentPortalQuote } from './presenter';
import {
  approveQuote,
  askQuestion,
  declineQuote,
  quoteDecision,
  recordView,
  replyToHomeowner,
  type PortalContext,
} from './service';

const quoteStaff = allowRoles('owner', 'estimator');

/** The link (or the quote) first, then the body: an unknown link or another firm's quote is a 404 whatever the body holds. */
async function bodyAfterAccess<T extends z.ZodType>(req: Request, res: Response, schema: T): Promise<z.output<T>> {
  await new Promise<void>((resolve, reject) =>
    validate({ body: schema })(req, res, (err?: unknown) => (err ? reject(err) : resolve())),
  );
  return parsed<{ body: T }>(req).body as z.output<T>;
}

export function portalRouter(deps: ModuleDeps, registry: RegisteredRoute[]) {
  const throttle: RequestHandler[] = [portalLinkThrottle(deps.config.portalThrottle, deps.rateLimits('portal-link'))];

  /** Open the link; a link that does not work counts towards the IP's limit. */
  async function open(res: Response, em: PortalContext['em'], token: string): Promise<PortalContext> {
    try {
      const access: PortalAccess = await resolvePortalAccess(em, token);
      return { deps, em, access, rawToken: token };
    } catch (err) {
      markLinkFailure(res, err);
      throw err;
    }
  }
  const tokenPath = (token: string) => `/portal/${encodeURIComponent(token)}`;

  const homeowner = moduleRouter('/api/portal', registry, [
    route({
      method: 'get',
      path: '/:token',
      summary: "The homeowner's view of a sent quote (records a view)",
      policy: publicRoute,
      before: throttle,
      schemas: { params: PortalTokenParams },
      handler: async ({ res, em, input }) => {
        const ctx = await open(res, em, input.params.token);
        await recordView(ctx);
        res.json({ quote: await presentPortalQuote(em, ctx.access, tokenPath(input.params.token)) });
      },
    }),
    route({
      method: 'post',
      path: '/:token/totals',
      summary: 'Totals for a choice of options and alternatives, computed by the server',
      policy: publicRoute,
      before: throttle,
      schemas: { params: PortalTokenParams },
      handler: async ({ req, res, em, input }) => {
        const { access } = await open(res, em, input.params.token);
        const body = await bodyAfterAccess(req, res, PortalTotalsRequest);
        const priced = priceChoice(revisionContent(access.revision), revisionSettings(access.revision), body.selection);
        res.json({ selection: priced.selection, totals: priced.totals });
      },
    }),
    route({
      method: 'post',
      path: '/:token/questions',
      summary: 'Ask the firm a question about the quote',
      policy: publicRoute,
      before: throttle,
      schemas: { params: PortalTokenParams },
      handler: async ({ req, res, em, input }) => {
        const ctx = await open(res, em, input.params.token);
        const body = await bodyAfterAccess(req, res, PortalQuestionRequest);
        const message = await askQuestion(ctx, body.body);
        const customer = await em.findOneOrFail(Customer, ctx.access.quote.customer.id);
        res.status(201).json({ message: presentMessage(message, customer.name) });
      },
    }),
    route({
      method: 'post',
      path: '/:token/approval',
      summary: 'Approve the quote with the chosen options, a typed full name and the terms accepted',
      policy: publicRoute,
      before: throttle,
      schemas: { params: PortalTokenParams },
      handler: async ({ req, res, em, input }) => {
        const ctx = await open(res, em, input.params.token);
        const body = await bodyAfterAccess(req, res, PortalApprovalRequest);
        const approval = await approveQuote(ctx, body, { ipAddress: req.ip ?? '', userAgent: req.get('user-agent') ?? '' });
        res.status(201).json({ approval: presentApproval(approval, ctx.access.revision) });
      },
    }),
    route({
      method: 'post',
      path: '/:token/decline',
      summary: 'Decline the quote, with an optional reason',
      policy: publicRoute,
      before: throttle,
      schemas: { params: PortalTokenParams },
      handler: async ({ req, res, em, input }) => {
        const ctx = await open(res, em, input.params.token);
        const body = await bodyAfterAccess(req, res, PortalDeclineRequest);
        const event = await declineQuote(ctx, body.reason);
        const reason = event.data.reason;
        res.status(201).json({ declined: { at: event.at.toISOString(), reason: typeof reason === 'string' ? reason : null } });
      },
    }),
    route({
      method: 'get',
      path: '/:token/pdf',
      summary: 'The quotation PDF the homeowner was sent',
      policy: publicRoute,
      before: throttle,
      schemas: { params: PortalTokenParams },
      handler: async ({ res, em, input }) => {
        const { access } = await open(res, em, input.params.token);
        const pdf = await sharedPdfRenderer().render(await buildQuotePdfModel(em, deps.storage, access.quote, access.revision));
        const name = quotePdfFileName(formatQuoteNumber(access.quote.number), access.revision.number);
        res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
        res.type('application/pdf').send(pdf);
      },
    }),
    route({
      method: 'get',
      path: '/:token/logo',
      summary: "The firm's logo for the quote page",
      policy: publicRoute,
      before: throttle,
      schemas: { params: PortalTokenParams },
      handler: async ({ res, em, input }) => {
        const { access } = await open(res, em, input.params.token);
        const firm = access.organization;
        if (!firm.logoPath) throw notFound('A logo');
        const bytes = await deps.storage.get(firm.logoPath);
        res.setHeader('Cache-Control', 'private, max-age=300');
        res.type(firm.logoContentType ?? 'image/png').send(bytes);
      },
    }),
    route({
      method: 'get',
      path: '/:token/photos/:photoId',
      summary: 'A site photo the sent quote shows (JPEG thumbnail)',
      policy: publicRoute,
      before: throttle,
      schemas: { params: PortalPhotoParams },
      handler: async ({ res, em, input }) => {
        const { access } = await open(res, em, input.params.token);
        const shown = revisionSettings(access.revision).sentPhotos ?? [];
        if (!shown.some((p) => p.photoId === input.params.photoId)) throw notFound('That photo');
        const photo = await em.findOne(Photo, { id: input.params.photoId, quote: access.quote.id });
        if (!photo) throw notFound('That photo');
        const bytes = await deps.storage.get(photo.thumbnailKey);
        res.setHeader('Cache-Control', 'private, max-age=300');
        res.type('image/jpeg').send(bytes);
      },
    }),
  ]);

  const staff = moduleRouter('/api/quotes', registry, [
    route({
      method: 'get',
      path: '/:id/messages',
      summary: "The quote's conversation with the homeowner",
      policy: quoteStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        const customer = await em.findOneOrFail(Customer, quote.customer.id);
        const messages = await em.find(
          QuoteMessage,
          { quote: quote.id },
          { orderBy: { at: 'asc', id: 'asc' }, populate: ['author', 'revision'] },
        );
        res.json({
          messages: messages.map((m) => ({ ...presentMessage(m, customer.name), revisionNumber: m.revision?.number ?? null })),
        });
      },
    }),
    route({
      method: 'post',
      path: '/:id/messages',
      summary: 'Reply to the homeowner: the message is e-mailed with their portal link',
      policy: quoteStaff,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        const body = await bodyAfterAccess(req, res, QuoteReplyRequest);
        const author = await em.findOneOrFail(User, auth.user.id);
        const { message, sentTo } = await replyToHomeowner(deps, em, quote, author, body.body);
        const customer = await em.findOneOrFail(Customer, quote.customer.id);
        res.status(201).json({
          message: { ...presentMessage(message, customer.name), revisionNumber: message.revision?.number ?? null },
          sentTo,
        });
      },
    }),
    route({
      method: 'get',
      path: '/:id/decision',
      summary: "The homeowner's approval (frozen choice, totals, who, when, from where) or decline",
      policy: quoteStaff,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth }) => {
        const quote = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        res.json(await quoteDecision(em, quote));
      },
    }),
  ]);

  return [homeowner, staff];
}
