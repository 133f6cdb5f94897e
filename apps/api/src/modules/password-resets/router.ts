import { PasswordResetComplete, PasswordResetRequest } from '@gloaming/contracts';
import { User, hashPassword } from '@gloaming/db';
import type { ModuleDeps } from '../../app-deps';
import { consumeToken, issueToken } from '../../auth/tokens';
import { emailRequestThrottle } from '../../auth/throttle';
import { moduleRouter, publicRoute, route, type RegisteredRoute } from '../../http/routes';
import { passwordResetMail } from '../../mail/templates';

export const RESET_TTL_MS = 3600_000;
const REQUESTED = 'If that e-mail belongs to an active account, a reset link is on its way. It expires in 1 hour.';

export function passwordResetRouter(deps: ModuleDeps, registry: RegisteredRoute[]) {
  const { mailer, config, auth, logger, orm } = deps;
  return moduleRouter('/api/password-resets', registry, [
    route({
      method: 'post',
      path: '/',
      summary: 'Ask for a password-reset e-mail',
      policy: publicRoute,
      before: [emailRequestThrottle(15 * 60_000, 10, deps.rateLimits('password-reset-request'))],
      schemas: { body: PasswordResetRequest },
      handler: async ({ res, input }) => {
        // Answer at once, the same way whether or not the account exists; the work happens
        // after, so the response time reveals nothing either.
        res.status(202).json({ ok: true, message: REQUESTED });
        const em = orm.em.fork();
        const user = await em.findOne(User, { email: input.body.email, active: true }, { populate: ['organization'] });
        if (!user || !user.passwordHash) return;
        const token = issueToken(em, user, 'password-reset', RESET_TTL_MS);
        // the token and its e-mail are written in one flush; the outbox delivers it
        await mailer.send(
          { to: user.email, ...passwordResetMail({ name: user.name, link: `${config.publicUrl}/reset-password?token=${token}` }) },
          { em, kind: 'password-reset', organizationId: user.organization.id },
        );
        await em.flush().catch((err: unknown) => logger.error('Password reset e-mail could not be queued', err));
      },
    }),
    route({
      method: 'post',
      path: '/complete',
      summary: 'Set a new password with a reset link',
      policy: publicRoute,
      before: [emailRequestThrottle(15 * 60_000, 30, deps.rateLimits('password-reset-complete'))],
      schemas: { body: PasswordResetComplete },
      handler: async ({ res, em, input }) => {
        const user = await consumeToken(em, input.body.token, 'password-reset');
        user.passwordHash = await hashPassword(input.body.password);
        await em.flush();
        // A new password ends every session the account had, everywhere.
        await auth.invalidateUserSessions(user.id);
        res.json({ ok: true, message: 'Your password is changed. Sign in with the new one.' });
      },
    }),
  ]);
}
