import { cleanup, fireEvent, screen, within } from '@testing-library/react';
import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { afterEach, describe, expect, it } from 'vitest';
import { renderWithClient } from '../../../test/render';
import { AuditPollsTable } from './AuditPollsTable';

function buildPoll(overrides: Partial<AuditPollDto> = {}): AuditPollDto {
  return {
    pollKey: 'p1', contestKey: 'c1', electionKey: 'e1', pollsterId: 1, pollster: 'Aster Polling',
    refA: 'a', refB: 'b', refBasis: 'blocs', marginError: 1, absMarginError: 1, lean: 'A',
    mosteller3: 1, mosteller5: 1, mtkA: 0.01, mtkSe: 0.05, mtkP: 0.8, aeB: 0.1, aeBw: 0.1,
    winnerCalled: true, shareCovered: true, marginCovered: true, daysOut: 3, daysOutEnd: 2,
    undecidedShare: 5, twoPartyShareError: 0.5, inWindow: true, isFinal: true, fieldworkEnd: '2026-10-10',
    sampleSize: 1000, population: 'lv', mode: 'online', sponsorType: null, disclosure: 0.8, nEff: 1000,
    pollA: 45, pollB: 40, resultA: 46, resultB: 42, notes: [], error: null,
    ...overrides,
  };
}

const settings: AuditSettings = { name: 'x', electionKeys: ['e1'], windowDays: 21, finalOnly: true, undecided: 'raw', minPolls: 5, designEffect: 1 };
const elections = [{ key: 'e1', name: 'Election one', date: '2026-10-18', blocA: 'A', blocB: 'B', fictional: true }];

const polls = [
  buildPoll({ pollKey: 'p-mid', pollster: 'Birch & Co', marginError: -2.5, absMarginError: 2.5, lean: 'B' }),
  buildPoll({ pollKey: 'p-small', pollster: 'Aster Polling', marginError: 0.25, absMarginError: 0.25 }),
  buildPoll({ pollKey: 'p-large', pollster: 'Cobalt Research', marginError: 10, absMarginError: 10 }),
  buildPoll({ pollKey: 'p-early', pollster: 'Aster Polling', isFinal: false, marginError: 4, absMarginError: 4 }),
  buildPoll({ pollKey: 'p-none', pollster: 'Dune Surveys', marginError: null, absMarginError: null, lean: null, error: 'contest c9 has no result yet' }),
];

function renderTable() {
  renderWithClient(<AuditPollsTable polls={polls} settings={settings} elections={elections} auditId={7} serverCsvUrl="/csv" />);
  return screen.getByRole('table', { name: 'Per-poll metrics of the audit' });
}

function column(table: HTMLElement, heading: RegExp): string[] {
  const headings = within(table).getAllByRole('columnheader').map((h) => h.textContent ?? '');
  const index = headings.findIndex((text) => heading.test(text));
  const [, body] = within(table).getAllByRole('rowgroup');
  return within(body!)
    .getAllByRole('row')
    .map((row) => within(row).getAllByRole('cell')[index]?.textContent ?? '');
}

function sortBy(heading: RegExp) {
  fireEvent.click(within(screen.getByRole('columnheader', { name: heading })).getByRole('button'));
}

afterEach(cleanup);

describe('AuditPollsTable', () => {
  it('shows the used polls by default: final, in the window and computable', () => {
    const table = renderTable();
    // [practice] SPEC §5: p-early is not the final poll and p-none has no metrics
    expect(column(table, /^Poll/)).toEqual(['p-mid', 'p-small', 'p-large']);
  });

  it('sorts by absolute margin error numerically, both ways, with missing values last', () => {
    const table = renderTable();
    fireEvent.change(screen.getByLabelText('Polls shown'), { target: { value: 'all' } });
    sortBy(/Abs\. margin error/);
    // [practice] numeric order 0.25 < 2.5 < 4 < 10, not text order; the poll without a value goes last
    expect(column(table, /Abs\. margin error/)).toEqual(['0.25', '2.50', '4.00', '10.00', '—']);
    sortBy(/Abs\. margin error/);
    expect(column(table, /Abs\. margin error/)).toEqual(['10.00', '4.00', '2.50', '0.25', '—']);
    expect(screen.getByRole('columnheader', { name: /Abs\. margin error/ }).getAttribute('aria-sort')).toBe('descending');
  });

  it('filters by pollster and by lean', () => {
    const table = renderTable();
    fireEvent.change(screen.getByLabelText('Polls shown'), { target: { value: 'all' } });
    fireEvent.change(screen.getByLabelText('Pollster contains'), { target: { value: 'aster' } });
    expect(column(table, /^Poll/)).toEqual(['p-small', 'p-early']);
    fireEvent.change(screen.getByLabelText('Pollster contains'), { target: { value: '' } });
    fireEvent.change(screen.getByLabelText('Side overstated'), { target: { value: 'B' } });
    expect(column(table, /^Poll/)).toEqual(['p-mid']);
  });

  it('lets the reader choose the columns', () => {
    renderTable();
    expect(screen.queryByRole('columnheader', { name: /^Mode/ })).toBeNull();
    fireEvent.click(screen.getByRole('checkbox', { name: 'Mode' }));
    expect(screen.getByRole('columnheader', { name: /^Mode/ })).toBeTruthy();
    fireEvent.click(screen.getByRole('checkbox', { name: 'Pollster' }));
    expect(screen.queryByRole('columnheader', { name: /^Pollster/ })).toBeNull();
  });

  it('writes signed errors with their sign', () => {
    const table = renderTable();
    expect(column(table, /^Margin error/)).toEqual(['\u22122.50', '+0.25', '+10.00']);
  });
});
