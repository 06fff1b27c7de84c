import type { QualityIssueDto } from '@veracast/shared-types';

export type QualityCheck = QualityIssueDto['code'];

/** Every check run after an import, in the order screens list them, with what it looks for. */
export const QUALITY_CHECKS: { code: QualityCheck; label: string; explains: string }[] = [
  { code: 'possible_duplicate', label: 'Possible duplicate polls', explains: 'Two polls by one firm with overlapping fieldwork and the same shares within rounding.' },
  { code: 'overlapping_tracking', label: 'Overlapping tracking waves', explains: 'Waves of a tracking poll whose fieldwork overlaps, so they share respondents.' },
  { code: 'study_without_headline', label: 'Study versions without a headline', explains: 'Several versions of one study (e.g. likely and registered voters) without exactly one marked as the headline.' },
  { code: 'shares_off_100', label: 'Shares not near 100', explains: 'A poll whose shares, undecided included, do not sum to about 100.' },
  { code: 'result_provisional', label: 'Results still provisional', explains: 'A contest whose result is not certified yet; audits of it may change.' },
  { code: 'contest_without_result', label: 'Contests without a certified result', explains: 'A contest with no votes entered, so its polls cannot be measured.' },
  { code: 'published_in_blackout', label: 'Published in a blackout period', explains: 'A poll published while publishing polls was forbidden.' },
];

export function checkLabel(code: QualityCheck): string {
  return QUALITY_CHECKS.find((c) => c.code === code)?.label ?? code;
}

/** How many issues each check found, every check listed (a zero says the check ran and found nothing). */
export function countByCheck(issues: readonly QualityIssueDto[]): { code: QualityCheck; label: string; explains: string; count: number }[] {
  return QUALITY_CHECKS.map((check) => ({ ...check, count: issues.filter((i) => i.code === check.code).length }));
}
