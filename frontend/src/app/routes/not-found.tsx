import { Link } from 'react-router-dom';
import { paths } from '../../lib/paths';

export function NotFoundRoute() {
  return (
    <div className="mx-auto max-w-xl rounded-lg border border-ink-200 bg-white px-6 py-10 text-center shadow-sm">
      <title>Page not found · Veracast</title>
      <p className="text-sm font-medium text-ink-500">Error 404</p>
      <h1 className="mt-1 text-2xl font-semibold text-ink-950">Page not found</h1>
      <p className="mt-3 text-ink-600">There is no page at this address. It may have moved, or the link may be mistyped.</p>
      <Link to={paths.home.href()} className="mt-6 inline-block font-medium text-accent-700 underline hover:text-accent-900">
        Go to the overview
      </Link>
    </div>
  );
}
