import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ChartFigure } from './ChartFigure';

afterEach(() => {
  cleanup();
  vi.restoreAllMocks();
});

function renderFigure() {
  return render(
    <ChartFigure
      title="Error by mode"
      explanation="Mean error by how the interviews were done."
      summary="Two groups."
      points={['Phone: 3.9 points.', 'Online: 4.2 points.']}
      table={<table aria-label="numbers" />}
      downloads={[{ label: 'CSV', rows: [{ mode: 'phone', meanAbsError: 3.9 }, { mode: '=online', meanAbsError: -4.2 }] }]}
    >
      {({ active }) => (
        <svg width={100} height={50}>
          <text>{active === null ? 'none' : `item ${active}`}</text>
        </svg>
      )}
    </ChartFigure>,
  );
}

describe('ChartFigure', () => {
  it('is one keyboard stop whose arrow keys read the items aloud and mark them on the chart', () => {
    renderFigure();
    const chart = screen.getByRole('img', { name: /^Error by mode\. Two groups\. Use the arrow keys/ });
    expect(chart.getAttribute('tabindex')).toBe('0');
    expect(chart.getAttribute('aria-describedby')).toBeTruthy();
    expect(document.getElementById(chart.getAttribute('aria-describedby')!)?.textContent).toBe('Mean error by how the interviews were done.');

    fireEvent.keyDown(chart, { key: 'ArrowRight' });
    expect(screen.getByText('1 of 2: Phone: 3.9 points.')).toBeTruthy();
    expect(chart.textContent).toBe('item 0');
    fireEvent.keyDown(chart, { key: 'ArrowRight' });
    fireEvent.keyDown(chart, { key: 'ArrowRight' });
    expect(screen.getByText('2 of 2: Online: 4.2 points.')).toBeTruthy();
    fireEvent.keyDown(chart, { key: 'Home' });
    expect(chart.textContent).toBe('item 0');
    fireEvent.keyDown(chart, { key: 'Escape' });
    expect(chart.textContent).toBe('none');
  });

  it('downloads the table’s data as a neutralised CSV file named after the chart', async () => {
    const blobs: Blob[] = [];
    vi.spyOn(URL, 'createObjectURL').mockImplementation((blob: Blob | MediaSource) => {
      blobs.push(blob as Blob);
      return 'blob:test';
    });
    vi.spyOn(URL, 'revokeObjectURL').mockImplementation(() => undefined);
    const names: string[] = [];
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      names.push(this.download);
    });
    renderFigure();
    fireEvent.click(screen.getByRole('button', { name: 'Download CSV of Error by mode' }));
    expect(names).toEqual(['error-by-mode.csv']);
    const text = await blobs[0]!.text();
    expect(text.replace(/^\uFEFF/, '').split('\r\n')).toEqual(['mode,meanAbsError', 'phone,3.9', "'=online,-4.2"]);
    expect(screen.getByRole('button', { name: 'Download SVG of Error by mode' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Download PNG of Error by mode' })).toBeTruthy();
  });
});
