// Who is signed in, their company and role: GET /api/account/me.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '@bumperline/contracts/auth';
import { ApiError, get } from '../lib/api-client.ts';

export const meQuery = () =>
  queryOptions({
    queryKey: ['me'],
    queryFn: async (): Promise<Me | null> => {
      try {
        // index.html preloads this request while the scripts download; the browser hands its answer over here.
        return await get<Me>('/api/account/me');
      } catch (err) {
        if (err instanceof ApiError && err.status === 401) return null;
        throw err;
      }
    },
    staleTime: 60_000,
  });

export function useMe() {
  return useQuery(meQuery());
}

/** The operator company's locale, time zone and currency, for formatting. */
export function useLocaleSettings() {
  const me = useMe();
  const c = me.data?.company;
  return c ? { locale: c.locale, timeZone: c.timeZone, currency: c.currency } : undefined;
}
