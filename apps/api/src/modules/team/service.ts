import { ROLE_LABELS, type InviteRequest, type Role, type UpdateTeamMemberRequest } from '@gloaming/contracts';
import { Organization, User, type EntityManager } from '@gloaming/db';
import type { Auth } from '../../auth/lucia';
import { issueToken } from '../../auth/tokens';
import { conflict, notFound } from '../../http/problem';
import type { Outbox } from '../../mail/outbox';
import { inviteMail } from '../../mail/templates';
import { recordFirmEvent } from '../activity/service';

export const INVITE_TTL_MS = 7 * 24 * 3600_000;

export async function findFirmUser(em: EntityManager, organizationId: string, id: string): Promise<User> {
  const user = await em.findOne(User, { id, organization: organizationId }, { populate: ['organization'] });
  if (!user) throw notFound('That person');
  return user;
}

async function sendInvite(em: EntityManager, mailer: Outbox, publicUrl: string, user: User, inviterName: string) {
  const token = issueToken(em, user, 'invite', INVITE_TTL_MS);
  const link = `${publicUrl}/accept-invite?token=${token}`;
  // the person, the token and the invitation e-mail are written in one flush
  await mailer.send(
    {
      to: user.email,
      ...inviteMail({ name: user.name, firmName: user.organization.name, inviterName, link, role: ROLE_LABELS[user.role].toLowerCase() }),
    },
    { em, kind: 'invite', organizationId: user.organization.id },
  );
  await em.flush();
}

export async function inviteUser(
  em: EntityManager,
  mailer: Outbox,
  publicUrl: string,
  organizationId: string,
  inviterId: string,
  inviterName: string,
  input: InviteRequest,
): Promise<User> {
  if (await em.count(User, { email: input.email })) throw conflict('Someone with that e-mail address already has a Gloaming account.');
  const firm = await em.findOneOrFail(Organization, organizationId);
  const user = em.create(User, { organization: firm, email: input.email, name: input.name, role: input.role });
  recordFirmEvent(em, organizationId, 'member-invited', inviterId, user.id, { role: ROLE_LABELS[input.role].toLowerCase() });
  await sendInvite(em, mailer, publicUrl, user, inviterName);
  return user;
}

export async function resendInvite(em: EntityManager, mailer: Outbox, publicUrl: string, user: User, inviterName: string) {
  if (user.passwordHash) throw conflict(`${user.name} has already accepted the invitation.`);
  if (!user.active) throw conflict(`${user.name} is deactivated; reactivate them first.`);
  await sendInvite(em, mailer, publicUrl, user, inviterName);
}

/** Owners who can sign in (active, password set), other than `exceptId`. */
async function otherActiveOwners(em: EntityManager, organizationId: string, exceptId: string): Promise<number> {
  return em.count(User, { organization: organizationId, role: 'owner', active: true, passwordHash: { $ne: null }, id: { $ne: exceptId } });
}

export interface MemberChange {
  user: User;
  /** The acting owner changed their own role: their browser needs a fresh session. */
  rotateOwnSession: boolean;
}

/**
 * Change a person's role and/or deactivate or reactivate them. The firm always keeps one owner
 * who can sign in: demoting or deactivating the last one is a 409. A deactivated person's
 * sessions end at once; a role change ends the person's sessions too (their next sign-in
 * carries the new role), and the acting owner's own change rotates their session.
 */
export async function updateTeamMember(
  em: EntityManager,
  auth: Auth,
  organizationId: string,
  actorId: string,
  user: User,
  change: UpdateTeamMemberRequest,
): Promise<MemberChange> {
  const roleChanges = change.role !== undefined && change.role !== user.role;
  const deactivates = change.active === false && user.active;
  const reactivates = change.active === true && !user.active;
  if (user.role === 'owner' && user.active && (deactivates || (roleChanges && change.role !== 'owner'))) {
    if ((await otherActiveOwners(em, organizationId, user.id)) === 0)
      throw conflict(
        deactivates
          ? `${user.name} is the firm’s only owner who can sign in; make someone else an owner before deactivating them.`
          : `${user.name} is the firm’s only owner who can sign in; make someone else an owner first.`,
      );
  }
  const from: Role = user.role;
  if (roleChanges) {
    user.role = change.role!;
    recordFirmEvent(em, organizationId, 'role-changed', actorId, user.id, {
      from: ROLE_LABELS[from].toLowerCase(),
      to: ROLE_LABELS[user.role].toLowerCase(),
    });
  }
  if (deactivates) {
    user.active = false;
    recordFirmEvent(em, organizationId, 'member-deactivated', actorId, user.id);
  }
  if (reactivates) {
    user.active = true;
    recordFirmEvent(em, organizationId, 'member-reactivated', actorId, user.id);
  }
  await em.flush();
  if (roleChanges || deactivates) await auth.invalidateUserSessions(user.id);
  return { user, rotateOwnSession: (roleChanges || deactivates) && user.id === actorId && user.active };
}
