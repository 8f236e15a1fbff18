// How a screen's data is asked for before the screen renders (the route loaders in app/ provide it): the
// screens' query files list what to fetch ahead with the same query options their hooks use.
import type { DefaultError, FetchQueryOptions, QueryKey } from '@tanstack/react-query';

export type FetchAhead = <TQueryFnData, TError = DefaultError, TData = TQueryFnData, TQueryKey extends QueryKey = QueryKey>(
  options: FetchQueryOptions<TQueryFnData, TError, TData, TQueryKey>,
) => void;
