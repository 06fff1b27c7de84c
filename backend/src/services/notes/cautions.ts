/**
 * The standard cautions every published note carries (METHODS §8), phrased for a public reader.
 */
export const NOTE_CAUTIONS: readonly string[] = [
  'A stated margin of error covers the sampling error of one share only. The margin between two options carries roughly twice that, and the total error of election polls has historically run about twice the stated figure.',
  'Polls of the same contest share part of their error (a common bias). Averaging many polls does not remove it.',
  'Rankings of polling firms built on few polls are mostly luck: read the counts, the intervals and the minimum number of polls before the order.',
  'A poll measures opinion during its fieldwork; it is not a forecast. Movement after fieldwork is real change, not poll error.',
  'Accuracy and disclosure are separate qualities of a poll; one does not stand in for the other.',
];
