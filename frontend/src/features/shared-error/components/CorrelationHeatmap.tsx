import { useId, useMemo, useState } from 'react';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import { correlationMatrix, correlationStep, type CorrelationMeasure, type MatrixCell } from '../lib/correlation-matrix';
import type { CsvColumn } from '../../../lib/csv';
import { fmtNumber, fmtP, isNum } from '../lib/format';
import { reasonFor } from '../lib/reasons';
import type { FirmPairDto, SharedErrorAnalysisDto } from '../types';
import { CHART_COLOURS, Cell, Legend, LegendItem, NotEnoughData } from './chart-kit';
import { ChartFigure } from './ChartFigure';

const POSITIVE = ['var(--color-accent-50)', 'var(--color-accent-100)', 'var(--color-accent-200)', 'var(--color-accent-500)', 'var(--color-accent-700)'];
const NEGATIVE = ['var(--color-caution-50)', 'var(--color-caution-100)', 'var(--color-caution-200)', 'var(--color-caution-500)', 'var(--color-caution-700)'];

function cellFill(cell: MatrixCell): string {
  if (cell.diagonal) return 'var(--color-ink-200)';
  if (cell.r === null) return 'var(--color-ink-100)';
  const step = correlationStep(cell.r);
  return (cell.r >= 0 ? POSITIVE : NEGATIVE)[step] as string;
}

function cellText(cell: MatrixCell): { text: string; fill: string; size: number } {
  if (cell.diagonal) return { text: '—', fill: CHART_COLOURS.ink500, size: 11 };
  if (cell.r === null) return { text: `n=${cell.n}`, fill: CHART_COLOURS.ink500, size: 10 };
  const dark = correlationStep(cell.r) >= 4 || (cell.r < 0 && correlationStep(cell.r) >= 3);
  return { text: fmtNumber(cell.r, 2) ?? '', fill: dark ? 'var(--color-white)' : CHART_COLOURS.ink900, size: 11 };
}

function cellTitle(cell: MatrixCell, measure: CorrelationMeasure): string {
  const pair = `${cell.row} × ${cell.column}`;
  if (cell.diagonal) return `${cell.row}: a firm with itself`;
  if (cell.r === null) return `${pair}: not computed (${cell.note ?? 'too few common contests'})`;
  const p = fmtP(cell.p);
  return `${pair}: r = ${fmtNumber(cell.r, 2)}${measure === 'adjusted' ? ' after removing the other firms’ contest bias' : ''} over ${cell.n} common contests${p ? `, p ${p.startsWith('<') ? p : `= ${p}`}` : ''}`;
}

const CELL = 40;
const LABEL_WIDTH = 190;
const HEADER_HEIGHT = 28;

function Heatmap({ firms, cells, measure }: { firms: string[]; cells: MatrixCell[]; measure: CorrelationMeasure }) {
  const size = firms.length;
  const width = LABEL_WIDTH + size * CELL + 8;
  const height = HEADER_HEIGHT + size * CELL + 8;
  return (
    <div className="overflow-x-auto">
      <svg
        width={width}
        height={height}
        role="img"
        aria-label={`Correlation of firms’ errors over common contests (${measure === 'raw' ? 'raw' : 'after removing contest bias'}); each cell prints r or the number of common contests`}
        data-chart-svg=""
      >
        {firms.map((firm, j) => (
          <text key={`c-${firm}`} x={LABEL_WIDTH + j * CELL + CELL / 2} y={HEADER_HEIGHT - 10} fontSize={11} textAnchor="middle" fill={CHART_COLOURS.ink700}>
            {j + 1}
          </text>
        ))}
        {firms.map((firm, i) => (
          <text key={`r-${firm}`} x={LABEL_WIDTH - 8} y={HEADER_HEIGHT + i * CELL + CELL / 2 + 4} fontSize={11} textAnchor="end" fill={CHART_COLOURS.ink900}>
            {`${i + 1}. ${firm.length > 26 ? `${firm.slice(0, 25)}…` : firm}`}
          </text>
        ))}
        {cells.map((cell, index) => {
          const i = Math.floor(index / size);
          const j = index % size;
          const x = LABEL_WIDTH + j * CELL;
          const y = HEADER_HEIGHT + i * CELL;
          const label = cellText(cell);
          return (
            <g key={`${cell.row}-${cell.column}`}>
              <title>{cellTitle(cell, measure)}</title>
              <rect x={x + 1} y={y + 1} width={CELL - 2} height={CELL - 2} fill={cellFill(cell)} stroke={cell.r === null && !cell.diagonal ? CHART_COLOURS.ink300 : 'none'} />
              <text x={x + CELL / 2} y={y + CELL / 2 + 4} fontSize={label.size} textAnchor="middle" fill={label.fill}>
                {label.text}
              </text>
            </g>
          );
        })}
      </svg>
    </div>
  );
}

const column = createDataTableColumnHelper<FirmPairDto>();
const columns = column.columns([
  column.accessor('a', { header: 'Firm' }),
  column.accessor('b', { header: 'Other firm' }),
  column.accessor('n', { header: 'Common contests', sortFn: 'basic' }),
  column.accessor('pearson', { header: 'r', sortFn: 'basic', cell: (i) => <Cell text={fmtNumber(i.getValue(), 2)} reason={i.row.original.note ?? 'not computed'} /> }),
  column.accessor('pearsonP', { header: 'p (r)', sortFn: 'basic', cell: (i) => <Cell text={fmtP(i.getValue())} reason={i.row.original.note ?? 'not computed'} /> }),
  column.accessor('spearman', { header: 'Spearman ρ', sortFn: 'basic', cell: (i) => <Cell text={fmtNumber(i.getValue(), 2)} reason={i.row.original.note ?? 'not computed'} /> }),
  column.accessor('pearsonAdjusted', {
    header: 'r without contest bias',
    sortFn: 'basic',
    cell: (i) => <Cell text={fmtNumber(i.getValue(), 2)} reason={i.row.original.note ?? 'not computed'} />,
  }),
  column.accessor('pearsonAdjustedP', { header: 'p (adjusted)', sortFn: 'basic', cell: (i) => <Cell text={fmtP(i.getValue())} reason={i.row.original.note ?? 'not computed'} /> }),
  column.accessor('note', { header: 'Note', cell: (i) => i.getValue() ?? '' }),
]);

const csvColumns: CsvColumn<FirmPairDto>[] = [
  { header: 'firm_a', value: (r) => r.a },
  { header: 'firm_b', value: (r) => r.b },
  { header: 'common_contests', value: (r) => r.n },
  { header: 'pearson_r', value: (r) => r.pearson },
  { header: 'pearson_p', value: (r) => r.pearsonP },
  { header: 'spearman_rho', value: (r) => r.spearman },
  { header: 'spearman_p', value: (r) => r.spearmanP },
  { header: 'common_contests_adjusted', value: (r) => r.nAdjusted },
  { header: 'pearson_r_without_contest_bias', value: (r) => r.pearsonAdjusted },
  { header: 'pearson_p_without_contest_bias', value: (r) => r.pearsonAdjustedP },
  { header: 'note', value: (r) => r.note },
];

/** Firm-by-firm correlation of errors over the contests both polled, raw or with contest bias removed. */
export function CorrelationHeatmap({ analysis, filename }: { analysis: SharedErrorAnalysisDto; filename: string }) {
  const [measure, setMeasure] = useState<CorrelationMeasure>('raw');
  const name = useId();
  const matrix = useMemo(() => correlationMatrix(analysis.pairs, measure), [analysis.pairs, measure]);
  const pairs = analysis.pairs;
  const computedRaw = pairs.filter((p) => isNum(p.pearson));
  const positive = computedRaw.filter((p) => (p.pearson as number) > 0).length;

  const cautions: string[] = [];
  if (pairs.length > 0 && matrix.computedCount < matrix.pairCount) {
    cautions.push(
      `${matrix.pairCount - matrix.computedCount} of ${matrix.pairCount} pairs of firms polled too few contests in common for a correlation; their cells show the number of common contests (n) instead.`,
    );
  }
  if (computedRaw.some((p) => p.n < 10)) {
    cautions.push('A correlation over fewer than 10 common contests is very uncertain: read single cells as hints, not findings.');
  }

  const chart =
    matrix.firms.length < 2 ? null : (
      <>
        <Heatmap firms={matrix.firms} cells={matrix.cells} measure={measure} />
        <Legend>
          <LegendItem shape={<rect x={1} y={1} width={16} height={12} fill="var(--color-accent-500)" />}>positive r: errors rose and fell together</LegendItem>
          <LegendItem shape={<rect x={1} y={1} width={16} height={12} fill="var(--color-caution-500)" />}>negative r</LegendItem>
          <LegendItem shape={<rect x={1} y={1} width={16} height={12} fill="var(--color-ink-100)" stroke={CHART_COLOURS.ink300} />}>
            n=…: too few common contests (the count is printed)
          </LegendItem>
        </Legend>
      </>
    );

  return (
    <ChartFigure
      title="Do firms’ errors move together?"
      explanation="Pearson correlation of two firms’ final-poll errors over the contests both polled; each cell prints r."
      filename={`${filename}-${measure}`}
      controls={
        matrix.firms.length >= 2 ? (
          <fieldset className="flex flex-wrap items-center gap-4 text-sm">
            <legend className="sr-only">Correlation shown</legend>
            <label className="inline-flex items-center gap-2">
              <input type="radio" name={name} checked={measure === 'raw'} onChange={() => setMeasure('raw')} />
              Raw errors
            </label>
            <label className="inline-flex items-center gap-2">
              <input type="radio" name={name} checked={measure === 'adjusted'} onChange={() => setMeasure('adjusted')} />
              After removing each contest’s bias (estimated from the other firms)
            </label>
          </fieldset>
        ) : null
      }
      chart={chart}
      emptyMessage={<NotEnoughData reason={reasonFor(analysis.warnings, 'pairs')} />}
      meaning={
        computedRaw.length > 0 ? (
          <p>
            {positive} of {computedRaw.length} correlated pairs moved together. Raw errors correlate mostly because firms polled the same
            contests, which shared a bias; the second view takes each contest’s bias (estimated from the other firms) out first, so what
            remains is firms resembling each other beyond the contest.
          </p>
        ) : (
          <p>
            No pair of firms polled enough contests in common to correlate their errors; the grid shows how many contests each pair shared.
          </p>
        )
      }
      cautions={cautions}
      table={<DataTable caption="Correlation of firms’ errors, pair by pair" columns={columns} data={pairs} getRowId={(r) => `${r.a}|${r.b}`} searchLabel="Search firms" pageSize={15} emptyMessage="No pairs of firms." />}
      csvRows={pairs}
      csvColumns={csvColumns}
    />
  );
}
