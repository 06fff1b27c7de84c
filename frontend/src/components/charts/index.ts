export { useChartExport, type ChartExport, type ChartExportOptions } from './useChartExport';
