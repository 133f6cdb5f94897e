import { InviteResponse, type InviteRequest, type TeamMember } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { teamKeys } from './team-keys';

/** POST /api/invites (owner only): creates the person as invited and e-mails them a link. */
export async function inviteMember(request: InviteRequest): Promise<TeamMember> {
  const { user } = await apiRequest('/invites', { method: 'POST', body: request, schema: InviteResponse });
  return user;
}

export function useInviteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.all }),
  });
}
