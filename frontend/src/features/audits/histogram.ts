/** Histogram bins for signed errors, chosen here so the chart and its table agree. */

export interface HistogramBin {
  /** Inclusive lower edge. */
  lower: number;
  /** Exclusive upper edge. */
  upper: number;
  count: number;
}

function extent(values: readonly number[]): [number, number] {
  let min = Infinity;
  let max = -Infinity;
  for (const value of values) {
    if (value < min) min = value;
    if (value > max) max = value;
  }
  return [min, max];
}

const NICE_WIDTHS = [0.1, 0.2, 0.25, 0.5, 1, 2, 2.5, 5, 10, 20, 25, 50, 100] as const;

/**
 * The smallest "nice" width that spreads the values over at most `maxBins` bins, aiming at about
 * √n bins (at least 5) so a few dozen polls do not scatter into single counts.
 */
export function chooseBinWidth(values: readonly number[], maxBins = 25): number {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return 1;
  const [min, max] = extent(finite);
  const range = max - min;
  if (range === 0) return 1;
  const target = Math.min(maxBins, Math.max(5, Math.ceil(Math.sqrt(finite.length))));
  return NICE_WIDTHS.find((width) => range / width <= target) ?? NICE_WIDTHS[NICE_WIDTHS.length - 1]!;
}

function edge(value: number): number {
  // Keeps edges like 0.30000000000000004 printable as 0.3.
  return Math.round(value * 1e9) / 1e9;
}

/**
 * Counts values into equal-width bins whose edges are multiples of `width`, lower edge included,
 * upper edge excluded. Empty bins inside the range are kept (a gap is information); non-finite
 * values are skipped. Returns `[]` for no values.
 */
export function binValues(values: readonly number[], width = chooseBinWidth(values)): HistogramBin[] {
  if (!(width > 0) || !Number.isFinite(width)) throw new RangeError('width must be a positive number');
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return [];
  const [min, max] = extent(finite);
  const start = Math.floor(edge(min / width)) * width;
  const indexOf = (value: number) => Math.floor(edge((value - start) / width));
  const count = indexOf(max) + 1;
  const bins: HistogramBin[] = Array.from({ length: count }, (_, i) => ({
    lower: edge(start + i * width),
    upper: edge(start + (i + 1) * width),
    count: 0,
  }));
  for (const value of finite) bins[indexOf(value)]!.count += 1;
  return bins;
}
