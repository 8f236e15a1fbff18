import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { meQuery } from '../api/me.ts';
import { queryClient } from './query-client.ts';
import { router } from './router.tsx';

// index.html preloads /me. Asking for it at start on every screen uses that answer now, never later: a page
// that signs someone in must not be handed the answer from before.
void queryClient.prefetchQuery(meQuery());

export function App() {
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
