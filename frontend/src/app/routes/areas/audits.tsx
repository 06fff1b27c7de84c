import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router-dom';
import { paths } from '../../../lib/paths';
import { UnbuiltAreaRoute } from '../areas';

/** Routes of the Audits area; the router spreads them into the signed-in shell. */
export function auditsRoutes(_queryClient: QueryClient): RouteObject[] {
  return [{ path: paths.audits.path, element: <UnbuiltAreaRoute title="Audits" purpose="Frozen computations of every poll’s error and of each pollster’s scorecard, with their settings." /> }];
}
