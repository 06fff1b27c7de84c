import type { QualityIssueDto } from '@veracast/shared-types';
import { describe, expect, it } from 'vitest';
import { QUALITY_CHECKS, countByCheck } from './checks';

const issue = (code: QualityIssueDto['code']): QualityIssueDto => ({ code, severity: 'warning', electionKey: 'e', contestKey: 'c', pollKeys: [], message: 'm' });

describe('countByCheck', () => {
  it('lists every check, with zero for those that found nothing', () => {
    const counts = countByCheck([issue('possible_duplicate'), issue('possible_duplicate'), issue('published_in_blackout')]);
    // [practice] SPEC issue 3: seven checks run after import
    expect(counts).toHaveLength(7);
    expect(counts.find((c) => c.code === 'possible_duplicate')?.count).toBe(2);
    expect(counts.find((c) => c.code === 'published_in_blackout')?.count).toBe(1);
    expect(counts.find((c) => c.code === 'shares_off_100')?.count).toBe(0);
  });

  it('has a label and an explanation for each check', () => {
    for (const check of QUALITY_CHECKS) {
      expect(check.label.length).toBeGreaterThan(5);
      expect(check.explains.endsWith('.')).toBe(true);
    }
  });
});
