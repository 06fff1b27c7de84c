import { Alert } from '../../../components/ui';
import type { SharedErrorAnalysisDto } from '../types';

/** Every warning of the analysis, plus the standing cautions about shared error. */
export function SharedErrorCautions({ analysis }: { analysis: SharedErrorAnalysisDto }) {
  const thin: string[] = [];
  if (analysis.contests > 0 && analysis.contests < 5) {
    thin.push(`Only ${analysis.contests} ${analysis.contests === 1 ? 'contest' : 'contests'} in this election: every test that treats contests as the unit has very little to go on.`);
  }
  const warnings = [...thin, ...analysis.warnings];
  return (
    <div className="space-y-3">
      {warnings.length > 0 ? (
        <Alert tone="caution" title="Where the data are thin">
          <ul className="list-disc space-y-1 pl-4">
            {warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Alert>
      ) : (
        <Alert tone="info" title="No data warnings">Every figure on this page could be computed.</Alert>
      )}
      <Alert tone="info" title="Standing cautions">
        <ul className="list-disc space-y-1 pl-4">
          <li>Polls of one contest share error; averaging many polls does not remove it.</li>
          <li>A stated margin of error covers the sampling error of one share; the margin’s is about twice as large, and total error runs larger still.</li>
          <li>A poll measures opinion during its fieldwork; it is not a forecast. Late movement is real change, not only error.</li>
        </ul>
      </Alert>
    </div>
  );
}
