import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';

export type AuditPollStatus = 'used' | 'not_final' | 'outside_window' | 'not_computable';

export const AUDIT_POLL_STATUS_LABELS: Record<AuditPollStatus, string> = {
  used: 'Used',
  not_final: 'In window, not the final poll',
  outside_window: 'Outside the window',
  not_computable: 'Not computable',
};

/**
 * Why a poll does or does not count in the audit's figures, by the rule the server applies
 * (SPEC §5): in the window, the firm's final poll when the audit counts final polls only, and
 * computable. `not_computable` wins over the others because it says the most.
 */
export function auditPollStatus(
  poll: Pick<AuditPollDto, 'inWindow' | 'isFinal' | 'error' | 'marginError'>,
  settings: Pick<AuditSettings, 'finalOnly'>,
): AuditPollStatus {
  if (poll.error !== null || poll.marginError === null) return 'not_computable';
  if (!poll.inWindow) return 'outside_window';
  if (settings.finalOnly && !poll.isFinal) return 'not_final';
  return 'used';
}

export function isUsedPoll(
  poll: Pick<AuditPollDto, 'inWindow' | 'isFinal' | 'error' | 'marginError'>,
  settings: Pick<AuditSettings, 'finalOnly'>,
): boolean {
  return auditPollStatus(poll, settings) === 'used';
}
