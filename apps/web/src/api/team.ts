import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Role } from '@bumperline/contracts/roles';
import type { InvitationInput, InvitationSent, MemberRoleChanged, Team } from '@bumperline/contracts/team';
import { del, get, patch, post } from '../lib/api-client.ts';

export const teamKeys = { all: ['team'] as const };
export const teamQuery = () => queryOptions({ queryKey: teamKeys.all, queryFn: () => get<Team>('/api/team') });
export const useTeam = () => useQuery(teamQuery());

function useTeamMutation<V>(fn: (v: V) => Promise<unknown>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => qc.invalidateQueries({ queryKey: teamKeys.all }) });
}

export const useInvite = () => useTeamMutation((v: InvitationInput) => post<InvitationSent>('/api/team/invitations', v));
export const useRevokeInvitation = () => useTeamMutation((id: string) => del(`/api/team/invitations/${id}`));
export const useChangeRole = () =>
  useTeamMutation((v: { userId: string; role: Role }) => patch<MemberRoleChanged>(`/api/team/members/${v.userId}`, { role: v.role }));
export const useRemoveMember = () => useTeamMutation((userId: string) => del(`/api/team/members/${userId}`));
