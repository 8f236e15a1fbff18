import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { InvitationInput } from '@bumperline/contracts/auth';
import type { Role } from '@bumperline/contracts/roles';
import { del, get, patch, post } from '../lib/api-client.ts';

export interface Member {
  userId: string;
  name: string;
  email: string;
  role: Role;
  since: string;
}
export interface OpenInvitation {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
}

export const teamKeys = { all: ['team'] as const };
export const teamQuery = () =>
  queryOptions({ queryKey: teamKeys.all, queryFn: () => get<{ members: Member[]; invitations: OpenInvitation[] }>('/api/team') });
export const useTeam = () => useQuery(teamQuery());

function useTeamMutation<V>(fn: (v: V) => Promise<unknown>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => qc.invalidateQueries({ queryKey: teamKeys.all }) });
}

export const useInvite = () => useTeamMutation((v: InvitationInput) => post('/api/team/invitations', v));
export const useRevokeInvitation = () => useTeamMutation((id: string) => del(`/api/team/invitations/${id}`));
export const useChangeRole = () =>
  useTeamMutation((v: { userId: string; role: Role }) => patch(`/api/team/members/${v.userId}`, { role: v.role }));
export const useRemoveMember = () => useTeamMutation((userId: string) => del(`/api/team/members/${userId}`));
