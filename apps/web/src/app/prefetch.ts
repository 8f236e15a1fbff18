// Route loaders that start a screen's data (and its code) at navigation rather than when the screen first
// renders. /me is already on its way (index.html preloads it), so the role is known at once. They never
// hold the navigation up: the screen renders straight away with its own loading states, and its hooks pick
// up the requests already made (same query options, so the same keys).
import type { LoaderFunctionArgs, Params } from 'react-router-dom';
import type { Role } from '@bumperline/contracts/roles';
import type { FetchAhead } from '../api/fetch-ahead.ts';
import { meQuery } from '../api/me.ts';
import { fetchAhead, queryClient } from './query-client.ts';

/** Starts what the screen at `url` (with the route's `params`, e.g. its `:id`) will ask for when `role` opens it. */
export type ScreenPrefetch = (ahead: FetchAhead, role: Role, url: URL, params: Params) => void;

/** A loader running `preload` (the screen's code) at once and `prefetch` for the signed-in role. */
export function prefetching(prefetch: ScreenPrefetch, preload?: () => Promise<unknown>) {
  return ({ request, params }: LoaderFunctionArgs) => {
    // A failed download shows when the screen renders.
    preload?.().catch(() => {});
    const url = new URL(request.url);
    queryClient.ensureQueryData(meQuery()).then(
      (me) => {
        if (me?.role) prefetch(fetchAhead, me.role, url, params);
      },
      () => {
        // The screen's own /me shows the error.
      },
    );
    return null;
  };
}
