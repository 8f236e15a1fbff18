// The first screen after sign-in depends on the role: venue contacts get their venue view.
import { useMe } from '../api/me.ts';
import { Loading } from '../components/states.tsx';
import { HomePage } from '../features/home/home-page.tsx';
import { lazyPage } from './lazy-page.tsx';

const VenueViewPage = lazyPage(() => import('../features/venue-view/venue-view-page.tsx').then((m) => m.VenueViewPage));

export function StartPage() {
  const me = useMe();
  if (me.isLoading) return <Loading />;
  return me.data?.role === 'venue_contact' ? <VenueViewPage /> : <HomePage />;
}
