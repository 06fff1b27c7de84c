import { escapeHtml } from './format';

/** One row of an interval chart: a point estimate and its interval, in points. */
export interface IntervalRow {
  label: string;
  value: number | null;
  lo: number | null;
  hi: number | null;
}

const WIDTH = 640;
const LABEL_RIGHT = 176;
const PLOT_LEFT = 186;
const PLOT_RIGHT = 622;
const ROW = 24;
const TOP = 12;
const AXIS = 34;
const INK = '#334155';
const GRID = '#cbd5e1';
const ACCENT = '#0f5f63';

const finite = (x: number | null): x is number => x !== null && Number.isFinite(x);

/** Round tick values covering [lo, hi]: steps of 1, 2 or 5 times a power of ten. */
export function niceTicks(lo: number, hi: number, target = 6): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks: number[] = [];
  for (let t = Math.ceil(lo / step) * step; t <= hi + step * 1e-9; t += step) ticks.push(Number(t.toFixed(10)));
  return ticks;
}

/**
 * A horizontal dot-and-interval chart as plain SVG (lines, circles and text only, so the sanitiser
 * keeps it and the PDF writer can draw it). A dashed line marks zero. Rows without a value are
 * listed with "no value" rather than dropped.
 */
export function intervalChartSvg(rows: readonly IntervalRow[], options: { label: string; axisLabel: string }): string {
  const values = rows.flatMap((r) => [r.value, r.lo, r.hi]).filter(finite);
  let lo = Math.min(0, ...values);
  let hi = Math.max(0, ...values);
  if (hi - lo < 1e-9) {
    lo -= 1;
    hi += 1;
  }
  const pad = (hi - lo) * 0.05;
  lo -= pad;
  hi += pad;
  const x = (v: number) => PLOT_LEFT + ((v - lo) / (hi - lo)) * (PLOT_RIGHT - PLOT_LEFT);
  const height = TOP + rows.length * ROW + AXIS;
  const axisY = TOP + rows.length * ROW + 4;
  const f = (v: number) => v.toFixed(1);
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" class="vc-chart" viewBox="0 0 ${WIDTH} ${height}" width="${WIDTH}" height="${height}" role="img" aria-label="${escapeHtml(options.label)}">`);
  parts.push(`<title>${escapeHtml(options.label)}</title>`);
  for (const t of niceTicks(lo, hi)) {
    parts.push(`<line x1="${f(x(t))}" y1="${TOP - 4}" x2="${f(x(t))}" y2="${axisY}" stroke="${GRID}" stroke-width="1"></line>`);
    parts.push(`<text x="${f(x(t))}" y="${axisY + 14}" font-size="11" text-anchor="middle" fill="${INK}">${escapeHtml(String(t))}</text>`);
  }
  parts.push(`<line x1="${f(x(0))}" y1="${TOP - 4}" x2="${f(x(0))}" y2="${axisY}" stroke="${INK}" stroke-width="1" stroke-dasharray="4 3"></line>`);
  parts.push(`<line x1="${PLOT_LEFT}" y1="${axisY}" x2="${PLOT_RIGHT}" y2="${axisY}" stroke="${INK}" stroke-width="1"></line>`);
  parts.push(`<text x="${(PLOT_LEFT + PLOT_RIGHT) / 2}" y="${axisY + 28}" font-size="11" text-anchor="middle" fill="${INK}">${escapeHtml(options.axisLabel)}</text>`);
  rows.forEach((r, i) => {
    const cy = TOP + i * ROW + ROW / 2;
    const label = r.label.length > 28 ? `${r.label.slice(0, 27)}…` : r.label;
    parts.push(`<text x="${LABEL_RIGHT}" y="${f(cy + 4)}" font-size="12" text-anchor="end" fill="${INK}">${escapeHtml(label)}</text>`);
    if (finite(r.lo) && finite(r.hi)) {
      parts.push(`<line x1="${f(x(r.lo))}" y1="${f(cy)}" x2="${f(x(r.hi))}" y2="${f(cy)}" stroke="${ACCENT}" stroke-width="2"></line>`);
    }
    if (finite(r.value)) parts.push(`<circle cx="${f(x(r.value))}" cy="${f(cy)}" r="4" fill="${ACCENT}"></circle>`);
    else parts.push(`<text x="${PLOT_LEFT + 4}" y="${f(cy + 4)}" font-size="11" fill="${INK}">no value</text>`);
  });
  parts.push('</svg>');
  return parts.join('');
}
