import type { AuditPollDto } from '@veracast/shared-types';

/**
 * Plain summaries of one firm's polls against the field's, for the firm's charts. They only
 * count and average what the audit computed; every statistic with an interval comes from the API.
 */

export interface ElectionInfo {
  key: string;
  name: string;
  date: string;
  blocA: string | null;
  blocB: string | null;
}

export interface FirmElectionRow {
  electionKey: string;
  election: string;
  blocA: string | null;
  blocB: string | null;
  /** The firm's polls the audit uses in this election. */
  firmPolls: number;
  /** Of those, the ones whose contests carry the election's two blocs (their errors can be signed alike). */
  firmSignedPolls: number;
  firmMeanSigned: number | null;
  firmMeanAbs: number | null;
  fieldPolls: number;
  fieldSignedPolls: number;
  fieldMeanSigned: number | null;
  fieldMeanAbs: number | null;
  /** Firm minus field mean signed error: positive when the firm leaned further toward bloc A. */
  difference: number | null;
}

function average(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  let sum = 0;
  for (const v of values) sum += v;
  return sum / values.length;
}

const computable = (p: AuditPollDto): p is AuditPollDto & { marginError: number; absMarginError: number } =>
  p.error === null && p.marginError !== null && p.absMarginError !== null;

/**
 * Per election (in date order): the firm's and the field's mean signed error (over polls oriented
 * by the election's blocs) and mean absolute error (over every used poll). The firm's polls count
 * only when the field (the audit's used polls) holds them.
 */
export function firmElectionRows(pollsterId: number, fieldPolls: readonly AuditPollDto[], elections: readonly ElectionInfo[]): FirmElectionRow[] {
  const ordered = [...elections].sort((a, b) => a.date.localeCompare(b.date));
  return ordered.map((e) => {
    const field = fieldPolls.filter((p) => p.electionKey === e.key && computable(p)) as (AuditPollDto & { marginError: number; absMarginError: number })[];
    const firm = field.filter((p) => p.pollsterId === pollsterId);
    const signed = (xs: typeof field) => xs.filter((p) => p.refBasis === 'blocs').map((p) => p.marginError);
    const firmSigned = signed(firm);
    const fieldSigned = signed(field);
    const firmMeanSigned = average(firmSigned);
    const fieldMeanSigned = average(fieldSigned);
    return {
      electionKey: e.key,
      election: e.name,
      blocA: e.blocA,
      blocB: e.blocB,
      firmPolls: firm.length,
      firmSignedPolls: firmSigned.length,
      firmMeanSigned,
      firmMeanAbs: average(firm.map((p) => p.absMarginError)),
      fieldPolls: field.length,
      fieldSignedPolls: fieldSigned.length,
      fieldMeanSigned,
      fieldMeanAbs: average(field.map((p) => p.absMarginError)),
      difference: firmMeanSigned !== null && fieldMeanSigned !== null ? firmMeanSigned - fieldMeanSigned : null,
    };
  });
}

/** The direction of a signed error in words, e.g. "overstated Blue against Red by 2.1". */
export function leanWords(meanSigned: number | null, blocA: string | null, blocB: string | null, format: (x: number) => string): string {
  if (meanSigned === null) return 'no signed error';
  const a = blocA ?? 'bloc A';
  const b = blocB ?? 'bloc B';
  if (meanSigned === 0) return 'no lean';
  return `${meanSigned > 0 ? 'overstated' : 'understated'} ${a} against ${b} by ${format(Math.abs(meanSigned))}`;
}

export interface HistogramBin {
  label: string;
  /** Lower end (inclusive) and upper end (exclusive; Infinity for the last bin), points. */
  min: number;
  max: number;
  firm: number;
  field: number;
  /** Shares of each group's polls, 0–1. */
  firmShare: number;
  fieldShare: number;
}

/**
 * Counts and shares of absolute margin errors in 1-point bins from 0 up to `top`, with one last
 * open bin `top+`: the firm's used polls against the field's (the firm included).
 */
export function absErrorHistogram(pollsterId: number, fieldPolls: readonly AuditPollDto[], top = 10): HistogramBin[] {
  const field = fieldPolls.filter(computable) as (AuditPollDto & { absMarginError: number })[];
  const firm = field.filter((p) => p.pollsterId === pollsterId);
  const bins: HistogramBin[] = [];
  for (let lo = 0; lo <= top; lo += 1) {
    const hi = lo === top ? Infinity : lo + 1;
    const inBin = (p: { absMarginError: number }) => p.absMarginError >= lo && p.absMarginError < hi;
    const firmCount = firm.filter(inBin).length;
    const fieldCount = field.filter(inBin).length;
    bins.push({
      label: hi === Infinity ? `${lo}+` : `${lo}–${hi}`,
      min: lo,
      max: hi,
      firm: firmCount,
      field: fieldCount,
      firmShare: firm.length ? firmCount / firm.length : 0,
      fieldShare: field.length ? fieldCount / field.length : 0,
    });
  }
  return bins;
}
