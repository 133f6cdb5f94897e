import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { RequestContext } from '@gloaming/db';
import type { AppDeps, Logger, ModuleDeps } from './app-deps';
import { createLucia } from './auth/lucia';
import { rateLimitStores } from './auth/rate-limit-store';
import { checkOrigin, loadSession } from './auth/middleware';
import { apiNotFound, errorHandler, sendProblem } from './http/problem';
import type { RegisteredRoute } from './http/routes';
import { staticApp } from './http/static-apps';
import { createOutbox, type Outbox } from './mail/outbox';
import { LocalFileStorage } from './storage/storage';
import { healthRouter } from './modules/health/router';
import { organizationRouter } from './modules/organization/router';
import { passwordResetRouter } from './modules/password-resets/router';
import { sessionRouter } from './modules/session/router';
import { teamRouters } from './modules/team/router';
import { customersRouter } from './modules/customers/router';
import { productImportsRouter } from './modules/catalogue/import-router';
import { productsRouter } from './modules/catalogue/router';
import { quoteBodyParser, quotesRouter } from './modules/quotes/router';
import { photosRouter } from './modules/photos/router';
import { quotePdfRouter } from './modules/quote-pdf/router';
import { quoteSendingRouter } from './modules/quote-sending/router';
import { circuitsRouter } from './modules/circuits/router';
import { jobsRouter } from './modules/jobs/router';
import { portalRouter } from './modules/portal/router';
import { figuresRouter } from './modules/figures/router';
import { firmSettingsRouter } from './modules/firm-settings/router';
import { activityRouters } from './modules/activity/router';
import { depositsRouters, PAYMENT_WEBHOOK_PATH, paymentWebhookBodyParser } from './modules/deposits/router';

export interface CreateAppOptions extends AppDeps {
  /** Built front ends to serve; omitted in api-only tests. */
  frontEnds?: { workbenchDir?: string; portalDir?: string };
}

export interface GloamingApp {
  app: Express;
  /** Every api route with its policy: the route-matrix test and the docs read this. */
  routes: RegisteredRoute[];
  /** The e-mail outbox: main.ts runs its delivery worker; tests wait on it with `idle()`. */
  outbox: Outbox;
  /**
   * Begin a graceful shutdown: from now on every new request is answered 503 (with
   * Connection: close) while requests already running finish. `main.ts` calls it on SIGTERM.
   */
  drain(): void;
}

const consoleLogger: Logger = {
  info: (msg) => console.log(msg),
  error: (msg, err) => console.error(msg, err),
};

/** Build the Express app. Never listens; `main.ts` does. */
export function createApp(options: CreateAppOptions): GloamingApp {
  const logger = options.logger ?? consoleLogger;
  const outbox = createOutbox({
    orm: options.orm,
    transport: options.mailer,
    logger,
    ...(options.outboxPolicy ? { policy: options.outboxPolicy } : {}),
  });
  const deps: ModuleDeps = {
    ...options,
    mailer: outbox,
    logger,
    storage: options.storage ?? new LocalFileStorage(options.config.dataDir),
    auth: createLucia(options.orm, options.config.secureCookies, options.config.sessions),
    rateLimits: rateLimitStores(options.orm, options.config.rateLimitStore),
  };
  const routes: RegisteredRoute[] = [];
  const app = express();

  app.disable('x-powered-by');
  // No ETag on what handlers send: api answers are `no-store` (hashing a 120 KB estimate on
  // every GET bought nothing); the front ends' files are served by express.static with its own.
  app.set('etag', false);
  app.set('trust proxy', options.config.trustProxy);
  let draining = false;
  app.use((_req, res, next) => {
    if (!draining) return next();
    res.setHeader('Connection', 'close');
    res.setHeader('Retry-After', '5');
    sendProblem(res, {
      type: '/problems/shutting-down',
      title: 'Shutting down',
      status: 503,
      detail: 'The server is restarting. Nothing was changed; please try again in a moment.',
    });
  });
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          styleSrc: ["'self'", "'unsafe-inline'"],
          fontSrc: ["'self'", 'data:'],
          scriptSrc: ["'self'"],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
          baseUri: ["'self'"],
          upgradeInsecureRequests: options.config.secureCookies ? [] : null,
        },
      },
      strictTransportSecurity: options.config.secureCookies,
    }),
  );
  // gzip for clients that ask (browsers do): the front ends' scripts and the api's JSON shrink
  // three to five times on the wire. Its filter leaves PDFs and images alone.
  app.use(compression());
  if (options.config.logRequests) {
    app.use((req, res, next) => {
      const t0 = Date.now();
      res.on('finish', () => logger.info(`${req.method} ${req.originalUrl} ${res.statusCode} ${Date.now() - t0}ms`));
      next();
    });
  }

  const api = express.Router();
  api.use('/api/quotes', quoteBodyParser); // whole estimates are larger than 1 MB
  api.use(PAYMENT_WEBHOOK_PATH, paymentWebhookBodyParser); // the signed bytes, read raw before the JSON parser
  api.use(express.json({ limit: '1mb' }));
  api.use(checkOrigin([new URL(options.config.publicUrl).host], [{ method: 'POST', path: PAYMENT_WEBHOOK_PATH }]));
  api.use((_req, res, next) => {
    const em = options.orm.em.fork();
    res.locals.em = em;
    RequestContext.create(em, next);
  });
  api.use(loadSession(deps.auth));
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use(healthRouter(deps, routes));
  api.use(sessionRouter(deps, routes));
  for (const r of teamRouters(deps, routes)) api.use(r);
  api.use(passwordResetRouter(deps, routes));
  api.use(organizationRouter(deps, routes));
  api.use(customersRouter(deps, routes));
  api.use(productsRouter(deps, routes));
  api.use(productImportsRouter(deps, routes));
  api.use(quotesRouter(deps, routes));
  api.use(photosRouter(deps, routes));
  api.use(quotePdfRouter(deps, routes));
  api.use(quoteSendingRouter(deps, routes));
  api.use(circuitsRouter(deps, routes));
  api.use(jobsRouter(deps, routes));
  for (const r of portalRouter(deps, routes)) api.use(r);
  api.use(figuresRouter(deps, routes));
  api.use(firmSettingsRouter(deps, routes));
  for (const r of activityRouters(deps, routes)) api.use(r);
  for (const r of depositsRouters(deps, routes)) api.use(r);
  api.use('/api', apiNotFound);
  app.use(api);

  if (options.frontEnds?.portalDir) app.use(staticApp('/portal', options.frontEnds.portalDir));
  if (options.frontEnds?.workbenchDir) app.use(staticApp('/', options.frontEnds.workbenchDir));

  app.use(errorHandler((msg, err) => logger.error(msg, err)));
  return {
    app,
    routes,
    outbox,
    drain: () => {
      draining = true;
    },
  };
}
