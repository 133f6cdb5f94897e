import { AcceptInviteRequest, IdParams, InviteRequest, UpdateTeamMemberRequest } from '@gloaming/contracts';
import { User, hashPassword } from '@gloaming/db';
import type { ModuleDeps } from '../../app-deps';
import { consumeToken } from '../../auth/tokens';
import { emailRequestThrottle } from '../../auth/throttle';
import { allowRoles, moduleRouter, publicRoute, route, type RegisteredRoute } from '../../http/routes';
import { validatedBody } from '../../http/validate';
import { presentSessionUser } from '../session/presenter';
import { startSession } from '../session/service';
import { presentTeamMember } from './presenter';
import { findFirmUser, inviteUser, resendInvite, updateTeamMember } from './service';

const ownerOnly = allowRoles('owner');

export function teamRouters(deps: ModuleDeps, registry: RegisteredRoute[]) {
  const { mailer, config, auth } = deps;
  const users = moduleRouter('/api/users', registry, [
    route({
      method: 'get',
      path: '/',
      summary: "The firm's people",
      policy: ownerOnly,
      handler: async ({ res, em, auth: ctx }) => {
        const list = await em.find(User, { organization: ctx.organizationId }, { orderBy: { name: 'asc' } });
        res.json({ users: list.map(presentTeamMember) });
      },
    }),
    route({
      method: 'get',
      path: '/:id',
      summary: 'One person at the firm',
      policy: ownerOnly,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth: ctx }) => {
        res.json({ user: presentTeamMember(await findFirmUser(em, ctx.organizationId, input.params.id)) });
      },
    }),
    route({
      method: 'patch',
      path: '/:id',
      summary: "Change a person's role, or deactivate / reactivate them (their sessions end)",
      policy: ownerOnly,
      schemas: { params: IdParams },
      handler: async ({ req, res, em, input, auth: ctx }) => {
        // Scope first, so another firm's person is a 404 whatever the body holds; then the body.
        const user = await findFirmUser(em, ctx.organizationId, input.params.id);
        const body = validatedBody(req, UpdateTeamMemberRequest);
        const change = await updateTeamMember(em, auth, ctx.organizationId, ctx.user.id, user, body);
        // the acting owner's old session ended with the change: sign this browser in afresh
        if (change.rotateOwnSession) await startSession(auth, res, change.user);
        else if (change.user.id === ctx.user.id && !change.user.active)
          res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
        res.json({ user: presentTeamMember(change.user) });
      },
    }),
    route({
      method: 'post',
      path: '/:id/invite',
      summary: 'Send the invitation again',
      policy: ownerOnly,
      schemas: { params: IdParams },
      handler: async ({ res, em, input, auth: ctx }) => {
        const user = await findFirmUser(em, ctx.organizationId, input.params.id);
        await resendInvite(em, mailer, config.publicUrl, user, ctx.user.name);
        res.status(202).json({ ok: true, message: `Invitation sent again to ${user.email}.` });
      },
    }),
  ]);
  const invites = moduleRouter('/api/invites', registry, [
    route({
      method: 'post',
      path: '/',
      summary: 'Invite a person by e-mail with a role',
      policy: ownerOnly,
      schemas: { body: InviteRequest },
      handler: async ({ res, em, input, auth: ctx }) => {
        const user = await inviteUser(em, mailer, config.publicUrl, ctx.organizationId, ctx.user.id, ctx.user.name, input.body);
        res.status(201).json({ user: presentTeamMember(user) });
      },
    }),
    route({
      method: 'post',
      path: '/accept',
      summary: 'Accept an invitation by choosing a password',
      policy: publicRoute,
      before: [emailRequestThrottle(15 * 60_000, 30, deps.rateLimits('invite-accept'))],
      schemas: { body: AcceptInviteRequest },
      handler: async ({ req, res, em, input }) => {
        const user = await consumeToken(em, input.body.token, 'invite');
        user.passwordHash = await hashPassword(input.body.password);
        user.lastSignInAt = new Date();
        await em.flush();
        await startSession(auth, res, user, auth.readSessionCookie(req.headers.cookie ?? '') ?? undefined);
        res.json({ user: presentSessionUser(user) });
      },
    }),
  ]);
  return [users, invites];
}
