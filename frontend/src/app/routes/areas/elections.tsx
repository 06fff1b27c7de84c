import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router-dom';
import { paths } from '../../../lib/paths';
import { UnbuiltAreaRoute } from '../areas';

/** Routes of the Elections area; the router spreads them into the signed-in shell. */
export function electionsRoutes(_queryClient: QueryClient): RouteObject[] {
  return [{ path: paths.elections.path, element: <UnbuiltAreaRoute title="Elections" purpose="Elections, their contests and the certified results, with the source of each certification." /> }];
}
