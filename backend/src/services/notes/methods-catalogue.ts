import type { UndecidedTreatment } from '@veracast/shared-types';

/** One formula an audit uses, with its published source (METHODS.md). */
export interface MethodEntry {
  name: string;
  /** TeX, rendered with KaTeX in the note. */
  tex: string;
  explanation: string;
  source: string;
}

/** The formulas every audit computes, in the order a reader meets them. */
export const METHOD_ENTRIES: readonly MethodEntry[] = [
  {
    name: 'Signed margin error',
    tex: 'e = (p_A - p_B) - (V_A - V_B)',
    explanation: 'In points; positive means the poll overstated A. A and B are the election’s two orientation blocs, or the certified top two.',
    source: 'Mosteller et al. (1949), The Pre-election Polls of 1948, SSRC (measure 5 is |e| for the certified top two).',
  },
  {
    name: 'Mosteller’s measure 3',
    tex: 'M_3 = \\frac{1}{|S|}\\sum_{i \\in S} |p_i - V_i|',
    explanation: 'Mean absolute share error over the scored options S (undecided never included).',
    source: 'Mosteller et al. (1949), The Pre-election Polls of 1948, SSRC.',
  },
  {
    name: 'Predictive accuracy A',
    tex: 'A = \\ln\\frac{p_A / p_B}{V_A / V_B},\\quad \\operatorname{Var}(A) \\approx \\frac{1}{n p_A} + \\frac{1}{n p_B}',
    explanation: '0 is perfect; positive leans to A. The variance is the delta-method approximation with the result taken as fixed.',
    source: 'Martin, Traugott & Kennedy (2005), Public Opinion Quarterly 69:342–369.',
  },
  {
    name: 'Multi-option accuracy B',
    tex: "B = \\frac{1}{k}\\sum_i |A'_i|,\\quad A'_i = \\ln\\frac{p_i/(1-p_i)}{V_i/(1-V_i)}",
    explanation: 'Over the named options, shares rescaled to sum to one; undecided is left out.',
    source: 'Arzheimer & Evans (2014), Political Analysis 22:31–44.',
  },
  {
    name: 'Sampling error of a margin',
    tex: '\\operatorname{Var}(p_A - p_B) = \\frac{p_A + p_B - (p_A - p_B)^2}{n}',
    explanation: 'One multinomial sample; when a firm states a margin of error, its implied effective sample size is used.',
    source: 'Kish (1965), Survey Sampling.',
  },
  {
    name: 'Mean error with polls clustered by contest',
    tex: 'V_{CR1} = \\frac{G}{G-1}\\cdot\\frac{N-1}{N-K}\\cdot\\frac{\\sum_g \\left(\\sum_{j \\in g} u_j\\right)^2}{N^2}',
    explanation: 'Cluster-robust variance of a mean (K = 1) with the G contests as clusters and u_j = y_j − ȳ; t reference on G − 1 degrees of freedom.',
    source: 'Cameron & Miller (2015), Journal of Human Resources 50:317–372.',
  },
  {
    name: 'Intraclass correlation of errors',
    tex: '\\mathrm{ICC} = \\frac{\\sigma_b^2}{\\sigma_b^2 + \\mathrm{MSW}},\\quad \\sigma_b^2 = \\frac{\\mathrm{MSB} - \\mathrm{MSW}}{n_0}',
    explanation: 'One-way ANOVA of errors grouped by contest (moment estimate).',
    source: 'Shirani-Mehr, Rothschild, Goel & Gelman (2018), JASA 113:607–614, for the shared-error model.',
  },
  {
    name: 'Effective number of polls',
    tex: 'n_{\\mathrm{eff}} = \\frac{k}{1 + (k-1)\\rho}',
    explanation: 'How many independent polls k polls with pairwise error correlation ρ are worth.',
    source: 'Kish (1965), Survey Sampling (design effect of clustered samples).',
  },
  {
    name: 'Contest-adjusted excess error, shrunk',
    tex: '\\hat\\theta_f = \\mu + (1 - B_f)(\\bar y_f - \\mu),\\quad B_f = \\frac{\\sigma^2/n_f}{\\sigma^2/n_f + \\tau^2}',
    explanation: 'A firm’s absolute error minus that of other firms in the same contests, shrunk toward zero for firms with few polls; τ² by DerSimonian–Laird.',
    source: 'Efron & Morris (1975), JASA; DerSimonian & Laird (1986), Controlled Clinical Trials 7:177–188.',
  },
  {
    name: 'Rank intervals',
    tex: '\\text{contests resampled with replacement; ranks by shrunk excess error}',
    explanation: 'Seeded bootstrap with the contest as the resampling unit; ties get average ranks.',
    source: 'Goldstein & Spiegelhalter (1996), JRSS A 159:385–443.',
  },
];

export const UNDECIDED_EXPLANATIONS: Record<UndecidedTreatment, string> = {
  raw: 'raw — shares as published, undecided included in the base',
  proportional: 'proportional — shares rescaled over decided respondents',
  two_party: 'two-party — only the reference pair A and B, rescaled to sum to 100',
};
