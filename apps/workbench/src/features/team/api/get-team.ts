import { TeamResponse, type TeamMember } from '@gloaming/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/http-client';
import { teamKeys } from './team-keys';

/** GET /api/users (owner only): everyone in the firm, invited and deactivated people included. */
export async function fetchTeam(signal?: AbortSignal): Promise<TeamMember[]> {
  const { users } = await apiRequest('/users', { schema: TeamResponse, signal });
  return users;
}

export const teamQueryOptions = () =>
  queryOptions({
    queryKey: teamKeys.members(),
    queryFn: ({ signal }) => fetchTeam(signal),
  });

export function useTeam() {
  return useQuery(teamQueryOptions());
}
