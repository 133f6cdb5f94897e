import { QuoteRevisionParams, formatQuoteNumber } from '@gloaming/contracts';
import type { ModuleDeps } from '../../app-deps';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { loadFirmRevision } from '../quote-access/revision-by-id';
import { quotePdfFileName } from '../quote-sending/quote-mail';
import { buildQuotePdfModel } from './build-pdf-model';
import { sharedPdfRenderer } from './pdf-renderer';

const quoteStaff = allowRoles('owner', 'estimator');

export function quotePdfRouter(deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/quotes', registry, [
    route({
      method: 'get',
      path: '/:id/revisions/:revisionId/pdf',
      summary: 'The quotation PDF of a revision, as the homeowner receives it',
      policy: quoteStaff,
      schemas: { params: QuoteRevisionParams },
      handler: async ({ res, em, input, auth }) => {
        const { quote, revision } = await loadFirmRevision(em, auth.organizationId, input.params.id, input.params.revisionId);
        const pdf = await sharedPdfRenderer().render(await buildQuotePdfModel(em, deps.storage, quote, revision));
        const name = quotePdfFileName(formatQuoteNumber(quote.number), revision.number);
        res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
        res.type('application/pdf').send(pdf);
      },
    }),
  ]);
}
