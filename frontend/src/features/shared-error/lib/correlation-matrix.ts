import type { FirmPairDto } from '../types';
import { isNum } from './format';

export type CorrelationMeasure = 'raw' | 'adjusted';

export interface MatrixCell {
  /** Firms of the row and the column. */
  row: string;
  column: string;
  /** Pearson r (raw or after removing the other firms' contest bias); null when not computed. */
  r: number | null;
  p: number | null;
  /** Common contests behind r. */
  n: number;
  /** Why r is missing, in plain words; null when it was computed. */
  note: string | null;
  diagonal: boolean;
}

export interface CorrelationMatrix {
  firms: string[];
  /** Row-major: cells[i * firms.length + j]. */
  cells: MatrixCell[];
  /** Pairs of distinct firms, and how many of them had r computed. */
  pairCount: number;
  computedCount: number;
}

const pairKey = (a: string, b: string) => JSON.stringify(a < b ? [a, b] : [b, a]);

/** A symmetric firm-by-firm matrix from the list of pairs; firms in alphabetical order. */
export function correlationMatrix(pairs: readonly FirmPairDto[], measure: CorrelationMeasure): CorrelationMatrix {
  const list = Array.isArray(pairs) ? pairs : [];
  const firms = [...new Set(list.flatMap((p) => [p.a, p.b]))].sort((x, y) => x.localeCompare(y));
  const byKey = new Map(list.map((p) => [pairKey(p.a, p.b), p]));
  const cells: MatrixCell[] = [];
  let computedCount = 0;
  for (const row of firms) {
    for (const column of firms) {
      if (row === column) {
        cells.push({ row, column, r: null, p: null, n: 0, note: null, diagonal: true });
        continue;
      }
      const pair = byKey.get(pairKey(row, column));
      const r = measure === 'raw' ? pair?.pearson : pair?.pearsonAdjusted;
      const p = measure === 'raw' ? pair?.pearsonP : pair?.pearsonAdjustedP;
      const n = measure === 'raw' ? (pair?.n ?? 0) : (pair?.nAdjusted ?? 0);
      const ok = isNum(r);
      cells.push({
        row,
        column,
        r: ok ? r : null,
        p: isNum(p) ? p : null,
        n,
        note: ok ? null : (pair?.note ?? (pair ? 'not computed' : 'these firms polled no contest in common')),
        diagonal: false,
      });
    }
  }
  for (const p of list) if (isNum(measure === 'raw' ? p.pearson : p.pearsonAdjusted)) computedCount += 1;
  return { firms, cells, pairCount: list.length, computedCount };
}

/** A colour step 0–4 for |r| (0 below 0.2, then every 0.2); the sign picks the hue. */
export function correlationStep(r: number): 0 | 1 | 2 | 3 | 4 {
  const a = Math.abs(r);
  return a < 0.2 ? 0 : a < 0.4 ? 1 : a < 0.6 ? 2 : a < 0.8 ? 3 : 4;
}
