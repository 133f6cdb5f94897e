import { ActivityQuery, IdParams } from '@gloaming/contracts';
import type { ModuleDeps } from '../../app-deps';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { loadQuoteForFirm } from '../quotes/service';
import { activityLog } from './service';

const ownerOnly = allowRoles('owner');

export function activityRouters(_deps: ModuleDeps, registry: RegisteredRoute[]) {
  const firm = moduleRouter('/api/activity', registry, [
    route({
      method: 'get',
      path: '/',
      summary: "The firm's activity log: quotes, settings and team, newest first",
      policy: ownerOnly,
      schemas: { query: ActivityQuery },
      handler: async ({ res, em, input, auth }) => {
        const { before, beforeId, limit, actorId, kind } = input.query;
        res.json(
          await activityLog(em, auth.organizationId, {
            limit,
            ...(before ? { before: new Date(before), ...(beforeId ? { beforeId } : {}) } : {}),
            ...(actorId ? { actorId } : {}),
            ...(kind ? { kind } : {}),
          }),
        );
      },
    }),
  ]);
  const quote = moduleRouter('/api/quotes', registry, [
    route({
      method: 'get',
      path: '/:id/activity',
      summary: "One quote's activity log, newest first",
      policy: ownerOnly,
      schemas: { params: IdParams, query: ActivityQuery },
      handler: async ({ res, em, input, auth }) => {
        const q = await loadQuoteForFirm(em, auth.organizationId, input.params.id);
        const { before, beforeId, limit } = input.query;
        res.json(
          await activityLog(em, auth.organizationId, {
            limit,
            quoteId: q.id,
            ...(before ? { before: new Date(before), ...(beforeId ? { beforeId } : {}) } : {}),
          }),
        );
      },
    }),
  ]);
  return [firm, quote];
}
