// A route's page loaded on first visit, with the same loading state as data.
import { lazy, Suspense, type ComponentType } from 'react';
import { Loading } from '../components/states.tsx';

export function lazyPage(load: () => Promise<ComponentType>) {
  const Page = lazy(async () => ({ default: await load() }));
  return function LazyPage() {
    return (
      <Suspense fallback={<Loading />}>
        <Page />
      </Suspense>
    );
  };
}
