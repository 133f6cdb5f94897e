import { QuoteRevisionParams, SendPreviewQuery, SendQuoteRequest } from '@gloaming/contracts';
import { User } from '@gloaming/db';
import type { ModuleDeps } from '../../app-deps';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { loadFirmRevision } from '../quote-access/revision-by-id';
import { composeQuoteMail, resendRevision, revokeRevisionLinks, sendAnswer, sendBlockers, sendingState, sendRevision } from './service';

const quoteStaff = allowRoles('owner', 'estimator');
const LINK_PLACEHOLDER = '(your personal link appears here)';

export function quoteSendingRouter(deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/quotes', registry, [
    route({
      method: 'get',
      path: '/:id/revisions/:revisionId/sending',
      summary: 'Whether a revision was sent, and its portal links',
      policy: quoteStaff,
      schemas: { params: QuoteRevisionParams },
      handler: async ({ res, em, input, auth }) => {
        const { quote, revision } = await loadFirmRevision(em, auth.organizationId, input.params.id, input.params.revisionId);
        res.json({ sending: await sendingState(em, quote, revision) });
      },
    }),
    route({
      method: 'get',
      path: '/:id/revisions/:revisionId/send-preview',
      summary: 'The e-mail a send would deliver, and what stops it',
      policy: quoteStaff,
      schemas: { params: QuoteRevisionParams, query: SendPreviewQuery },
      handler: async ({ res, em, input, auth }) => {
        const { quote, revision } = await loadFirmRevision(em, auth.organizationId, input.params.id, input.params.revisionId);
        const mail = await composeQuoteMail(em, quote, revision, {
          senderName: auth.user.name,
          link: LINK_PLACEHOLDER,
          issuedOn: revision.sentAt ?? new Date(),
          ...(input.query.message ? { message: input.query.message } : {}),
        });
        const blockers = revision.state === 'draft' ? await sendBlockers(em, quote, revision) : [];
        res.json({ to: mail.to, subject: mail.subject, text: mail.text, attachmentName: mail.attachmentName, blockers });
      },
    }),
    route({
      method: 'post',
      path: '/:id/revisions/:revisionId/send',
      summary: 'Send a draft revision: freeze it, e-mail the PDF and a portal link',
      policy: quoteStaff,
      schemas: { params: QuoteRevisionParams, body: SendQuoteRequest },
      handler: async ({ res, em, input, auth }) => {
        const { quote, revision } = await loadFirmRevision(em, auth.organizationId, input.params.id, input.params.revisionId);
        const actor = await em.findOneOrFail(User, auth.user.id);
        const sent = await sendRevision({ deps, em, quote, revision, actor }, input.body);
        res.status(201).json(await sendAnswer(deps, em, quote, revision, sent));
      },
    }),
    route({
      method: 'post',
      path: '/:id/revisions/:revisionId/resend',
      summary: 'E-mail a sent revision again with a new portal link',
      policy: quoteStaff,
      schemas: { params: QuoteRevisionParams, body: SendQuoteRequest },
      handler: async ({ res, em, input, auth }) => {
        const { quote, revision } = await loadFirmRevision(em, auth.organizationId, input.params.id, input.params.revisionId);
        const actor = await em.findOneOrFail(User, auth.user.id);
        const sent = await resendRevision({ deps, em, quote, revision, actor }, input.body);
        res.status(201).json(await sendAnswer(deps, em, quote, revision, sent));
      },
    }),
    route({
      method: 'post',
      path: '/:id/revisions/:revisionId/revoke',
      summary: 'Revoke every portal link of a revision',
      policy: quoteStaff,
      schemas: { params: QuoteRevisionParams },
      handler: async ({ res, em, input, auth }) => {
        const { quote, revision } = await loadFirmRevision(em, auth.organizationId, input.params.id, input.params.revisionId);
        const actor = await em.findOneOrFail(User, auth.user.id);
        const revoked = await revokeRevisionLinks(em, quote, revision, actor);
        res.json({ revoked, sending: await sendingState(em, quote, revision) });
      },
    }),
  ]);
}
