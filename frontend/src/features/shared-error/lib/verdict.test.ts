import { describe, expect, it } from 'vitest';
import { buildEmptyAnalysis, buildSharedMissAnalysis } from '../testing';
import { describeDirection, firmTypicalErrors, sharedMissVerdict } from './verdict';

const blocs = { blocA: 'OAK', blocB: 'LAN' };

describe('firmTypicalErrors', () => {
  it('adds each firm’s house effect to the election’s mean signed error', () => {
    const firms = firmTypicalErrors(buildSharedMissAnalysis());
    // [practice] mean −4.25 plus the plain house effects 0.5, −0.4, 1.2
    expect(firms.map((f) => f.firm)).toEqual(['Alder Polling', 'Birch Surveys', '=Cedar Research']);
    expect(firms[0]?.error).toBeCloseTo(-3.75, 12);
    expect(firms[1]?.error).toBeCloseTo(-4.65, 12);
    expect(firms[2]?.error).toBeCloseTo(-3.05, 12);
  });

  it('is empty without a mean', () => {
    expect(firmTypicalErrors(buildEmptyAnalysis())).toEqual([]);
  });
});

describe('describeDirection', () => {
  it('names the blocs the signed error is oriented by', () => {
    expect(describeDirection(-3.4, blocs)).toBe('polls understated OAK against LAN');
    expect(describeDirection(1.2, blocs)).toBe('polls overstated OAK against LAN');
    expect(describeDirection(0, blocs)).toBe('polls leaned neither way');
    expect(describeDirection(null, blocs)).toBeNull();
    expect(describeDirection(-1, { blocA: null, blocB: null })).toBe('polls understated the first bloc against the second bloc');
  });
});

describe('sharedMissVerdict', () => {
  it('raises the flag when the clustered test rejects 0 and most firms missed the same way', () => {
    const v = sharedMissVerdict(buildSharedMissAnalysis(), blocs);
    // [practice] the flag's rule: p < 0.05 and more than half the firms share the mean's sign
    expect(v.kind).toBe('shared');
    expect(v.title).toBe('Shared miss: most firms missed the same way');
    expect(v.firmsSameSign).toBe(3);
    expect(v.firmsCounted).toBe(3);
    expect(v.summary).toContain('Polls understated OAK against LAN by 4.3 points');
    expect(v.summary).toContain('\u22124.3 pts');
    expect(v.summary).toContain('95% interval \u22126.4 to \u22122.1');
    expect(v.summary).toContain('p = 0.014');
  });

  it('does not raise the flag when only half of the firms missed the same way', () => {
    const analysis = buildSharedMissAnalysis({
      meanSignedError: -1,
      houseEffects: [
        { firm: 'A', polls: 2, contests: 2, plain: -1, leaveOneOut: null, leaveOneOutPolls: 0 },
        { firm: 'B', polls: 2, contests: 2, plain: 3, leaveOneOut: null, leaveOneOutPolls: 0 },
      ],
    });
    const v = sharedMissVerdict(analysis, blocs);
    // [practice] 1 of 2 firms is not "most"
    expect(v.kind).toBe('mean-only');
    expect(v.firmsSameSign).toBe(1);
    expect(v.title).not.toContain('Shared miss:');
  });

  it('says the evidence is not there when p is 0.05 or more', () => {
    const v = sharedMissVerdict(buildSharedMissAnalysis({ p: 0.05, ciLow: -8.5, ciHigh: 0.01 }), blocs);
    // [practice] p = 0.05 is not below the 0.05 level
    expect(v.kind).toBe('not-shown');
    expect(v.title).toBe('No clear shared miss: the evidence is not there');
  });

  it('explains, with the analysis’s own warning, why one contest cannot be tested', () => {
    const warning = 'Only one contest has polls: the mean error cannot be tested with contest-clustered standard errors, which need at least 2 contests.';
    const v = sharedMissVerdict(
      buildSharedMissAnalysis({ contests: 1, p: null, t: null, df: null, clusteredSe: null, ciLow: null, ciHigh: null, warnings: [warning] }),
      blocs,
    );
    expect(v.kind).toBe('untested');
    expect(v.summary).toContain(warning);
    expect(v.summary).not.toMatch(/NaN|undefined|null/);
  });

  it('says there is not enough data when nothing was computed', () => {
    const v = sharedMissVerdict(buildEmptyAnalysis(), blocs);
    expect(v.kind).toBe('no-data');
    expect(v.direction).toBeNull();
    expect(v.summary).toBe('There are no polls with a usable signed error, so nothing could be computed.');
  });
});
