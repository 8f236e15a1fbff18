// The one query cache: the screens read it through hooks, the route loaders fill it ahead of them.
import { QueryClient, type Query } from '@tanstack/react-query';
import type { FetchAhead } from '../api/fetch-ahead.ts';
import { ApiError } from '../lib/api-client.ts';

/** When each query's data was fetched ahead by a route loader (the answer the screen has not asked for itself). */
const fetchedAhead = new WeakMap<Query, number>();
const FETCHED_AHEAD_FRESH_MS = 10_000;

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      // Client errors will not fix themselves by retrying.
      retry: (count, err) => !(err instanceof ApiError && err.status >= 400 && err.status < 500) && count < 2,
      refetchOnWindowFocus: true,
      // Data is stale at once (screens ask again when they mount), except an answer a route's loader fetched
      // ahead for its screen moments ago: the screen mounting just after it must not ask for it a second time.
      staleTime: (query) => (fetchedAhead.get(query) === query.state.dataUpdatedAt ? FETCHED_AHEAD_FRESH_MS : 0),
    },
  },
});

/** Starts a screen's query before the screen renders (see app/prefetch.ts); the screen's hook then finds it. */
export const fetchAhead: FetchAhead = (options) => {
  void queryClient.prefetchQuery(options).then(() => {
    const query = queryClient.getQueryCache().find({ queryKey: options.queryKey, exact: true });
    if (query?.state.status === 'success') fetchedAhead.set(query, query.state.dataUpdatedAt);
  });
};
