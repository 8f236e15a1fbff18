// A route's page loaded on first visit, with the same loading state as data. `preload` starts the download
// early (a route's loader calls it), so the code and the data travel side by side.
import { lazy, Suspense, type ComponentType } from 'react';
import { Loading } from '../components/states.tsx';

export function lazyPage(load: () => Promise<ComponentType>) {
  let loading: Promise<ComponentType> | undefined;
  const preload = () => (loading ??= load());
  const Page = lazy(async () => ({ default: await preload() }));
  function LazyPage() {
    return (
      <Suspense fallback={<Loading />}>
        <Page />
      </Suspense>
    );
  }
  LazyPage.preload = preload;
  return LazyPage;
}
