import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router-dom';
import { paths } from '../../../lib/paths';
import { UnbuiltAreaRoute } from '../areas';

/** Routes of the Data quality area; the router spreads them into the signed-in shell. */
export function dataQualityRoutes(_queryClient: QueryClient): RouteObject[] {
  return [{ path: paths.dataQuality.path, element: <UnbuiltAreaRoute title="Data quality" purpose="Problems found in the loaded data: possible duplicates, shares that do not add up, provisional results." /> }];
}
