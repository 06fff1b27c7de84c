/**
 * Picks, from the analysis's warnings, the sentence that explains why a given figure is missing,
 * so "not enough data" always comes with its reason.
 */

export type ReasonTopic =
  | 'meanTest'
  | 'icc'
  | 'normality'
  | 'split'
  | 'adjusted'
  | 'pairs'
  | 'excess'
  | 'naive'
  | 'margin';

const PATTERNS: Record<ReasonTopic, RegExp[]> = {
  meanTest: [/clustered/i, /only one contest/i, /errors are equal/i, /no polls with a usable/i],
  icc: [/intraclass/i, /errors are equal/i, /no polls with a usable/i],
  normality: [/normality/i, /shapiro/i, /jarque/i, /anderson/i, /q–q/i, /errors are equal/i, /no polls with a usable/i],
  split: [/split of error variance/i, /errors are equal/i, /no polls with a usable/i],
  adjusted: [/adjusted intervals/i, /intraclass/i, /no polls with a usable/i],
  pairs: [/pair/i, /only one firm/i, /no polls with a usable/i],
  excess: [/excess variance/i, /single poll/i],
  naive: [/sampling variance/i],
  margin: [/certified margin/i],
};

const FALLBACK: Record<ReasonTopic, string> = {
  meanTest: 'The test of the mean error needs polls in at least 2 contests with some variation between them.',
  icc: 'The intraclass correlation needs at least 2 contests and a contest with more than one poll.',
  normality: 'The normality checks need at least 3 errors that are not all equal.',
  split: 'The split needs a contest polled by 2 firms, a firm that polled 2 contests, and polls that differ in both.',
  adjusted: 'The adjusted interval needs the intraclass correlation, which could not be estimated.',
  pairs: 'No pair of firms polled enough contests in common.',
  excess: 'Excess variance needs at least 2 polls in the contest.',
  naive: 'A poll of this contest lacks a sampling variance.',
  margin: 'The certified margin is missing for this contest.',
};

/** The first warning about `topic`, or a plain default when the analysis gave none. */
export function reasonFor(warnings: readonly string[] | null | undefined, topic: ReasonTopic): string {
  const list = Array.isArray(warnings) ? warnings : [];
  for (const pattern of PATTERNS[topic]) {
    const hit = list.find((w) => typeof w === 'string' && pattern.test(w));
    if (hit) return hit;
  }
  return FALLBACK[topic];
}
