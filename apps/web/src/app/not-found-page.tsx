import { Link } from 'react-router-dom';
import { paths } from '../lib/paths.ts';

export function NotFoundPage() {
  return (
    <div className="card max-w-xl">
      <h1 className="text-xl font-bold">This page does not exist</h1>
      <p className="mt-2 text-ink-soft">The link may be old, or the thing it pointed to was removed.</p>
      <Link className="link mt-3 inline-block" to={paths.home}>
        Back to Today
      </Link>
    </div>
  );
}
