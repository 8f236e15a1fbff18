// When a screen crashes: say so plainly, offer a way back, never a stack trace.
import { Link, useRouteError } from 'react-router-dom';
import { paths } from '../lib/paths.ts';

export function RouteError() {
  const error = useRouteError();
  console.error(error);
  return (
    <main className="mx-auto max-w-xl p-6">
      <div role="alert" className="card">
        <h1 className="text-xl font-bold">This screen ran into a problem</h1>
        <p className="mt-2 text-ink-soft">Nothing you entered was lost on our side. Reload the page, or go back to Today.</p>
        <div className="mt-3 flex gap-2">
          <button type="button" className="btn-primary" onClick={() => window.location.reload()}>
            Reload
          </button>
          <Link className="btn-secondary" to={paths.home}>
            Back to Today
          </Link>
        </div>
      </div>
    </main>
  );
}
