import { describe, expect, it } from 'vitest';
import { buildSharedMissAnalysis } from '../testing';
import { correlationMatrix, correlationStep } from './correlation-matrix';

describe('correlationMatrix', () => {
  const pairs = buildSharedMissAnalysis().pairs;

  it('is square, symmetric and has an empty diagonal', () => {
    const m = correlationMatrix(pairs, 'raw');
    expect(m.firms).toEqual(['=Cedar Research', 'Alder Polling', 'Birch Surveys']);
    expect(m.cells).toHaveLength(9);
    const at = (i: number, j: number) => m.cells[i * m.firms.length + j];
    for (let i = 0; i < 3; i += 1) {
      expect(at(i, i)?.diagonal).toBe(true);
      for (let j = 0; j < 3; j += 1) expect(at(i, j)?.r).toBe(at(j, i)?.r ?? null);
    }
    expect(at(0, 1)?.r).toBe(0.71);
    expect(at(0, 1)?.n).toBe(6);
  });

  it('keeps the reason and the count of common contests when r is missing', () => {
    const m = correlationMatrix(pairs, 'raw');
    const cell = m.cells.find((c) => c.row === 'Alder Polling' && c.column === 'Birch Surveys');
    expect(cell?.r).toBeNull();
    expect(cell?.n).toBe(2);
    expect(cell?.note).toBe('only 2 common contests; at least 5 are needed');
    expect(m.pairCount).toBe(2);
    expect(m.computedCount).toBe(1);
  });

  it('switches to the correlation with contest bias removed', () => {
    const m = correlationMatrix(pairs, 'adjusted');
    expect(m.cells.find((c) => c.row === 'Alder Polling' && c.column === '=Cedar Research')?.r).toBe(-0.35);
  });

  it('copes with no pairs at all', () => {
    expect(correlationMatrix([], 'raw')).toEqual({ firms: [], cells: [], pairCount: 0, computedCount: 0 });
  });
});

describe('correlationStep', () => {
  it('steps every 0.2 of |r|, whatever the sign', () => {
    // [practice] five colour steps over |r| in [0, 1]
    expect([0, 0.19, 0.2, 0.45, 0.6, 0.79, 0.8, 1].map(correlationStep)).toEqual([0, 0, 1, 2, 3, 3, 4, 4]);
    expect(correlationStep(-0.65)).toBe(3);
  });
});
