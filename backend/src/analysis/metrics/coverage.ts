/**
 * Interval coverage of one poll (METHODS §5, SPEC §4): did the poll's 95%
 * interval hold the certified value? Shares in **points**. The rate over many
 * polls should be near 95% under sampling error alone; published audits find
 * far less. Polls of one contest share error: resample contests, not polls,
 * when putting an interval on a coverage rate.
 */
import { MetricInputError, requirePositive } from '../errors';
import { Z95 } from '../distributions';
import { requirePoints } from './shares';
import { marginSe, shareSe } from './sampling';

/** An interval in points and whether it held the certified value. */
export interface CoverageCheck {
  covered: boolean;
  /** Lower bound in points. */
  lower: number;
  /** Upper bound in points. */
  upper: number;
}

/**
 * Share coverage: is the certified share of A inside p_A ± z·√(p_A(1−p_A)/n_eff)
 * (a Wald interval, as firms state it)? Bounds count as inside.
 *
 * @param pollA - poll share of A, points in [0, 100] (treated as the audit says).
 * @param resultA - certified share of A, points in [0, 100], same treatment.
 * @param nEff - effective sample size, > 0: from the stated MOE when there is
 *   one (`nEffFromStatedMoe`), else n/design effect.
 * @throws {MetricInputError} `pollA`, `resultA` or `nEff`.
 * @returns `{ covered, lower, upper }`, bounds in points (not clamped).
 * @example shareCovered(48, 50.2, 1000) // => { covered: true, lower: 44.90…, upper: 51.09… }
 */
export function shareCovered(pollA: number, resultA: number, nEff: number): CoverageCheck {
  requirePoints('pollA', pollA);
  requirePoints('resultA', resultA);
  requirePositive('nEff', nEff);
  const half = 100 * Z95 * shareSe(pollA / 100, nEff);
  const lower = pollA - half;
  const upper = pollA + half;
  return { covered: resultA >= lower && resultA <= upper, lower, upper };
}

/**
 * Margin coverage: is the certified margin V_A − V_B inside
 * (p_A − p_B) ± z·SE, SE = √([p_A + p_B − (p_A − p_B)²]/n_eff) for one
 * multinomial sample? Bounds count as inside.
 *
 * @param pollA - poll share of A, points; `pollA + pollB` ≤ 100 (+1e-7).
 * @param resultA - certified share of A, points; likewise `resultB`.
 * @param nEff - effective sample size, > 0 (see {@link shareCovered}).
 * @throws {MetricInputError} `pollA`, `pollB` (also when the pair sums past 100), `resultA`, `resultB`, `nEff`.
 * @returns `{ covered, lower, upper }`, bounds of the poll's margin interval in points.
 * @example marginCovered(48, 45, 50, 46, 1000) // => { covered: true, lower: -2.97…, upper: 8.97… }
 */
export function marginCovered(
  pollA: number,
  pollB: number,
  resultA: number,
  resultB: number,
  nEff: number,
): CoverageCheck {
  requirePoints('pollA', pollA);
  requirePoints('pollB', pollB);
  requirePoints('resultA', resultA);
  requirePoints('resultB', resultB);
  requirePositive('nEff', nEff);
  if (pollA + pollB > 100 + 1e-7) throw new MetricInputError('pollB', 'must make pollA + pollB at most 100 points');
  const half = 100 * Z95 * marginSe(Math.min(1, pollA / 100), Math.min(1, pollB / 100), nEff);
  const margin = pollA - pollB;
  const certified = resultA - resultB;
  const lower = margin - half;
  const upper = margin + half;
  return { covered: certified >= lower && certified <= upper, lower, upper };
}
