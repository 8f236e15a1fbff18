// Client-side gates. The API enforces the same rules; these only keep people off screens they cannot use.
import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { can, type Permission } from '@bumperline/contracts/roles';
import { useMe } from '../api/me.ts';
import { ErrorState, Loading } from '../components/states.tsx';
import { paths } from '../lib/paths.ts';

export function RequireSignedIn({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isLoading) return <Loading />;
  // With a saved copy (a phone offline, a dropped connection) the person is still known: keep their screens.
  if (me.error && !me.data) return <ErrorState error={me.error} onRetry={() => me.refetch()} />;
  if (!me.data) return <Navigate to={`${paths.signIn}?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  return <>{children}</>;
}

export function RequirePermission({ permission, children }: { permission: Permission; children: ReactNode }) {
  const me = useMe();
  if (!can(me.data?.role, permission)) {
    return (
      <div role="alert" className="card max-w-xl">
        <h1 className="text-xl font-bold">Not available for your role</h1>
        <p className="mt-2 text-ink-soft">Ask an owner of your company if you need this.</p>
      </div>
    );
  }
  return <>{children}</>;
}
