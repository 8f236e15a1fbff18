import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ProblemKind, ServiceCall } from '@bumperline/contracts/calls';
import type { GameStatus } from '@bumperline/contracts/games';
import { get, post } from '../lib/api-client.ts';

export interface VenueView {
  venues: { id: string; name: string; addressLine: string; city: string }[];
  games: { id: string; venueId: string; serial: string; status: GameStatus; title: string; kind: string }[];
  openCalls: ServiceCall[];
  pastCalls: ServiceCall[];
}

export const venueViewKeys = { all: ['venue-view'] as const };
export const venueViewQuery = () =>
  queryOptions({ queryKey: venueViewKeys.all, queryFn: () => get<VenueView>('/api/venue-view'), refetchInterval: 60_000 });
export const useVenueView = () => useQuery(venueViewQuery());

export function useVenueReport() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { gameId: string; problem: ProblemKind; note: string }) =>
      post<{ id: string; joined: boolean }>('/api/venue-view/calls', v),
    onSuccess: () => qc.invalidateQueries({ queryKey: venueViewKeys.all }),
  });
}
