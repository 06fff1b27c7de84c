/**
 * Contest bias, house effects and the split of error variance into a shared (contest)
 * part, a house (firm) part and noise, all by the method of moments.
 *
 * Model (METHODS §6) for poll j of firm f in contest c: y_j = μ + b_c + h_f + ε_j.
 */
import { MetricInputError, requireFinite } from '../errors';
import { allEqual, groupBy, meanOf, requireKey, sumSquaredDeviations } from './internal';

/** One poll's signed error, as the shared-error functions read it. */
export interface FirmContestError {
  /** Contest the poll measured. */
  readonly contestKey: string;
  /** Polling firm (pollster) that published it. */
  readonly firm: string;
  /** Signed margin error in points, oriented by the election's blocs. */
  readonly error: number;
}

/** Estimated bias of one contest. */
export interface ContestBias {
  readonly contestKey: string;
  /** Polls in the contest. */
  readonly k: number;
  /** b̂_c: mean signed error of the contest's polls (points). */
  readonly bias: number;
}

/** Estimated house effect of one firm. */
export interface HouseEffect {
  readonly firm: string;
  /** The firm's polls. */
  readonly polls: number;
  /** Distinct contests the firm polled. */
  readonly contests: number;
  /** Mean over the firm's polls of y_j − b̂_c, with b̂_c from all polls (points). */
  readonly plain: number;
  /**
   * Mean over the firm's polls of y_j − b̂_c^(−f), with b̂_c^(−f) the mean of the other firms'
   * polls in the contest (points). Polls in contests no other firm polled drop out; null when
   * none is left.
   */
  readonly leaveOneOut: number | null;
  /** Polls that entered `leaveOneOut`. */
  readonly leaveOneOutPolls: number;
}

/** Result of {@link contestBiasAndHouseEffects}; both lists in key order. */
export interface ContestBiasAndHouseEffects {
  readonly contestBias: readonly ContestBias[];
  readonly houseEffects: readonly HouseEffect[];
}

/** Checks a list of firm/contest errors; shared by several modules. */
export function validateFirmContestErrors(
  polls: readonly FirmContestError[],
  parameter = 'polls',
): void {
  if (!Array.isArray(polls) || polls.length === 0) {
    throw new MetricInputError(parameter, 'must hold at least 1 poll');
  }
  polls.forEach((p, i) => {
    if (typeof p.contestKey === 'string' && p.contestKey.length > 0 && typeof p.firm === 'string' && p.firm.length > 0 && Number.isFinite(p.error)) return; // names are built only on failure
    requireKey(`${parameter}[${i}].contestKey`, p.contestKey);
    requireKey(`${parameter}[${i}].firm`, p.firm);
    requireFinite(`${parameter}[${i}].error`, p.error);
  });
}

/**
 * Contest bias b̂_c and house effects, plain and leave-one-out, by the method of moments.
 *
 * b̂_c = mean error of contest c's polls. A firm's plain house effect is the mean of its
 * residuals y_j − b̂_c. The leave-one-out house effect uses b̂_c^(−f), the mean of the polls
 * of contest c by firms other than f (all of f's polls in c are left out, so a firm with two
 * polls in a contest does not partly explain itself); this removes the pull of the firm's own
 * polls on b̂_c, which shrinks plain house effects toward zero by about 1 − 1/k_c. Positive
 * house effect: the firm overstated A more than the other polls of the same contests.
 *
 * @param polls at least 1 poll with non-empty `contestKey` and `firm` and a finite `error`.
 * @throws MetricInputError naming `polls` (empty) or `polls[i].<field>`.
 * @returns contest biases (contest key order) and house effects (firm order).
 * @example
 * // c1 (F1 3.0, F2 1.5, F3 2.4), c2 (F1 0.5, F2 −1.0, F3 0.2, F4 −0.6), c3 (F1 2.2, F3 1.9,
 * // F4 0.4), c4 (F2 −2.5, F3 −1.1, F4 −2.0)
 * // → bias 2.3, −0.225, 1.5, −1.866667; F1 plain 0.708333, leave-one-out 1.022222
 */
export function contestBiasAndHouseEffects(
  polls: readonly FirmContestError[],
): ContestBiasAndHouseEffects {
  validateFirmContestErrors(polls);
  const byContest = groupBy(polls, (p) => p.contestKey);
  const bias = new Map<string, number>();
  const contestBias: ContestBias[] = [];
  for (const [contestKey, rows] of byContest) {
    const b = meanOf(rows.map((r) => r.error));
    bias.set(contestKey, b);
    contestBias.push({ contestKey, k: rows.length, bias: b });
  }

  const houseEffects: HouseEffect[] = [];
  for (const [firm, rows] of groupBy(polls, (p) => p.firm)) {
    const plainResiduals = rows.map((r) => r.error - (bias.get(r.contestKey) as number));
    const looResiduals: number[] = [];
    for (const r of rows) {
      const others = (byContest.get(r.contestKey) as FirmContestError[]).filter((o) => o.firm !== firm);
      if (others.length > 0) looResiduals.push(r.error - meanOf(others.map((o) => o.error)));
    }
    houseEffects.push({
      firm,
      polls: rows.length,
      contests: new Set(rows.map((r) => r.contestKey)).size,
      plain: meanOf(plainResiduals),
      leaveOneOut: looResiduals.length > 0 ? meanOf(looResiduals) : null,
      leaveOneOutPolls: looResiduals.length,
    });
  }
  return { contestBias, houseEffects };
}

/** Variance components in points² (raw moment estimates, possibly negative). */
export interface VarianceComponents {
  /** σ_b²: variance of the contest (shared) component b_c. */
  readonly shared: number;
  /** σ_h²: variance of house effects h_f. */
  readonly house: number;
  /** σ_ε²: variance of the remaining poll-level noise ε_j. */
  readonly noise: number;
}

/** Result of {@link varianceDecomposition}. */
export interface VarianceDecomposition {
  /** Estimator used: pairwise-difference method of moments. */
  readonly estimator: 'pairwise-moments';
  /** Raw moment estimates (points²); a negative value means "no evidence of that component". */
  readonly components: VarianceComponents;
  /**
   * Shares of the total, each component truncated at 0 first: shared + house + noise = 1.
   */
  readonly shares: VarianceComponents;
  /** Number of poll pairs behind each moment: same contest/other firm, same firm/other
   * contest, different contest and firm. */
  readonly pairs: { readonly sameContest: number; readonly sameFirm: number; readonly neither: number };
}

interface PairSums {
  /** Σ over pairs i < j inside the group of (y_i − y_j)². */
  readonly squares: number;
  /** Number of pairs inside the group. */
  readonly count: number;
}

/** Σ_{i<j}(y_i − y_j)² = n·Σ(y − ȳ)², summed over groups, with the number of pairs. */
function pairSums(groups: Iterable<readonly number[]>): PairSums {
  let squares = 0;
  let count = 0;
  for (const g of groups) {
    squares += g.length * sumSquaredDeviations(g);
    count += (g.length * (g.length - 1)) / 2;
  }
  return { squares, count };
}

/**
 * Splits the variance of poll errors into a shared contest part, a house part and noise.
 *
 * Under y_j = μ + b_c + h_f + ε_j with independent components of variances σ_b², σ_h², σ_ε²,
 * half the expected squared difference of two polls is
 *   D₁ = σ_h² + σ_ε²          for polls of the same contest by different firms,
 *   D₂ = σ_b² + σ_ε²          for polls of the same firm in different contests,
 *   D₃ = σ_b² + σ_h² + σ_ε²   for polls differing in both contest and firm.
 * Replacing each expectation by the average of ½(y_i − y_j)² over all such pairs and solving
 * gives the moment estimates σ̂_b² = D₃ − D₁, σ̂_h² = D₃ − D₂, σ̂_ε² = D₁ + D₂ − D₃. Pairs of
 * polls by the same firm in the same contest are not used. The sums over pairs are computed
 * in O(N) from within-group sums of squares by inclusion–exclusion (contest, firm, cell).
 * Shares: each estimate is truncated at 0, then divided by the sum of the truncated estimates.
 * The overall mean error μ is not part of the split (see the clustered mean for it).
 *
 * @param polls errors with contest and firm keys (see {@link FirmContestError}).
 * @throws MetricInputError naming `polls` when empty, when all errors are equal, or when a
 *   pair class is empty: no contest polled by 2 firms, no firm that polled 2 contests, or no
 *   two polls that differ in both contest and firm.
 * @returns raw components (points², may be negative), shares in [0, 1] summing to 1, pair counts.
 * @example
 * // the four-contest example of contestBiasAndHouseEffects
 * // → components shared 3.445396, house 1.575063, noise −0.981396 (15, 15 and 48 pairs);
 * //   shares shared 0.686271, house 0.313729, noise 0 (the negative noise estimate is truncated)
 */
export function varianceDecomposition(polls: readonly FirmContestError[]): VarianceDecomposition {
  validateFirmContestErrors(polls);
  const errors = polls.map((p) => p.error);
  if (allEqual(errors)) throw new MetricInputError('polls', 'has zero variance');

  const values = (rows: readonly FirmContestError[]) => rows.map((r) => r.error);
  const all = pairSums([errors]);
  const contest = pairSums([...groupBy(polls, (p) => p.contestKey).values()].map(values));
  const firm = pairSums([...groupBy(polls, (p) => p.firm).values()].map(values));
  const cell = pairSums(
    [...groupBy(polls, (p) => JSON.stringify([p.contestKey, p.firm])).values()].map(values),
  );

  const sameContestPairs = contest.count - cell.count;
  const sameFirmPairs = firm.count - cell.count;
  const neitherPairs = all.count - contest.count - firm.count + cell.count;
  if (sameContestPairs === 0) {
    throw new MetricInputError('polls', 'must include a contest polled by at least 2 firms');
  }
  if (sameFirmPairs === 0) {
    throw new MetricInputError('polls', 'must include a firm that polled at least 2 contests');
  }
  if (neitherPairs === 0) {
    throw new MetricInputError('polls', 'must include two polls that differ in both contest and firm');
  }
  const d1 = (contest.squares - cell.squares) / sameContestPairs / 2;
  const d2 = (firm.squares - cell.squares) / sameFirmPairs / 2;
  const d3 = (all.squares - contest.squares - firm.squares + cell.squares) / neitherPairs / 2;

  const components = { shared: d3 - d1, house: d3 - d2, noise: d1 + d2 - d3 };
  const kept = {
    shared: Math.max(0, components.shared),
    house: Math.max(0, components.house),
    noise: Math.max(0, components.noise),
  };
  const total = kept.shared + kept.house + kept.noise;
  if (!(total > 0)) throw new MetricInputError('polls', 'has no positive variance component');
  return {
    estimator: 'pairwise-moments',
    components,
    shares: { shared: kept.shared / total, house: kept.house / total, noise: kept.noise / total },
    pairs: { sameContest: sameContestPairs, sameFirm: sameFirmPairs, neither: neitherPairs },
  };
}
