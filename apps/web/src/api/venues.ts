// Venue endpoints: fetchers, query-option factories (the only place venue query keys live) and hooks.
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  Venue,
  VenueContactList,
  VenueContactsLinked,
  VenueInput,
  VenueListQuery,
  VenuePage,
  VenueUpdate,
} from '@bumperline/contracts/venues';
import { del, get, patch, post } from '../lib/api-client.ts';

export const venueKeys = {
  all: ['venues'] as const,
  list: (q: VenueListQuery) => ['venues', 'list', q] as const,
  detail: (id: string) => ['venues', 'detail', id] as const,
};

export const listVenues = (q: VenueListQuery) => get<VenuePage>('/api/venues', q as Record<string, string>);

export const venueListQuery = (q: VenueListQuery) =>
  queryOptions({ queryKey: venueKeys.list(q), queryFn: () => listVenues(q), placeholderData: keepPreviousData });

export const venueQuery = (id: string) => queryOptions({ queryKey: venueKeys.detail(id), queryFn: () => get<Venue>(`/api/venues/${id}`) });

export const useVenues = (q: VenueListQuery) => useQuery(venueListQuery(q));
export const useVenue = (id: string) => useQuery(venueQuery(id));

/** Every venue matching a search, page by page (for export and pickers). */
export async function allVenues(q: Omit<VenueListQuery, 'cursor' | 'limit'>): Promise<Venue[]> {
  const out: Venue[] = [];
  let cursor: string | undefined;
  do {
    const page = await listVenues({ ...q, limit: 200, cursor });
    out.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor && out.length < 10_000);
  return out;
}

export function useSaveVenue(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: VenueInput | VenueUpdate) => (id ? patch<Venue>(`/api/venues/${id}`, body) : post<Venue>('/api/venues', body)),
    onSuccess: (venue) => {
      qc.setQueryData(venueKeys.detail(venue.id), venue);
      return qc.invalidateQueries({ queryKey: venueKeys.all });
    },
  });
}

export function useRetireVenue(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => post<Venue>(`/api/venues/${id}/retire`),
    onSuccess: () => qc.invalidateQueries({ queryKey: venueKeys.all }),
  });
}

export const venueContactsQuery = (venueId: string) =>
  queryOptions({
    queryKey: [...venueKeys.detail(venueId), 'contacts'] as const,
    queryFn: () => get<VenueContactList>(`/api/venues/${venueId}/contacts`),
  });
export const useVenueContacts = (venueId: string) => useQuery(venueContactsQuery(venueId));

export function useLinkVenueContact(venueId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { userId: string; link: boolean }) =>
      v.link
        ? post<VenueContactsLinked>(`/api/venues/${venueId}/contacts`, { userId: v.userId })
        : del(`/api/venues/${venueId}/contacts/${v.userId}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: venueContactsQuery(venueId).queryKey }),
  });
}
