import type { QueryClient } from '@tanstack/react-query';
import type { RouteObject } from 'react-router-dom';
import { paths } from '../../../lib/paths';
import { UnbuiltAreaRoute } from '../areas';

/** Routes of the Notes area; the router spreads them into the signed-in shell. */
export function notesRoutes(_queryClient: QueryClient): RouteObject[] {
  return [{ path: paths.notes.path, element: <UnbuiltAreaRoute title="Notes" purpose="Methodology notes that explain an audit, reviewed by a second person before they are published." /> }];
}
