import { TeamMemberResponse, type TeamMember, type UpdateTeamMemberRequest } from '@gloaming/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { teamKeys } from './team-keys';

/** PATCH /api/users/:id (owner only): change the role, or deactivate / reactivate; their sessions end. */
export async function updateMember({ id, change }: { id: string; change: UpdateTeamMemberRequest }): Promise<TeamMember> {
  const { user } = await apiRequest(`/users/${id}`, { method: 'PATCH', body: change, schema: TeamMemberResponse });
  return user;
}

export function useUpdateMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMember,
    onSettled: () => queryClient.invalidateQueries({ queryKey: teamKeys.all }),
  });
}
