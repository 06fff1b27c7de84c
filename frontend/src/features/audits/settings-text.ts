import type { UndecidedTreatment } from '@veracast/shared-types';

export const UNDECIDED_LABELS: Record<UndecidedTreatment, string> = {
  raw: 'Raw: shares as published',
  proportional: 'Proportional: undecided spread over the named options',
  two_party: 'Two-party: A and B only',
};

/** One line per audit setting, shown beside its field and on the methods page. */
export const SETTING_HELP = {
  name: 'A name that tells colleagues what this audit is for; notes cite it.',
  elections: 'The audit measures every poll of these elections against their certified results.',
  windowDays: 'A poll counts when its fieldwork ended this many days or fewer before election day (0 = election day).',
  finalOnly: 'Count only each pollster’s last poll of a contest in the window, so busy firms do not weigh more.',
  undecided: 'How respondents who named no option are handled; never compare errors made under different treatments.',
  designEffect: 'Widens the intervals of polls that state no margin of error: effective sample = n ÷ design effect (1 = simple random sample).',
  minPolls: 'A pollster needs at least this many used polls to be ranked; firms with fewer are shown but not ranked.',
} as const;

