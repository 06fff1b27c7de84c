import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { Breakdown } from '../api/types';
import { CategoryBreakdownFigure } from './CategoryBreakdownFigure';
import { daysOutBinRange } from './DaysOutFigure';

afterEach(cleanup);

const BREAKDOWN: Breakdown = {
  bins: [
    { label: 'lv', n: 12, meanAbs: 3.5, meanSigned: -1.25, lo: -2.5, hi: 0, absInterval: [2.5, 4.5] },
    { label: 'rv', n: 1, meanAbs: 2, meanSigned: 2, lo: null, hi: null, absInterval: null },
  ],
  excluded: 2,
};

describe('daysOutBinRange', () => {
  it('reads whole-day labels as half-open ranges and runs an open bin to the top', () => {
    // [practice] the backend's DAYS_OUT_BINS: "4–7" is [4, 8), "22+" is [22, ∞)
    expect(daysOutBinRange('0–3', 40)).toEqual([0, 4]);
    expect(daysOutBinRange('8–14', 40)).toEqual([8, 15]);
    expect(daysOutBinRange('22+', 40)).toEqual([22, 40]);
    expect(daysOutBinRange('22+', 10)).toEqual([22, 23]);
    expect(daysOutBinRange('later', 40)).toBeNull();
  });
});

describe('CategoryBreakdownFigure', () => {
  it('draws a chart with a table beside it, and redraws the other measure on request', () => {
    const { container } = render(
      <CategoryBreakdownFigure
        title="Error by population"
        explanation="Mean error by the population sampled."
        breakdown={BREAKDOWN}
        labelHeader="Population"
        labelOf={(b) => (b.label === 'lv' ? 'Likely voters' : 'Registered voters')}
      />,
    );
    expect(screen.getByRole('heading', { name: 'Error by population' })).toBeTruthy();
    expect(screen.getByText('Mean error by the population sampled.')).toBeTruthy();
    const svg = container.querySelector('figure svg');
    expect(svg).toBeTruthy();
    expect(svg?.textContent).toContain('Mean absolute error (points)');
    expect(svg?.textContent).toContain('Likely voters (n = 12)');

    const table = screen.getByRole('table', { name: /Error by population: the numbers/ });
    const rows = within(table).getAllByRole('row');
    expect(within(rows[1]!).getByRole('rowheader').textContent).toBe('Likely voters');
    expect(rows[1]!.textContent).toContain('(2.5 to 4.5)');
    expect(rows[1]!.textContent).toContain('−1.3');
    expect(rows[2]!.textContent).toContain('(n < 2: none)');
    expect(table.textContent).toContain('2 polls left out');

    fireEvent.click(screen.getByLabelText('Mean signed error'));
    expect(container.querySelector('figure svg')?.textContent).toContain('Mean signed error (points)');
  });

  it('says so instead of drawing an empty chart', () => {
    render(<CategoryBreakdownFigure title="Error by mode" explanation="x" breakdown={null} labelHeader="Mode" />);
    expect(screen.getByText('Not enough polls to break the error down this way.')).toBeTruthy();
    expect(screen.queryByRole('img')).toBeNull();
  });
});
