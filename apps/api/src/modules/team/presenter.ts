import type { TeamMember } from '@gloaming/contracts';
import type { User } from '@gloaming/db';

export function presentTeamMember(user: User): TeamMember {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    status: !user.active ? 'deactivated' : user.passwordHash ? 'active' : 'invited',
  };
}
