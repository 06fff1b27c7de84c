/**
 * Checks the core against reference-data/metrics/reference.json, computed
 * independently by reference-data/metrics/make_reference.py ([computed]: numpy
 * 1.24.2, scipy 1.10.1, statsmodels 0.13.5 on Python 3.11.2; each case lists the
 * exact calls in its `calls` field and the versions are in the file's `versions`).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import * as metrics from './index';

interface ReferenceCase {
  kind: string;
  name: string;
  inputs: Record<string, unknown>;
  expected: Record<string, unknown>;
  calls: string[];
}
interface ReferenceFile {
  versions: Record<string, string>;
  z95: number;
  tolerance: number;
  cases: ReferenceCase[];
}

const file = JSON.parse(
  readFileSync(new URL('../../../../reference-data/metrics/reference.json', import.meta.url), 'utf8'),
) as ReferenceFile;
const tol = file.tolerance;

/** Every expected field must match: numbers within tolerance (relative for tiny p-values), the rest exactly. */
function compare(actual: unknown, expected: unknown, path: string): void {
  if (typeof expected === 'number') {
    expect(typeof actual, path).toBe('number');
    const a = actual as number;
    const diff = Math.abs(a - expected);
    expect(diff <= tol * Math.max(1, Math.abs(expected)), `${path}: ${a} vs ${expected}`).toBe(true);
    if (expected !== 0) expect(diff / Math.abs(expected) <= 1e-6, `${path} relative: ${a} vs ${expected}`).toBe(true);
  } else if (expected !== null && typeof expected === 'object' && !Array.isArray(expected)) {
    expect(actual, path).toBeTypeOf('object');
    const rec = actual as Record<string, unknown>;
    expect(Object.keys(rec).sort(), `${path} keys`).toEqual(Object.keys(expected).sort());
    for (const [k, v] of Object.entries(expected)) compare(rec[k], v, `${path}.${k}`);
  } else {
    expect(actual, path).toEqual(expected);
  }
}

function run(c: ReferenceCase): unknown {
  /** The JSON is trusted test data: read a field as the type the function expects. */
  const i = <T>(key: string): T => c.inputs[key] as T;
  switch (c.kind) {
    case 'wilson':
      return metrics.wilsonInterval(i<number>('x'), i<number>('n'));
    case 'sampling':
      return {
        shareMoe: metrics.shareMoe(i<number>('pA'), i<number>('n')),
        marginSe: metrics.marginSe(i<number>('pA'), i<number>('pB'), i<number>('n')),
        marginMoe: metrics.marginMoe(i<number>('pA'), i<number>('pB'), i<number>('n')),
      };
    case 'kish':
      return metrics.kishDesignEffect(i<number[]>('weights'));
    case 'nEffFromStatedMoe':
      return { nEff: metrics.nEffFromStatedMoe(i<number>('moePts')) };
    case 'mtk':
      return metrics.mtkAccuracy(c.inputs as unknown as metrics.MtkInput);
    case 'mtkMean':
      return metrics.mtkMean(i<number[]>('values'));
    case 'ae':
      return metrics.aeAccuracy(i<metrics.Shares>('poll'), i<metrics.Shares>('result'), i<number>('n'));
    case 'poll':
      return metrics.computePollMetrics(
        i<metrics.PollInput>('poll'),
        i<metrics.PollContestInput>('contest'),
        i<metrics.PollMetricSettings>('settings'),
      );
    default:
      throw new Error(`unknown reference case kind ${c.kind}`);
  }
}

describe('reference.json (independent Python computations)', () => {
  it('was made with the recorded library versions and the same z', () => {
    expect(file.versions).toMatchObject({ numpy: '1.24.2', scipy: '1.10.1' });
    expect(Math.abs(file.z95 - metrics.shareMoe(0.5, 1) / 0.5)).toBeLessThan(1e-12);
    expect(file.cases.length).toBeGreaterThanOrEqual(10);
  });

  for (const c of file.cases) {
    it(`${c.kind}: ${c.name}`, () => {
      const actual = run(c) as Record<string, unknown>;
      for (const [key, value] of Object.entries(c.expected)) compare(actual[key], value, key);
    });
  }
});
