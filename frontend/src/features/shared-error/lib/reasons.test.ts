import { describe, expect, it } from 'vitest';
import { reasonFor } from './reasons';

describe('reasonFor', () => {
  const warnings = [
    'The intraclass correlation needs polls in at least 2 contests.',
    'No pair of firms polled at least 5 contests in common, so no firm-pair correlation is computed.',
    'Only 2 errors: the normality checks and the Q–Q plot need at least 3.',
  ];

  it('picks the warning about the missing figure', () => {
    expect(reasonFor(warnings, 'icc')).toBe(warnings[0]);
    expect(reasonFor(warnings, 'pairs')).toBe(warnings[1]);
    expect(reasonFor(warnings, 'normality')).toBe(warnings[2]);
  });

  it('falls back to a plain reason when the analysis gave none', () => {
    expect(reasonFor([], 'split')).toMatch(/split needs/);
    expect(reasonFor(undefined, 'meanTest')).toMatch(/at least 2 contests/);
  });
});
