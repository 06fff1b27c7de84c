import type { AuditSettings, DisclosureItem, PollsterDto } from '@veracast/shared-types';

/** A closed interval `[lo, hi]` in the unit of the figure it belongs to. */
export type Interval = readonly [number, number];

/** One pollster's scorecard as `GET /audits/:id/scorecards` sends it; error figures in points. */
export interface ScorecardItem {
  pollsterId: number;
  pollster: string;
  polls: number;
  contests: number;
  elections: number;
  meanAbsMarginError: number;
  meanSignedError: number;
  meanSignedErrorInterval: Interval | null;
  meanSignedErrorNote?: string | null;
  rmse: number;
  winnerCalledRate: number | null;
  calls: number;
  callsCorrect?: number;
  noCalls: number;
  coverageRate: number | null;
  coverageN?: number;
  shareCoverageRate: number | null;
  shareCoverageN?: number;
  /** Mean disclosure completeness 0–1: a separate dimension from accuracy. */
  disclosure: number | null;
  excessError: number | null;
  excessErrorShrunk: number | null;
  excessErrorInterval: Interval | null;
  excessErrorShrunkInterval: Interval | null;
  rank: number | null;
  rankInterval: Interval | null;
  pRankFirst: number | null;
  ranked: boolean;
  reason: string | null;
}

export interface ScorecardField {
  polls: number;
  pollsters: number;
  contests: number;
  elections: number;
  fieldMeanAbsMarginError: number;
  fieldMeanSignedError: number;
  fieldRmse: number;
  fieldWinnerCalledRate: number | null;
  fieldCoverageRate: number | null;
  fieldShareCoverageRate: number | null;
  ranked: number;
  minPolls: number;
  level: number;
  nominalCoverage: number;
  shrinkage: { applied: boolean; note: string | null; sigma2: number | null; tau2: number | null; mu: number };
}

export interface ScorecardsResponse {
  items: ScorecardItem[];
  /** Null when no poll is left after filtering. */
  field: ScorecardField | null;
  total: number;
  filtered: boolean;
}

/** One audit in `GET /audits`. */
export interface AuditListItem {
  id: number;
  name: string;
  settings: AuditSettings;
  dataHash: string;
  pollCount: number;
  createdAt: string;
  createdBy: string | null;
}

/** `GET /pollsters/:id`: the firm and, per disclosure item, the share of its polls that disclose it. */
export type PollsterProfile = PollsterDto & {
  disclosureItems?: Partial<Record<DisclosureItem, number>>;
};
