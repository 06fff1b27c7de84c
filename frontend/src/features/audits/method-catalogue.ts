/**
 * Every formula Veracast shows, with the one line that says what it measures and where it comes
 * from (METHODS.md §1–7). The methods page lists them; each figure links to its entry by `anchor`.
 */

export type SourceKind = 'published' | 'memory' | 'practice';

export interface MethodSource {
  kind: SourceKind;
  citation: string;
}

export interface MethodEntry {
  /** The id on the methods page: `/methods#<anchor>`. */
  anchor: string;
  name: string;
  /** What it measures, in one line. */
  measures: string;
  /** The formula in plain text; proportions unless it says points (pts). */
  formula: string[];
  /** Unit and sign convention. */
  unit: string;
  notes?: string[];
  sources: MethodSource[];
}

export interface MethodSection {
  id: string;
  title: string;
  entries: MethodEntry[];
}

export const METHOD_ANCHORS = {
  marginError: 'margin-error',
  absMarginError: 'abs-margin-error',
  meanSignedError: 'mean-signed-error',
  lean: 'lean',
  referencePair: 'reference-pair',
  winnerCalled: 'winner-called',
  twoPartyShareError: 'two-party-share-error',
  undecided: 'undecided-treatment',
  mosteller3: 'mosteller-3',
  mosteller5: 'mosteller-5',
  mtkA: 'mtk-a',
  multiOptionB: 'multi-option-b',
  shareMoe: 'share-moe',
  marginMoe: 'margin-moe',
  designEffect: 'design-effect',
  effectiveN: 'effective-n',
  wilson: 'wilson-interval',
  coverage: 'coverage',
  daysOut: 'days-out',
  window: 'window',
  finalPoll: 'final-poll',
  minPolls: 'min-polls',
  dataHash: 'data-hash',
  contestBias: 'contest-bias',
  dersimonianLaird: 'dersimonian-laird',
  icc: 'icc',
  effectivePolls: 'effective-polls',
  clusteredMean: 'clustered-mean',
  firmCorrelation: 'firm-correlation',
  normality: 'normality',
  excessError: 'excess-error',
  shrinkage: 'shrinkage',
  rankInterval: 'rank-interval',
} as const;
export type MethodAnchor = (typeof METHOD_ANCHORS)[keyof typeof METHOD_ANCHORS];

const A = METHOD_ANCHORS;

export const METHOD_SECTIONS: MethodSection[] = [
  {
    id: 'errors',
    title: 'Margin error, lean and winner called',
    entries: [
      {
        anchor: A.marginError,
        name: 'Signed margin error',
        measures: 'How far the poll’s lead of A over B was from the certified lead.',
        formula: ['e = (p_A − p_B) − (V_A − V_B)'],
        unit: 'Points. Positive: the poll overstated A; negative: it overstated B.',
        notes: [
          'p are the poll’s shares (after the audit’s undecided treatment), V the certified shares: votes over the sum of all options’ votes.',
          'A stated margin of error covers the sampling error of one share; the margin’s is about twice as large.',
        ],
        sources: [{ kind: 'practice', citation: 'Margin error as used in pollster post-mortems; Veracast SPEC §4.' }],
      },
      {
        anchor: A.absMarginError,
        name: 'Absolute margin error',
        measures: 'The size of the miss on the lead, whichever side it favoured.',
        formula: ['|e| = |(p_A − p_B) − (V_A − V_B)|'],
        unit: 'Points, 0 or more.',
        notes: ['When A and B are the certified top two this is Mosteller’s measure 5.'],
        sources: [{ kind: 'published', citation: 'Mosteller et al. (1949), The Pre-election Polls of 1948, SSRC (measure 5).' }],
      },
      {
        anchor: A.meanSignedError,
        name: 'Mean signed error across polls',
        measures: 'Whether the polls as a group leaned to one bloc, with a 95% interval that allows for polls of one contest sharing error.',
        formula: [
          'ē = mean of e over the used polls oriented by bloc',
          'interval: ē ± t(G−1) · SE_CR1, contests as clusters (see clustered mean)',
        ],
        unit: 'Points. The direction is named by bloc: positive means bloc A was overstated.',
        notes: [
          'Orient by bloc, never by who won: otherwise the sign only says “overstated the winner”.',
          'Polls whose contest lacks both orientation blocs are left out of this mean.',
        ],
        sources: [
          { kind: 'memory', citation: 'Cameron & Miller (2015), Journal of Human Resources 50:317–372 (cluster-robust variance).' },
        ],
      },
      {
        anchor: A.lean,
        name: 'Lean',
        measures: 'Which side of the reference pair a poll overstated.',
        formula: ['lean = A if e > 0, B if e < 0, none if e = 0'],
        unit: 'A, B or none.',
        sources: [{ kind: 'practice', citation: 'Veracast SPEC §4.' }],
      },
      {
        anchor: A.referencePair,
        name: 'Reference pair (A, B)',
        measures: 'Which two options a contest’s margin is taken between, so that signs mean the same thing across contests.',
        formula: [
          'A, B = the election’s two orientation blocs, when both stand in the contest',
          'otherwise the top two options by certified votes, A the winner',
        ],
        unit: 'Option keys.',
        notes: ['An election’s orientation blocs default to the two blocs with the most certified votes over its contests (A the larger); a reviewer may set them.'],
        sources: [{ kind: 'practice', citation: 'Veracast SPEC §4.' }],
      },
      {
        anchor: A.winnerCalled,
        name: 'Winner called',
        measures: 'Whether the poll’s leader was the certified winner.',
        formula: ['called = sign(p_a − p_b) = sign(V_a − V_b), a and b the certified top two', 'a tie in the poll is “no call”'],
        unit: 'Yes, no or no call. Rates leave no-call polls out and say how many there were.',
        notes: ['A poll is not a forecast: it measures opinion during its fieldwork, and late movement is real change.'],
        sources: [{ kind: 'practice', citation: 'Veracast SPEC §4, METHODS §1.' }],
      },
      {
        anchor: A.twoPartyShareError,
        name: 'Two-party share error',
        measures: 'The miss on A’s share of the votes for A and B only.',
        formula: ['100 · [p_A/(p_A + p_B) − V_A/(V_A + V_B)]', 'the two-party margin error is twice it'],
        unit: 'Points. Positive: the poll overstated A.',
        sources: [{ kind: 'practice', citation: 'Used in academic error models of two-candidate races; METHODS §1.' }],
      },
      {
        anchor: A.undecided,
        name: 'Undecided treatment',
        measures: 'How respondents who named no option are handled before errors are computed.',
        formula: [
          'raw: shares as published (the default)',
          'proportional: p_i ← p_i / (1 − u) over the named options; the margin scales by 1/(1 − u)',
          'two_party: q = p_A/(p_A + p_B), the same for the result; third options drop out',
        ],
        unit: 'A setting of every audit. Never compare errors made under different treatments.',
        sources: [
          { kind: 'practice', citation: 'Raw margin error in association post-mortems; two-party shares in academic error models.' },
        ],
      },
    ],
  },
  {
    id: 'accuracy',
    title: 'Accuracy measures',
    entries: [
      {
        anchor: A.mosteller3,
        name: 'Mosteller’s measure 3',
        measures: 'The average miss on each option’s share.',
        formula: ['M3 = mean over the scored set S of |p_i − V_i|', 'S = every option with a share on both sides; undecided never'],
        unit: 'Points, 0 or more.',
        sources: [{ kind: 'published', citation: 'Mosteller et al. (1949), The Pre-election Polls of 1948, SSRC.' }],
      },
      {
        anchor: A.mosteller5,
        name: 'Mosteller’s measure 5',
        measures: 'The miss on the lead between the certified top two.',
        formula: ['M5 = |(p_a − p_b) − (V_a − V_b)|, a and b the certified top two'],
        unit: 'Points, 0 or more.',
        sources: [{ kind: 'published', citation: 'Mosteller et al. (1949), The Pre-election Polls of 1948, SSRC.' }],
      },
      {
        anchor: A.mtkA,
        name: 'Predictive accuracy A',
        measures: 'The log of how much the poll’s odds of A over B differed from the certified odds.',
        formula: [
          'A = ln[(p_A/p_B) / (V_A/V_B)]',
          'Var(A) ≈ 1/(n·p_A) + 1/(n·p_B); z = A/SE; 95% interval A ± 1.96·SE',
        ],
        unit: 'No unit. 0 is perfect; positive leans to A. Unchanged by proportional reallocation of undecided.',
        notes: ['With a design effect the sample size is n/deff.'],
        sources: [{ kind: 'published', citation: 'Martin, Traugott & Kennedy (2005), Public Opinion Quarterly 69:342–369.' }],
      },
      {
        anchor: A.multiOptionB,
        name: 'Multi-option accuracy B and B_w',
        measures: 'The average log-odds miss over every named option, for contests with more than two.',
        formula: [
          'A′_i = ln[(p_i/(1 − p_i)) / (V_i/(1 − V_i))], shares rescaled to sum to 1 over named options',
          'B = (1/k) · Σ |A′_i|;  B_w = Σ V_i · |A′_i|',
          'Var(A′_i) = 1/(n · p_i · (1 − p_i))',
        ],
        unit: 'No unit, 0 or more. Undecided is not a category; empty categories are merged.',
        sources: [{ kind: 'published', citation: 'Arzheimer & Evans (2014), Political Analysis 22:31–44.' }],
      },
    ],
  },
  {
    id: 'sampling',
    title: 'Sampling error, intervals and coverage',
    entries: [
      {
        anchor: A.shareMoe,
        name: 'Margin of error of a share',
        measures: 'The 95% sampling error of one option’s share in one poll.',
        formula: ['MOE = z · √(p(1 − p)/n), z = 1.959964'],
        unit: 'Proportion (×100 for points).',
        notes: ['It covers sampling error only: not non-response, wording or late change.'],
        sources: [{ kind: 'practice', citation: 'Normal approximation to the binomial; METHODS §5.' }],
      },
      {
        anchor: A.marginMoe,
        name: 'Margin of error of the lead',
        measures: 'The 95% sampling error of the lead of A over B in one poll.',
        formula: ['Var(p_A − p_B) = [p_A + p_B − (p_A − p_B)²]/n', 'MOE = z · √Var'],
        unit: 'Proportion (×100 for points). About twice the published share MOE.',
        notes: ['Judging a margin error against the share MOE is a known mistake.'],
        sources: [{ kind: 'practice', citation: 'Variance of a difference of two multinomial shares; METHODS §5.' }],
      },
      {
        anchor: A.designEffect,
        name: 'Design effect',
        measures: 'How much weighting and clustering widen a poll’s sampling error compared with a simple random sample.',
        formula: ['deff = n · Σw² / (Σw)² = 1 + CV²', 'n_eff = n / deff'],
        unit: '1 or more. An audit may set one for polls that state no margin of error.',
        sources: [{ kind: 'published', citation: 'Kish (1965), Survey Sampling.' }],
      },
      {
        anchor: A.effectiveN,
        name: 'Effective sample size',
        measures: 'The sample size that a poll’s precision corresponds to.',
        formula: [
          'from a stated MOE (pts, 95%): n_eff = z² · 0.25 / (MOE/100)²',
          'otherwise: n_eff = n / design effect',
        ],
        unit: 'Respondents.',
        notes: ['When a poll states a margin of error, its intervals use it, so the firm’s own claimed precision is what is tested.'],
        sources: [{ kind: 'practice', citation: 'METHODS §5.' }],
      },
      {
        anchor: A.wilson,
        name: 'Wilson score interval',
        measures: 'A 95% interval for a proportion that behaves well near 0 and 1 and with few cases.',
        formula: ['centre = (x + z²/2)/(n + z²)', 'half-width = z√n/(n + z²) · √(p̂(1 − p̂) + z²/(4n))'],
        unit: 'Proportion.',
        sources: [
          { kind: 'published', citation: 'Wilson (1927), JASA 22:209–212.' },
          { kind: 'memory', citation: 'Check values from Newcombe (1998), Statistics in Medicine 17:857–872.' },
        ],
      },
      {
        anchor: A.coverage,
        name: 'Interval coverage',
        measures: 'How often the poll’s own 95% interval held the certified value: A’s share, or the margin.',
        formula: [
          'share covered: V_A inside p_A ± z·√(p_A(1 − p_A)/n_eff)',
          'margin covered: V_A − V_B inside (p_A − p_B) ± z·√([p_A + p_B − (p_A − p_B)²]/n_eff)',
          'coverage rate = covered polls / polls with an interval',
        ],
        unit: 'Share of polls. About 95% under sampling error alone.',
        notes: [
          'Published audits found far less: about 73–88% for ±2 SE two-party intervals, and about 60% for 95% intervals across more than 6,000 contests.',
          'Polls of one contest share error, so an interval on a coverage rate resamples contests, not polls.',
        ],
        sources: [
          { kind: 'published', citation: 'Shirani-Mehr, Rothschild, Goel & Gelman (2018), JASA 113:607–614, replication files.' },
          { kind: 'published', citation: 'Kotak & Moore (2022), Behavioral Science & Policy.' },
        ],
      },
    ],
  },
  {
    id: 'selection',
    title: 'Which polls an audit uses',
    entries: [
      {
        anchor: A.daysOut,
        name: 'Days out',
        measures: 'How long before election day the poll was in the field.',
        formula: ['days out = election date − fieldwork midpoint'],
        unit: 'Days; may end in .5.',
        sources: [{ kind: 'practice', citation: 'Veracast SPEC §4.' }],
      },
      {
        anchor: A.window,
        name: 'Window',
        measures: 'Which polls count as pre-election polls of this election.',
        formula: ['in window when 0 ≤ election date − fieldwork end ≤ window days (both ends included)'],
        unit: 'Days; default 21.',
        sources: [{ kind: 'practice', citation: 'Veracast SPEC §5.' }],
      },
      {
        anchor: A.finalPoll,
        name: 'Final poll',
        measures: 'Each pollster’s last poll of a contest in the window.',
        formula: ['latest fieldwork end, then latest publication date, then the greatest poll key'],
        unit: 'Yes or no. By default an audit uses final polls only.',
        sources: [{ kind: 'practice', citation: 'Veracast SPEC §5.' }],
      },
      {
        anchor: A.minPolls,
        name: 'Minimum polls for a ranked pollster',
        measures: 'How many used polls a firm needs before it is given a rank.',
        formula: ['ranked when used polls ≥ minimum (default 5)'],
        unit: 'Polls.',
        notes: ['Rankings from few polls are mostly luck: counts and intervals are always shown.'],
        sources: [{ kind: 'practice', citation: 'Veracast SPEC §5.' }],
      },
      {
        anchor: A.dataHash,
        name: 'Data hash',
        measures: 'A fingerprint of every input the audit read, so anyone can tell whether the data has changed since.',
        formula: [
          'SHA-256 over one canonical line per election and per contest (with its certified results), in key order,',
          'then per election, in key order, a line holding the SHA-256 of its polls’ lines (every field and share, in poll-key order)',
        ],
        unit: '64 hexadecimal characters.',
        notes: [
          'When the current data gives another hash, the audit is out of date and can be re-run; the old one never changes.',
          'Audits stored before 2 December 2026 hash every line in one pass; each is checked with the way it was made.',
        ],
        sources: [{ kind: 'practice', citation: 'Veracast SPEC §1 (audit).' }],
      },
    ],
  },
  {
    id: 'shared-error',
    title: 'Shared error across polls',
    entries: [
      {
        anchor: A.contestBias,
        name: 'Contest bias and house effects',
        measures: 'The error all polls of a contest had in common, and each firm’s typical departure from it.',
        formula: [
          'y_j = μ + b_c + h_f + ε_j',
          'b̂_c = mean error in contest c; house effect = mean of y_j − b̂_c (b̂_c without the firm’s own poll)',
        ],
        unit: 'Points.',
        notes: ['Averaging polls of one contest never removes b_c.'],
        sources: [{ kind: 'published', citation: 'Shirani-Mehr, Rothschild, Goel & Gelman (2018), JASA 113:607–614.' }],
      },
      {
        anchor: A.dersimonianLaird,
        name: 'Excess variance (DerSimonian–Laird)',
        measures: 'How much more the polls of a contest disagree than their sampling error allows.',
        formula: [
          'w = 1/v; Q = Σ w(y − ȳ_FE)²; C = Σw − Σw²/Σw',
          'τ² = max(0, (Q − (k − 1))/C); I² = max(0, (Q − (k − 1))/Q)',
        ],
        unit: 'Points² (τ²); share (I²).',
        sources: [{ kind: 'published', citation: 'DerSimonian & Laird (1986), Controlled Clinical Trials 7:177–188.' }],
      },
      {
        anchor: A.icc,
        name: 'Intraclass correlation',
        measures: 'The share of error variance that polls of one contest have in common.',
        formula: ['n₀ = [N − Σn_c²/N]/(J − 1); σ_b² = (MSB − MSW)/n₀', 'ICC = σ_b² / (σ_b² + MSW)'],
        unit: 'Share, at most 1. Estimated by moments.',
        sources: [{ kind: 'practice', citation: 'One-way ANOVA estimator, ICC(1); METHODS §6.' }],
      },
      {
        anchor: A.effectivePolls,
        name: 'Effective number of polls',
        measures: 'How many independent polls a set of correlated polls is worth.',
        formula: ['Var(ȳ) = (σ²/k) · [1 + (k − 1)ρ]', 'n_eff = k / [1 + (k − 1)ρ] → 1/ρ'],
        unit: 'Polls.',
        sources: [{ kind: 'practice', citation: 'Design effect of equicorrelated observations; METHODS §6.' }],
      },
      {
        anchor: A.clusteredMean,
        name: 'Clustered mean error',
        measures: 'Whether the mean error differs from zero when polls of one contest share error.',
        formula: [
          'V = [G/(G − 1)] · [(N − 1)/(N − K)] · Σ_g (Σ_{j∈g} u_j)² / N², K = 1, u_j = y_j − ȳ',
          't = ȳ / √V on G − 1 degrees of freedom',
        ],
        unit: 'Points (mean and SE).',
        sources: [{ kind: 'memory', citation: 'Cameron & Miller (2015), Journal of Human Resources 50:317–372.' }],
      },
      {
        anchor: A.firmCorrelation,
        name: 'Correlation of two firms’ errors',
        measures: 'Whether two firms missed in the same direction in the contests both polled.',
        formula: ['Pearson r with t = r√((n − 2)/(1 − r²)) and a Fisher-z interval; Spearman on ranks'],
        unit: 'Between −1 and 1.',
        notes: ['Raw errors correlate mostly through the contest bias; the adjusted correlation removes it first.'],
        sources: [{ kind: 'practice', citation: 'METHODS §6.' }],
      },
      {
        anchor: A.normality,
        name: 'Normality of errors',
        measures: 'Whether the errors look normally distributed, as a diagnostic beside a Q–Q plot.',
        formula: ['Shapiro–Wilk W, Jarque–Bera, Anderson–Darling A²'],
        unit: 'Test statistics and p-values.',
        sources: [{ kind: 'practice', citation: 'METHODS §6.' }],
      },
    ],
  },
  {
    id: 'ranking',
    title: 'Ranking firms fairly',
    entries: [
      {
        anchor: A.excessError,
        name: 'Contest-adjusted excess error',
        measures: 'How much larger a firm’s misses were than other firms’ misses in the same contests.',
        formula: ['d_j = |e_j| − mean{|e_k| : polls k of the same contest by other firms}', 'score = mean of the firm’s d_j'],
        unit: 'Points. Negative: smaller misses than the other firms.',
        sources: [{ kind: 'practice', citation: 'A fixed-effects adjustment; METHODS §7.' }],
      },
      {
        anchor: A.shrinkage,
        name: 'Shrinkage toward the mean',
        measures: 'A firm’s score pulled toward the average in proportion to how little data it rests on.',
        formula: ['B_f = (σ²/n_f) / (σ²/n_f + τ²)', 'shrunk = μ + (1 − B_f)(ȳ_f − μ); SD = √[(1 − B_f)σ²/n_f]'],
        unit: 'Points.',
        sources: [{ kind: 'memory', citation: 'Efron & Morris (1975), JASA.' }],
      },
      {
        anchor: A.rankInterval,
        name: 'Rank interval',
        measures: 'The range of ranks a firm could plausibly hold, given the luck in its polls.',
        formula: ['seeded bootstrap with the contest as the resampling unit; ties share average ranks; P(rank = 1)'],
        unit: 'Ranks.',
        notes: ['League tables without intervals mislead.'],
        sources: [{ kind: 'published', citation: 'Goldstein & Spiegelhalter (1996), JRSS A 159:385–443.' }],
      },
    ],
  },
];

const BY_ANCHOR = new Map(METHOD_SECTIONS.flatMap((section) => section.entries).map((entry) => [entry.anchor, entry]));

/** The entry for an anchor; every anchor in METHOD_ANCHORS has one. */
export function methodEntry(anchor: MethodAnchor): MethodEntry {
  const entry = BY_ANCHOR.get(anchor);
  if (!entry) throw new Error(`No method entry for ${anchor}`);
  return entry;
}

export function isMethodAnchor(value: string): value is MethodAnchor {
  return BY_ANCHOR.has(value);
}
