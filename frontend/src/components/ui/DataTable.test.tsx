import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { DataTable, createDataTableColumnHelper } from './DataTable';

interface Firm {
  id: number;
  name: string;
  polls: number;
}

const column = createDataTableColumnHelper<Firm>();
const columns = column.columns([
  column.accessor('name', { header: 'Firm' }),
  column.accessor('polls', { header: 'Polls', sortFn: 'basic' }),
]);

const firms: Firm[] = [
  { id: 1, name: 'Cobalt Research', polls: 12 },
  { id: 2, name: 'Aster Polling', polls: 3 },
  { id: 3, name: 'Birch & Co', polls: 40 },
];

function bodyColumn(table: HTMLElement, index: number): string[] {
  const [, body] = within(table).getAllByRole('rowgroup');
  return within(body!)
    .getAllByRole('row')
    .map((row) => within(row).getAllByRole('cell')[index]?.textContent ?? '');
}

afterEach(cleanup);

describe('DataTable', () => {
  it('keeps the given order until a heading is clicked, then sorts ascending and descending', () => {
    render(<DataTable caption="Firms" columns={columns} data={firms} getRowId={(f) => String(f.id)} />);
    const table = screen.getByRole('table', { name: 'Firms' });
    expect(bodyColumn(table, 0)).toEqual(['Cobalt Research', 'Aster Polling', 'Birch & Co']);

    const pollsHeading = screen.getByRole('columnheader', { name: /Polls/ });
    expect(pollsHeading.getAttribute('aria-sort')).toBe('none');

    fireEvent.click(within(pollsHeading).getByRole('button'));
    // [practice] numbers sort numerically, not as text: 3 < 12 < 40
    expect(bodyColumn(table, 1)).toEqual(['3', '12', '40']);
    expect(pollsHeading.getAttribute('aria-sort')).toBe('ascending');

    fireEvent.click(within(pollsHeading).getByRole('button'));
    expect(bodyColumn(table, 1)).toEqual(['40', '12', '3']);
    expect(pollsHeading.getAttribute('aria-sort')).toBe('descending');
  });

  it('sorts text columns alphabetically', () => {
    render(<DataTable caption="Firms" columns={columns} data={firms} />);
    fireEvent.click(within(screen.getByRole('columnheader', { name: /Firm/ })).getByRole('button'));
    expect(bodyColumn(screen.getByRole('table'), 0)).toEqual(['Aster Polling', 'Birch & Co', 'Cobalt Research']);
  });

  it('filters rows with the search box', () => {
    render(<DataTable caption="Firms" columns={columns} data={firms} searchLabel="Search firms" />);
    fireEvent.change(screen.getByLabelText('Search firms'), { target: { value: 'birch' } });
    expect(bodyColumn(screen.getByRole('table'), 0)).toEqual(['Birch & Co']);
    fireEvent.change(screen.getByLabelText('Search firms'), { target: { value: 'nobody' } });
    expect(screen.getByText('No rows match the search.')).toBeTruthy();
  });

  it('pages through rows', () => {
    render(<DataTable caption="Firms" columns={columns} data={firms} pageSize={2} />);
    const table = screen.getByRole('table');
    expect(bodyColumn(table, 0)).toEqual(['Cobalt Research', 'Aster Polling']);
    expect(screen.getByText('Rows 1–2 of 3')).toBeTruthy();
    expect((screen.getByRole('button', { name: 'Previous page' }) as HTMLButtonElement).disabled).toBe(true);

    fireEvent.click(screen.getByRole('button', { name: 'Next page' }));
    expect(bodyColumn(table, 0)).toEqual(['Birch & Co']);
    expect(screen.getByText('Rows 3–3 of 3')).toBeTruthy();
    expect((screen.getByRole('button', { name: 'Next page' }) as HTMLButtonElement).disabled).toBe(true);
  });

  it('says so when there are no rows', () => {
    render(<DataTable caption="Firms" columns={columns} data={[]} emptyMessage="No firms yet." />);
    expect(screen.getByText('No firms yet.')).toBeTruthy();
  });
});
