import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { VenueReportInput, VenueReportOpened, VenueView } from '@bumperline/contracts/venue-view';
import { get, post } from '../lib/api-client.ts';

export const venueViewKeys = { all: ['venue-view'] as const };
export const venueViewQuery = () =>
  queryOptions({ queryKey: venueViewKeys.all, queryFn: () => get<VenueView>('/api/venue-view'), refetchInterval: 60_000 });
export const useVenueView = () => useQuery(venueViewQuery());

export function useVenueReport() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: VenueReportInput) => post<VenueReportOpened>('/api/venue-view/calls', v),
    onSuccess: () => qc.invalidateQueries({ queryKey: venueViewKeys.all }),
  });
}
