export { breakdownsQueryOptions, getBreakdowns, useBreakdowns } from './api/get-breakdowns';
export { breakdownKeys } from './api/keys';
export type * from './api/types';
export { AuditBreakdowns, type AuditBreakdownsProps } from './components/AuditBreakdowns';
export { FirmErrorCharts, type FirmErrorChartsProps } from './components/FirmErrorCharts';
export { ChartFigure, type ChartFigureProps, type ChartRenderContext } from './components/chart/ChartFigure';
