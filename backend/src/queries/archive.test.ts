import { describe, expect, it } from 'vitest';
import { disclosureCompleteness, disclosureOf, type PollRow } from './archive';

// [practice] the audit's fast completeness must be the disclosure checklist's own figure.
const base: PollRow = {
  id: 1, key: 'p1', pollsterId: 1, pollster: 'Firm', sponsor: 'Paper', sponsorType: 'media', contestId: 1, fieldworkStart: '2030-01-01',
  fieldworkEnd: '2030-01-03', publishedOn: '2030-01-04', sampleSize: 1000, population: 'lv', mode: 'online', moe: 3.1, studyKey: null,
  isHeadline: true, tracking: false, sourceUrl: null, questionWording: true, weightingStatement: true, tablesUrl: 'https://example.org/t', shares: {},
};
const absent: Partial<PollRow>[] = [
  { sponsor: null }, { pollster: '' }, { fieldworkStart: '' }, { population: '' as PollRow['population'] }, { sampleSize: 0 },
  { mode: '' as PollRow['mode'] }, { moe: null }, { weightingStatement: false }, { questionWording: false }, { tablesUrl: null },
];

describe('disclosureCompleteness', () => {
  it('equals disclosureOf(p).completeness for every combination of missing items', () => {
    for (let mask = 0; mask < 1 << absent.length; mask++) {
      const poll = { ...base };
      absent.forEach((change, i) => {
        if (mask & (1 << i)) Object.assign(poll, change);
      });
      expect(disclosureCompleteness(poll)).toBe(disclosureOf(poll).completeness);
    }
    expect(disclosureCompleteness(base)).toBe(1);
  });
});
