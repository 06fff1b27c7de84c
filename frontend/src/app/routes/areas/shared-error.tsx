import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router-dom';
import { paths } from '../../../lib/paths';
import { UnbuiltAreaRoute } from '../areas';

/** Routes of the Shared error area; the router spreads them into the signed-in shell. */
export function sharedErrorRoutes(_queryClient: QueryClient): RouteObject[] {
  return [{ path: paths.sharedError.path, element: <UnbuiltAreaRoute title="Shared error" purpose="Tests of whether the misses in an election were common to the firms rather than their own." /> }];
}
