import { ComingSoon } from '../../components/ui';
import { paths } from '../../lib/paths';

/** The areas of the product that are not built yet. Each shows an honest placeholder, never sample data. */
export const UNBUILT_AREAS = [
  {
    path: paths.elections.path,
    title: 'Elections',
    purpose: 'Elections, their contests and the certified results, with the source of each certification.',
  },
  {
    path: paths.pollsters.path,
    title: 'Pollsters',
    purpose: 'Polling firms, the names they publish under, and each firm’s record across audits.',
  },
  {
    path: paths.audits.path,
    title: 'Audits',
    purpose: 'Frozen computations of every poll’s error and of each pollster’s scorecard, with their settings.',
  },
  {
    path: paths.sharedError.path,
    title: 'Shared error',
    purpose: 'Tests of whether the misses in an election were common to the firms rather than their own.',
  },
  {
    path: paths.imports.path,
    title: 'Imports',
    purpose: 'Loading certified results and polls from CSV files, with a dry run and row-by-row checks.',
  },
  {
    path: paths.notes.path,
    title: 'Notes',
    purpose: 'Methodology notes that explain an audit, reviewed by a second person before they are published.',
  },
  {
    path: paths.dataQuality.path,
    title: 'Data quality',
    purpose: 'Problems found in the loaded data: shares that do not add up, missing sample sizes, late fieldwork.',
  },
] as const;

export function UnbuiltAreaRoute({ title, purpose }: { title: string; purpose: string }) {
  return <ComingSoon title={title} purpose={purpose} />;
}
