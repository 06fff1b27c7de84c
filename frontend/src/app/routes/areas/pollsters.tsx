import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router-dom';
import { paths } from '../../../lib/paths';
import { UnbuiltAreaRoute } from '../areas';

/** Routes of the Pollsters area; the router spreads them into the signed-in shell. */
export function pollstersRoutes(_queryClient: QueryClient): RouteObject[] {
  return [{ path: paths.pollsters.path, element: <UnbuiltAreaRoute title="Pollsters" purpose="Polling firms, the names they publish under, and each firm’s record across audits." /> }];
}
