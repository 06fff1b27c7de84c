import { act, cleanup, render } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { useChartExport, type ChartExport, type ChartExportOptions } from './useChartExport';

afterEach(cleanup);

function mount(withChart: boolean, options?: ChartExportOptions): { current: ChartExport<HTMLDivElement> } {
  const holder = {} as { current: ChartExport<HTMLDivElement> };
  function Probe() {
    const exporter = useChartExport(options);
    holder.current = exporter;
    return <div ref={exporter.ref}>{withChart && <svg width="10" height="10" />}</div>;
  }
  render(<Probe />);
  return holder;
}

describe('useChartExport', () => {
  it('hands the chart’s SVG element to the download', async () => {
    const chart = mount(true);
    const action = vi.fn();
    await act(() => chart.current.withSvg(action));
    expect(action).toHaveBeenCalledTimes(1);
    expect(action.mock.calls[0]?.[0]).toBeInstanceOf(SVGSVGElement);
    expect(chart.current.failure).toBeNull();
  });

  it('says the chart is not drawn yet, or stays quiet when told to', async () => {
    const missing = mount(false, { missingMessage: 'Draw it first.' });
    await act(() => missing.current.withSvg(() => undefined));
    expect(missing.current.failure).toBe('Draw it first.');
    cleanup();
    const quiet = mount(false, { missingMessage: null });
    const action = vi.fn();
    await act(() => quiet.current.withSvg(action));
    expect(action).not.toHaveBeenCalled();
    expect(quiet.current.failure).toBeNull();
  });

  it('keeps the message of a failed download and clears it on the next try', async () => {
    const chart = mount(true);
    await act(() => chart.current.run(() => Promise.reject(new Error('The image could not be made.'))));
    expect(chart.current.failure).toBe('The image could not be made.');
    await act(() => chart.current.run(() => undefined));
    expect(chart.current.failure).toBeNull();
  });
});
