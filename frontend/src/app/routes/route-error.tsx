import { isRouteErrorResponse, useLocation, useNavigate, useRouteError } from 'react-router-dom';
import { AccessDenied, Button } from '../../components/ui';
import { isApiError } from '../../lib/api-client';
import { paths } from '../../lib/paths';
import { NotFoundRoute } from './not-found';

function statusOf(error: unknown): number | null {
  if (isRouteErrorResponse(error)) return error.status;
  if (isApiError(error)) return error.status;
  return null;
}

/**
 * The errorElement of the routes: a plain sentence and a way to try again. Technical details go to
 * the console only.
 */
export function RouteErrorBoundary({ fullPage = false }: { fullPage?: boolean }) {
  const error = useRouteError();
  const navigate = useNavigate();
  const location = useLocation();
  const status = statusOf(error);

  if (status === 404) return <NotFoundRoute />;
  if (status === 403) return <AccessDenied homeHref={paths.home.href()} />;

  console.error(error);
  const unreachable = isApiError(error) && (error.status === 0 || error.status === 503);

  const panel = (
    <div role="alert" className="mx-auto max-w-xl rounded-lg border border-ink-200 bg-white px-6 py-10 text-center shadow-sm">
      <title>Something went wrong · Veracast</title>
      <h1 className="text-2xl font-semibold text-ink-950">Something went wrong</h1>
      <p className="mt-3 text-ink-600">
        {unreachable
          ? 'Veracast could not reach its server. It may be restarting; try again in a moment.'
          : 'This page could not be shown. Trying again often helps; if it keeps failing, tell your administrator.'}
      </p>
      <div className="mt-6 flex justify-center gap-3">
        <Button onClick={() => void navigate(`${location.pathname}${location.search}`, { replace: true })}>
          Try again
        </Button>
        <Button variant="secondary" onClick={() => void navigate(paths.home.href())}>
          Go to the overview
        </Button>
      </div>
    </div>
  );

  return fullPage ? <div className="px-4 py-16">{panel}</div> : panel;
}
