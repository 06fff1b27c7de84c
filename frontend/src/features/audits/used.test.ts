import { describe, expect, it } from 'vitest';
import { auditPollStatus } from './used';

const base = { inWindow: true, isFinal: true, error: null, marginError: 1.5 };

describe('auditPollStatus (SPEC §5)', () => {
  it('uses a computable final poll in the window', () => {
    expect(auditPollStatus(base, { finalOnly: true })).toBe('used');
  });

  it('leaves out earlier polls only when the audit counts final polls only', () => {
    expect(auditPollStatus({ ...base, isFinal: false }, { finalOnly: true })).toBe('not_final');
    expect(auditPollStatus({ ...base, isFinal: false }, { finalOnly: false })).toBe('used');
  });

  it('leaves out polls outside the window and polls with no metrics', () => {
    expect(auditPollStatus({ ...base, inWindow: false, isFinal: false }, { finalOnly: false })).toBe('outside_window');
    expect(auditPollStatus({ ...base, error: 'contest has no result yet', marginError: null }, { finalOnly: true })).toBe(
      'not_computable',
    );
  });
});
