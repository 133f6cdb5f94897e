import { databaseStatus } from '@gloaming/db';
import type { HealthResponse } from '@gloaming/contracts';
import type { ModuleDeps } from '../../app-deps';
import { moduleRouter, publicRoute, route, type RegisteredRoute } from '../../http/routes';

const started = Date.now();

export function healthRouter(deps: ModuleDeps, registry: RegisteredRoute[]) {
  return moduleRouter('/api/health', registry, [
    route({
      method: 'get',
      path: '/',
      summary: 'Liveness, version and database status',
      policy: publicRoute,
      handler: async ({ res }) => {
        const db = await databaseStatus(deps.orm);
        const body: HealthResponse = {
          status: db.ok && db.pendingMigrations === 0 ? 'ok' : 'degraded',
          version: deps.config.version,
          uptimeSeconds: Math.round((Date.now() - started) / 1000),
          database: { status: db.ok ? 'ok' : 'down', pendingMigrations: db.pendingMigrations },
        };
        res.status(db.ok ? 200 : 503).json(body);
      },
    }),
  ]);
}
