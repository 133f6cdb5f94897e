import { SignInRequest } from '@gloaming/contracts';
import { User } from '@gloaming/db';
import { signInThrottles } from '../../auth/throttle';
import type { ModuleDeps } from '../../app-deps';
import { anySignedIn, moduleRouter, publicRoute, route, type RegisteredRoute } from '../../http/routes';
import { presentAuthUser, presentSessionUser } from './presenter';
import { authenticate, startSession } from './service';

export function sessionRouter(deps: ModuleDeps, registry: RegisteredRoute[]) {
  const { auth } = deps;
  return moduleRouter('/api/session', registry, [
    route({
      method: 'post',
      path: '/',
      summary: 'Sign in with e-mail and password',
      policy: publicRoute,
      before: signInThrottles(deps.config.signInThrottle, deps.rateLimits),
      schemas: { body: SignInRequest },
      handler: async ({ req, res, input, em }) => {
        const user = await authenticate(em, input.body.email, input.body.password);
        // A bookkeeping stamp, written without the row's version check: two sign-ins to one
        // account at the same moment (two tabs, two devices) must both succeed, and neither
        // should make someone's open edit of that person look stale.
        await em.nativeUpdate(User, { id: user.id }, { lastSignInAt: new Date() });
        const previous = auth.readSessionCookie(req.headers.cookie ?? '') ?? undefined;
        await startSession(auth, res, user, previous);
        res.status(200).json({ user: presentSessionUser(user) });
      },
    }),
    route({
      method: 'get',
      path: '/',
      summary: 'The signed-in user',
      policy: anySignedIn,
      handler: ({ res, auth: ctx }) => {
        res.json({ user: presentAuthUser(ctx.user) });
      },
    }),
    route({
      method: 'delete',
      path: '/',
      summary: 'Sign out',
      policy: publicRoute,
      handler: async ({ req, res }) => {
        const id = auth.readSessionCookie(req.headers.cookie ?? '');
        if (id) await auth.invalidateSession(id);
        res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
        res.status(204).end();
      },
    }),
  ]);
}
