import type { ContestDto } from '@veracast/shared-types';
import type { ContestPoll } from './api/list-contest-polls';

export interface MarginPoint {
  pollKey: string;
  pollster: string;
  /** Fieldwork midpoint, ISO date. */
  midpoint: string;
  fieldworkStart: string;
  fieldworkEnd: string;
  sampleSize: number;
  /** Poll's A minus B in points, under the undecided treatment the metrics were computed with. */
  margin: number;
  /** Margin error in points (poll margin minus certified margin), when computable. */
  marginError: number | null;
}

const DAY_MS = 86_400_000;

/** The calendar day halfway through fieldwork (rounded down), as YYYY-MM-DD. */
export function fieldworkMidpoint(start: string, end: string): string {
  const a = Date.parse(`${start}T00:00:00Z`);
  const b = Date.parse(`${end}T00:00:00Z`);
  if (!Number.isFinite(a) || !Number.isFinite(b)) return end;
  const days = Math.floor((b - a) / DAY_MS / 2);
  return new Date(a + days * DAY_MS).toISOString().slice(0, 10);
}

/**
 * A poll's margin A − B in points: from its metrics when the server computed them (they follow
 * the chosen undecided treatment), else from its published shares.
 */
export function pollMargin(poll: ContestPoll, refA: string | null, refB: string | null): number | null {
  const m = poll.metrics;
  if (m && m.pollA !== null && m.pollB !== null) return m.pollA - m.pollB;
  if (!refA || !refB) return null;
  const a = poll.shares[refA];
  const b = poll.shares[refB];
  return a === undefined || b === undefined ? null : a - b;
}

/**
 * The certified margin A − B in points on the same footing as the polls' margins: from the metrics
 * (rescaled like the polls under the two-party treatment), else from the contest's shares.
 */
export function certifiedMargin(contest: Pick<ContestDto, 'options' | 'refA' | 'refB' | 'status'>, polls: readonly ContestPoll[]): number | null {
  if (contest.status !== 'certified') return null;
  for (const poll of polls) {
    const m = poll.metrics;
    if (m && m.resultA !== null && m.resultB !== null) return m.resultA - m.resultB;
  }
  const a = contest.options.find((o) => o.key === contest.refA)?.share;
  const b = contest.options.find((o) => o.key === contest.refB)?.share;
  return a === null || a === undefined || b === null || b === undefined ? null : a - b;
}

export function marginPoints(contest: Pick<ContestDto, 'refA' | 'refB'>, polls: readonly ContestPoll[]): MarginPoint[] {
  const points: MarginPoint[] = [];
  for (const poll of polls) {
    const margin = pollMargin(poll, contest.refA, contest.refB);
    if (margin === null) continue;
    points.push({
      pollKey: poll.key,
      pollster: poll.pollster,
      midpoint: fieldworkMidpoint(poll.fieldworkStart, poll.fieldworkEnd),
      fieldworkStart: poll.fieldworkStart,
      fieldworkEnd: poll.fieldworkEnd,
      sampleSize: poll.sampleSize,
      margin,
      marginError: poll.metrics?.marginError ?? null,
    });
  }
  return points.sort((x, y) => (x.midpoint < y.midpoint ? -1 : x.midpoint > y.midpoint ? 1 : x.pollKey < y.pollKey ? -1 : 1));
}
