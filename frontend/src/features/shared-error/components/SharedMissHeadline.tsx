import { useId, useMemo } from 'react';
import { DataTable, Stat, StatGroup, createDataTableColumnHelper } from '../../../components/ui';
import { cn } from '../../../lib/cn';
import { fmtInterval, fmtNumber, fmtP, fmtPEquals, fmtSigned, isNum } from '../lib/format';
import { reasonFor } from '../lib/reasons';
import { firmTypicalErrors, sharedMissVerdict, type Blocs, type FirmTypicalError, type VerdictKind } from '../lib/verdict';
import type { SharedErrorAnalysisDto } from '../types';
import { Cell, ValueOr } from './chart-kit';

const KIND_STYLE: Record<VerdictKind, { box: string; word: string; mark: string }> = {
  shared: { box: 'border-caution-500 bg-caution-50', word: 'Flag raised', mark: '▲' },
  'mean-only': { box: 'border-ink-400 bg-white', word: 'Mixed evidence', mark: '◆' },
  'not-shown': { box: 'border-ink-300 bg-white', word: 'No flag', mark: '○' },
  untested: { box: 'border-ink-300 bg-ink-50', word: 'Not tested', mark: '–' },
  'no-data': { box: 'border-ink-300 bg-ink-50', word: 'Not tested', mark: '–' },
};

interface FirmRow extends FirmTypicalError {
  houseEffect: number;
  sameWay: string;
}

const column = createDataTableColumnHelper<FirmRow>();
const columns = column.columns([
  column.accessor('firm', { header: 'Firm' }),
  column.accessor('polls', { header: 'Polls', sortFn: 'basic' }),
  column.accessor('houseEffect', { header: 'House effect (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} /> }),
  column.accessor('error', { header: 'Error in a typical contest (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} /> }),
  column.accessor('sameWay', { header: 'Same way as the mean' }),
]);

/** The top of the shared-error page: did most firms miss the same way, by how much, how sure. */
export function SharedMissHeadline({ analysis, blocs }: { analysis: SharedErrorAnalysisDto; blocs: Blocs }) {
  const headingId = useId();
  const verdict = sharedMissVerdict(analysis, blocs);
  const style = KIND_STYLE[verdict.kind];
  const mean = analysis.meanSignedError;
  const testReason = reasonFor(analysis.warnings, 'meanTest');
  const firms = useMemo<FirmRow[]>(() => {
    const effects = new Map(analysis.houseEffects.map((h) => [h.firm, h.plain]));
    return firmTypicalErrors(analysis).map((f) => ({
      ...f,
      houseEffect: effects.get(f.firm) ?? 0,
      sameWay: isNum(mean) && mean !== 0 ? (Math.sign(f.error) === Math.sign(mean) ? 'yes' : 'no') : '—',
    }));
  }, [analysis, mean]);

  return (
    <section aria-labelledby={headingId} className={cn('rounded-lg border-2 px-5 py-4 shadow-sm', style.box)}>
      <p className="text-xs font-semibold tracking-wide text-ink-700 uppercase">
        <span aria-hidden="true">{style.mark} </span>Headline · {style.word}
      </p>
      <h2 id={headingId} className="mt-1 text-xl font-semibold text-ink-950">
        {verdict.title}
      </h2>
      <p className="mt-2 max-w-3xl text-ink-800">{verdict.summary}</p>
      <StatGroup className="mt-4" columns={4}>
        <Stat
          label="Mean signed error"
          value={<ValueOr text={isNum(mean) ? `${fmtSigned(mean)} pts` : null} reason={reasonFor(analysis.warnings, 'meanTest')} />}
          hint={verdict.direction ?? undefined}
        />
        <Stat
          label="95% interval, clustered by contest"
          value={<ValueOr text={fmtInterval(analysis.ciLow, analysis.ciHigh)} reason={testReason} />}
          hint={isNum(analysis.t) && isNum(analysis.df) ? `t = ${fmtNumber(analysis.t, 2)} on ${analysis.df} df` : undefined}
        />
        <Stat
          label="How sure: p-value"
          value={<ValueOr text={fmtP(analysis.p)} reason={testReason} />}
          hint={isNum(analysis.p) ? 'two-sided test that the mean error is 0' : undefined}
        />
        <Stat
          label="Firms that missed the same way"
          value={<ValueOr text={verdict.firmsCounted > 0 && isNum(mean) ? `${verdict.firmsSameSign} of ${verdict.firmsCounted}` : null} reason="no firm-level estimates" />}
          hint="in a typical contest: mean error plus the firm’s house effect"
        />
        <Stat
          label="Intraclass correlation"
          value={<ValueOr text={fmtNumber(analysis.icc, 2)} reason={reasonFor(analysis.warnings, 'icc')} />}
          hint={isNum(analysis.iccF) && analysis.iccDf ? `F = ${fmtNumber(analysis.iccF, 2)} on ${analysis.iccDf[0]} and ${analysis.iccDf[1]} df, ${fmtPEquals(analysis.iccP) ?? ''}` : 'how alike polls of one contest were'}
        />
        <Stat label="Polls analysed" value={analysis.polls} hint={`${analysis.contests} ${analysis.contests === 1 ? 'contest' : 'contests'}, ${analysis.firms} ${analysis.firms === 1 ? 'firm' : 'firms'}`} />
      </StatGroup>
      <p className="mt-3 max-w-3xl text-sm text-ink-700">
        The mean signed error is the average of every poll’s margin error, oriented by the election’s blocs ({blocs.blocA ?? 'bloc A'} − {blocs.blocB ?? 'bloc B'}). Polls of one
        contest share its error, so the test treats each contest as one cluster (CR1 standard error, Student t on contests − 1 degrees of freedom) rather than
        each poll as independent evidence.
      </p>
      {firms.length > 0 && (
        <details className="mt-3 rounded-md border border-ink-200 bg-white">
          <summary className="cursor-pointer px-3 py-2 text-sm font-medium text-accent-800">Firm by firm: error in a typical contest</summary>
          <div className="p-3">
            <DataTable caption="Each firm’s error in a typical contest" columns={columns} data={firms} getRowId={(r) => r.firm} pageSize={20} />
          </div>
        </details>
      )}
    </section>
  );
}
