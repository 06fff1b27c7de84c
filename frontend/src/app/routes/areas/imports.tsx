import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router-dom';
import { RequireRole } from '../../../features/auth';
import { paths } from '../../../lib/paths';
import { UnbuiltAreaRoute } from '../areas';

/** Routes of the Imports area; the router spreads them into the signed-in shell. */
export function importsRoutes(_queryClient: QueryClient): RouteObject[] {
  return [{ path: paths.imports.path, element: <RequireRole minimum="analyst"><UnbuiltAreaRoute title="Imports" purpose="Loading certified results and polls from CSV files, with a dry run and row-by-row checks." /></RequireRole> }];
}
