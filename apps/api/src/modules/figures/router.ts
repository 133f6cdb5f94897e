import { FiguresQuery } from '@gloaming/contracts';
import type { ModuleDeps } from '../../app-deps';
import { allowRoles, moduleRouter, route, type RegisteredRoute } from '../../http/routes';
import { figuresFor } from './service';

export function figuresRouter(_deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/figures', registry, [
    route({
      method: 'get',
      path: '/',
      summary: 'Conversion figures for a period beside the one before it (owner only)',
      policy: allowRoles('owner'),
      schemas: { query: FiguresQuery },
      handler: async ({ res, em, input, auth }) => {
        const q = input.query;
        res.json(await figuresFor(em, auth.organizationId, q.period, new Date(), { ...(q.from ? { from: q.from } : {}), ...(q.to ? { to: q.to } : {}) }));
      },
    }),
  ]);
}
