import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { MemoryRouter } from 'react-router-dom';
import type { ScorecardItem } from '../api/types';
import { IntervalBar, intervalBarX, sharedDomain } from './IntervalBar';
import { RankingTable } from './RankingTable';

afterEach(cleanup);

function buildItem(overrides: Partial<ScorecardItem>): ScorecardItem {
  return {
    pollsterId: 1, pollster: 'Aster Polling', polls: 8, contests: 8, elections: 2, meanAbsMarginError: 3, meanSignedError: -1,
    meanSignedErrorInterval: [-2, 0], rmse: 3.5, winnerCalledRate: 0.75, calls: 8, noCalls: 0, coverageRate: 0.875, coverageN: 8,
    shareCoverageRate: 0.5, disclosure: 0.7, excessError: -0.5, excessErrorShrunk: -0.2, excessErrorInterval: [-1.5, 0.5],
    excessErrorShrunkInterval: [-1, 0.4], rank: 1, rankInterval: [1, 2], pRankFirst: 0.6, ranked: true, reason: null,
    ...overrides,
  };
}

describe('intervalBarX', () => {
  it('maps the domain onto the bar inside a 4-pixel margin and clamps outside values', () => {
    // [computed] by hand: width 108 leaves 100 px between x = 4 and x = 104
    expect(intervalBarX(-2, [-2, 2], 108)).toBe(4);
    expect(intervalBarX(0, [-2, 2], 108)).toBe(54);
    expect(intervalBarX(1, [-2, 2], 108)).toBe(79);
    expect(intervalBarX(9, [-2, 2], 108)).toBe(104);
  });

  it('pads a shared domain by 5% each side around every value and interval', () => {
    // [computed] by hand: values span −1 to 3 (span 4), pad 0.2
    const [lo, hi] = sharedDomain([0.5, null], [[-1, 2], null], [3]);
    expect(lo).toBeCloseTo(-1.2, 12);
    expect(hi).toBeCloseTo(3.2, 12);
  });
});

describe('IntervalBar', () => {
  it('is one image named by its numbers, with the estimate inside the interval', () => {
    const { container } = render(<IntervalBar estimate={0} interval={[-1, 1]} domain={[-2, 2]} label="Excess error 0.00 points, 95% interval −1.00 to 1.00" reference={0} width={108} />);
    const img = screen.getByRole('img', { name: /95% interval −1.00 to 1.00/ });
    expect(img).toBeTruthy();
    const lines = container.querySelectorAll('[data-part="interval"] line');
    // [computed] by hand: −1 → 29, 1 → 79 on the 108-pixel bar above
    expect(lines[0]?.getAttribute('x1')).toBe('29');
    expect(lines[0]?.getAttribute('x2')).toBe('79');
    expect(container.querySelector('[data-part="estimate"]')?.getAttribute('cx')).toBe('54');
    expect(container.querySelector('[data-part="reference"]')).toBeTruthy();
  });
});

describe('RankingTable', () => {
  it('draws each ranked firm’s intervals inline, links the firm page and says why a firm is not ranked', () => {
    const items = [
      buildItem({}),
      buildItem({ pollsterId: 2, pollster: 'Birch & Co', rank: 2, rankInterval: [1, 2], excessErrorShrunk: 0.2, excessErrorShrunkInterval: [-0.4, 1] }),
      buildItem({ pollsterId: 3, pollster: 'Cobalt Research', polls: 2, ranked: false, rank: null, rankInterval: null, pRankFirst: null, reason: 'fewer polls than the minimum (2 < 5)' }),
    ];
    render(
      <MemoryRouter>
        <RankingTable auditId={7} items={items} />
      </MemoryRouter>,
    );
    const table = screen.getByRole('table', { name: 'Pollster ranking' });
    const [, body] = within(table).getAllByRole('rowgroup');
    const rows = within(body!).getAllByRole('row');
    expect(rows).toHaveLength(3);
    expect(within(rows[0]!).getByRole('img', { name: 'Rank 1 of 2, 95% interval 1 to 2' })).toBeTruthy();
    expect(within(rows[0]!).getByRole('img', { name: /^Excess error −0\.20 points, 95% interval −1\.00 to 0\.40$/ })).toBeTruthy();
    expect(within(rows[0]!).getByRole('link', { name: 'Aster Polling' }).getAttribute('href')).toBe('/pollsters/1/accuracy?audit=7');
    expect(within(rows[2]!).getByText('Not ranked')).toBeTruthy();
    expect(within(rows[2]!).getByText('fewer polls than the minimum (2 < 5)')).toBeTruthy();
    expect(within(rows[2]!).queryByRole('img', { name: /^Rank/ })).toBeNull();
    // Disclosure is its own column, never blended into the rank.
    expect(within(table).getByRole('columnheader', { name: /Disclosure/ })).toBeTruthy();
  });
});
