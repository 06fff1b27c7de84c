import type { Interval } from '../api/types';

export interface IntervalBarProps {
  /** The point estimate; drawn as a dot. */
  estimate: number | null;
  interval: Interval | null;
  /** The scale shared by every bar of a column, so bars can be compared by eye. */
  domain: Interval;
  /** Read out instead of the picture, e.g. "Excess error −0.1 points, 95% interval −1.6 to 0.4". */
  label: string;
  /** A value marked by a dashed rule (0 for an error; none for ranks). */
  reference?: number;
  width?: number;
  height?: number;
}

const PAD = 4;

/** Horizontal position of `value` in a bar `width` pixels wide over `domain`, clamped to the bar. */
export function intervalBarX(value: number, domain: Interval, width: number): number {
  const [lo, hi] = domain;
  const span = hi - lo || 1;
  const x = PAD + ((value - lo) / span) * (width - 2 * PAD);
  return Math.min(width - PAD, Math.max(PAD, x));
}

/**
 * A small inline picture of an estimate and its interval on a scale shared by its column: the line
 * is the interval, the dot the estimate. Announced as one image with its numbers in words.
 */
export function IntervalBar({ estimate, interval, domain, label, reference, width = 120, height = 18 }: IntervalBarProps) {
  const mid = height / 2;
  return (
    <svg role="img" aria-label={label} width={width} height={height} viewBox={`0 0 ${width} ${height}`} className="shrink-0 overflow-visible">
      <line x1={PAD} x2={width - PAD} y1={mid} y2={mid} className="stroke-ink-200" strokeWidth={1} />
      {reference !== undefined && reference >= domain[0] && reference <= domain[1] && (
        <line
          data-part="reference"
          x1={intervalBarX(reference, domain, width)}
          x2={intervalBarX(reference, domain, width)}
          y1={1}
          y2={height - 1}
          className="stroke-ink-500"
          strokeDasharray="2 2"
          strokeWidth={1}
        />
      )}
      {interval && (
        <g data-part="interval" className="stroke-accent-700" strokeWidth={2} strokeLinecap="round">
          <line x1={intervalBarX(interval[0], domain, width)} x2={intervalBarX(interval[1], domain, width)} y1={mid} y2={mid} />
          <line x1={intervalBarX(interval[0], domain, width)} x2={intervalBarX(interval[0], domain, width)} y1={mid - 4} y2={mid + 4} />
          <line x1={intervalBarX(interval[1], domain, width)} x2={intervalBarX(interval[1], domain, width)} y1={mid - 4} y2={mid + 4} />
        </g>
      )}
      {estimate !== null && (
        <circle data-part="estimate" cx={intervalBarX(estimate, domain, width)} cy={mid} r={3.5} className="fill-accent-900 stroke-white" strokeWidth={1} />
      )}
    </svg>
  );
}

/** A domain that holds every given value and interval (and `include`), padded by 5% each side. */
export function sharedDomain(values: readonly (number | null)[], intervals: readonly (Interval | null)[], include: number[] = []): Interval {
  const all = [
    ...values.filter((v): v is number => v !== null && Number.isFinite(v)),
    ...intervals.flatMap((i) => (i ? [i[0], i[1]] : [])).filter((v) => Number.isFinite(v)),
    ...include,
  ];
  if (all.length === 0) return [0, 1];
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  const pad = (hi - lo || 1) * 0.05;
  return [lo - pad, hi + pad];
}
