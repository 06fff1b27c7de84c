import { buildChartTheme } from '@visx/xychart';
import { useMemo } from 'react';
import { paletteColor as token } from '../../../lib/palette';

export interface ChartColors {
  mark: string;
  markStrong: string;
  reference: string;
  text: string;
  grid: string;
  axis: string;
}

export function useChartColors(): ChartColors {
  return useMemo(
    () => ({
      mark: token('accent-600', '#2f7f86'),
      markStrong: token('accent-800', '#1f5559'),
      reference: token('danger-700', '#9b2c23'),
      text: token('ink-700', '#3b4453'),
      grid: token('ink-200', '#e3e6eb'),
      axis: token('ink-400', '#98a1af'),
    }),
    [],
  );
}

export function useChartTheme(colors: ChartColors) {
  return useMemo(
    () =>
      buildChartTheme({
        backgroundColor: 'white',
        colors: [colors.mark, colors.markStrong, colors.reference],
        tickLength: 4,
        gridColor: colors.grid,
        gridColorDark: colors.axis,
        svgLabelSmall: { fill: colors.text, fontSize: 11 },
        svgLabelBig: { fill: colors.text, fontSize: 12 },
        xAxisLineStyles: { stroke: colors.axis },
        yAxisLineStyles: { stroke: colors.axis },
        xTickLineStyles: { stroke: colors.axis },
        yTickLineStyles: { stroke: colors.axis },
      }),
    [colors],
  );
}
