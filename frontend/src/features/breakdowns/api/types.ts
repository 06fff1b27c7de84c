/** `GET /audits/:id/breakdowns`; every error figure in points. */

export type Interval = readonly [number, number];

export interface BreakdownBin {
  label: string;
  n: number;
  meanAbs: number | null;
  meanSigned: number | null;
  /** 95% t interval of the mean signed error. */
  lo: number | null;
  hi: number | null;
  /** 95% t interval of the mean absolute error. */
  absInterval: Interval | null;
}

export interface Breakdown {
  bins: BreakdownBin[];
  /** Polls whose value was unknown or fell in no bin. */
  excluded: number;
}

export interface DaysOutPoint {
  pollKey: string;
  pollster: string;
  daysOut: number | null;
  signedError: number;
  absError: number;
  /** Whether the audit uses the poll (in the window, final when the audit says so). */
  used: boolean;
}

export interface SampleSizePoint {
  pollKey: string;
  n: number;
  absError: number;
}

export interface FunnelPoint {
  n: number;
  nEff: number;
  marginSe: number;
  expectedAbsMarginError: number;
  marginMoe95: number;
}

export interface QqPoint {
  /** Normal quantile at the point's plotting position. */
  theoretical: number;
  /** Standardised signed error (minus the mean, over the SD). */
  sample: number;
  /** Signed error in points. */
  value: number;
}

export interface ElectionBreakdown {
  electionKey: string;
  n: number;
  meanAbs: number | null;
  meanSigned: number | null;
  lo: number | null;
  hi: number | null;
}

export interface AuditBreakdownsResponse {
  usedPolls: number;
  daysOut: { points: DaysOutPoint[]; bins: Breakdown | null };
  population: Breakdown | null;
  mode: Breakdown | null;
  sponsor: Breakdown | null;
  undecided: Breakdown | null;
  sampleSize: { points: SampleSizePoint[]; bins: Breakdown | null; funnel: FunnelPoint[] | null };
  qq: QqPoint[] | null;
  byElection: ElectionBreakdown[];
}
