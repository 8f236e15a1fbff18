// The first screen after sign-in depends on the role: venue contacts get their venue view, technicians My day.
import { Navigate } from 'react-router-dom';
import { can } from '@bumperline/contracts/roles';
import { useMe } from '../api/me.ts';
import { venueViewQuery } from '../api/venue-view.ts';
import { Loading } from '../components/states.tsx';
import { HomePage } from '../features/home/home-page.tsx';
import { prefetchToday } from '../features/home/today-queries.ts';
import { lazyPage } from './lazy-page.tsx';
import type { ScreenPrefetch } from './prefetch.ts';
import { paths } from '../lib/paths.ts';
import { myDayQuery } from '../api/route-days.ts';

const VenueViewPage = lazyPage(() => import('../features/venue-view/venue-view-page.tsx').then((m) => m.VenueViewPage));

export function StartPage() {
  const me = useMe();
  if (me.isLoading) return <Loading />;
  if (me.data?.role === 'technician') return <Navigate to={paths.myDay} replace />;
  return me.data?.role === 'venue_contact' ? <VenueViewPage /> : <HomePage />;
}

/** What StartPage will show for this role, started at navigation. */
export const prefetchStartPage: ScreenPrefetch = (ahead, role) => {
  if (role === 'venue_contact') {
    void VenueViewPage.preload();
    ahead(venueViewQuery());
  } else if (role === 'technician') {
    ahead(myDayQuery());
  } else if (can(role, 'games:read')) {
    prefetchToday(ahead, role);
  }
};
