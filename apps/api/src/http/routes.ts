import { Router, type NextFunction, type Request, type RequestHandler, type Response } from 'express';
import type { Role } from '@gloaming/contracts';
import type { EntityManager } from '@gloaming/db';
import { requireAuth, type AuthContext } from '../auth/middleware';
import { parsed, validate, type Parsed, type RequestSchemas } from './validate';

/**
 * Who may call a route. Every route declares one; the route-matrix test walks the
 * registry (and the Express router itself) so a route without a policy fails CI.
 */
export type PublicPolicy = { kind: 'public' };
export type RolesPolicy = { kind: 'roles'; roles: readonly Role[] };
export type Policy = PublicPolicy | RolesPolicy;

export const publicRoute: PublicPolicy = { kind: 'public' };
export const allowRoles = (...roles: Role[]): RolesPolicy => ({ kind: 'roles', roles });
export const anySignedIn: RolesPolicy = allowRoles('owner', 'estimator', 'installer');

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteContext<S extends RequestSchemas> {
  req: Request;
  res: Response;
  input: Parsed<S>;
  /** This request's fork of the entity manager. */
  em: EntityManager;
}

export interface SignedInContext<S extends RequestSchemas> extends RouteContext<S> {
  auth: AuthContext;
}

interface BaseSpec<S extends RequestSchemas> {
  method: Method;
  /** Path relative to the module's mount point. Express 5 syntax. */
  path: string;
  schemas?: S;
  /** Rate limiters etc., run before authentication. */
  before?: RequestHandler[];
  /** A short description for the route table in the docs and tests. */
  summary: string;
}

export type RouteSpec<S extends RequestSchemas = RequestSchemas> =
  | (BaseSpec<S> & { policy: PublicPolicy; handler: (ctx: RouteContext<S>) => Promise<void> | void })
  | (BaseSpec<S> & { policy: RolesPolicy; handler: (ctx: SignedInContext<S>) => Promise<void> | void });

export interface RegisteredRoute {
  method: Method;
  path: string;
  policy: Policy;
  summary: string;
  /** Names of the path parameters, e.g. ['id']. */
  params: string[];
}

/** Build a module router from route specs, recording each in `registry` under `mount`. */
// Each spec is typed by its own schemas; the list mixes them, so the element type is erased here.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function moduleRouter(mount: string, registry: RegisteredRoute[], specs: RouteSpec<any>[]): Router {
  const router = Router();
  for (const spec of specs) {
    const chain: RequestHandler[] = [...(spec.before ?? [])];
    if (spec.policy.kind === 'roles') chain.push(requireAuth(spec.policy.roles));
    if (spec.schemas) chain.push(validate(spec.schemas));
    chain.push(async (req: Request, res: Response, next: NextFunction) => {
      const ctx = { req, res, input: parsed(req), em: res.locals.em as EntityManager, auth: res.locals.auth as AuthContext };
      await (spec.handler as (c: typeof ctx) => Promise<void> | void)(ctx);
      if (!res.headersSent) next();
    });
    router[spec.method](spec.path, ...chain);
    const full = `${mount}${spec.path === '/' ? '' : spec.path}`;
    registry.push({
      method: spec.method,
      path: full,
      policy: spec.policy,
      summary: spec.summary,
      params: [...full.matchAll(/:([A-Za-z_]+)/g)].map((m) => m[1]!),
    });
  }
  const mounted = Router();
  mounted.use(mount, router);
  return mounted;
}

/** Identity helper so each spec's handler is typed from its own schemas and policy. */
export function route<S extends RequestSchemas>(
  spec: BaseSpec<S> & { policy: RolesPolicy; handler: (ctx: SignedInContext<S>) => Promise<void> | void },
): RouteSpec<S>;
export function route<S extends RequestSchemas>(
  spec: BaseSpec<S> & { policy: PublicPolicy; handler: (ctx: RouteContext<S>) => Promise<void> | void },
): RouteSpec<S>;
export function route<S extends RequestSchemas>(spec: RouteSpec<S>): RouteSpec<S> {
  return spec;
}
