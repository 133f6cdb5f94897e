import type { User as LuciaUser } from 'lucia';
import type { SessionUser } from '@gloaming/contracts';
import type { User } from '@gloaming/db';

export function presentSessionUser(user: User): SessionUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    organization: { id: user.organization.id, name: user.organization.name },
  };
}

export function presentAuthUser(user: LuciaUser): SessionUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    organization: { id: user.organizationId, name: user.organizationName },
  };
}
