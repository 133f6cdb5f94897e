import { ROLE_LABELS, type InviteRequest } from '@gloaming/contracts';
import { Organization, User, type EntityManager } from '@gloaming/db';
import { issueToken } from '../../auth/tokens';
import { conflict, notFound } from '../../http/problem';
import type { Mailer } from '../../mail/mailer';
import { inviteMail } from '../../mail/templates';

export const INVITE_TTL_MS = 7 * 24 * 3600_000;

export async function findFirmUser(em: EntityManager, organizationId: string, id: string): Promise<User> {
  const user = await em.findOne(User, { id, organization: organizationId }, { populate: ['organization'] });
  if (!user) throw notFound('That person');
  return user;
}

async function sendInvite(em: EntityManager, mailer: Mailer, publicUrl: string, user: User, inviterName: string) {
  const token = issueToken(em, user, 'invite', INVITE_TTL_MS);
  await em.flush();
  const link = `${publicUrl}/accept-invite?token=${token}`;
  await mailer.send({
    to: user.email,
    ...inviteMail({ name: user.name, firmName: user.organization.name, inviterName, link, role: ROLE_LABELS[user.role].toLowerCase() }),
  });
}

export async function inviteUser(
  em: EntityManager,
  mailer: Mailer,
  publicUrl: string,
  organizationId: string,
  inviterName: string,
  input: InviteRequest,
): Promise<User> {
  if (await em.count(User, { email: input.email })) throw conflict('Someone with that e-mail address already has a Gloaming account.');
  const firm = await em.findOneOrFail(Organization, organizationId);
  const user = em.create(User, { organization: firm, email: input.email, name: input.name, role: input.role });
  await sendInvite(em, mailer, publicUrl, user, inviterName);
  return user;
}

export async function resendInvite(em: EntityManager, mailer: Mailer, publicUrl: string, user: User, inviterName: string) {
  if (user.passwordHash) throw conflict(`${user.name} has already accepted the invitation.`);
  await sendInvite(em, mailer, publicUrl, user, inviterName);
}
