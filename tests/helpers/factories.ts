import { POLL_COLUMNS, RESULT_COLUMNS } from '@veracast/shared-types';

type Row = Record<string, string | number>;

const csvLine = (cells: (string | number)[]) => cells.map((c) => (/[",\n;]/.test(String(c)) ? `"${String(c).replace(/"/g, '""')}"` : String(c))).join(',');

export function toCsv(columns: readonly string[], rows: Row[]): Buffer {
  return Buffer.from([csvLine([...columns]), ...rows.map((r) => csvLine(columns.map((c) => r[c] ?? '')))].join('\n') + '\n');
}

/** A result row of the small test election (two contests, three options each). */
export function buildResultRow(overrides: Row = {}): Row {
  return {
    election_key: 'tst-2030-general', election_date: '2030-05-05', election_name: 'Test general election 2030', jurisdiction: 'Testland',
    contest_key: 'tst-2030-national', contest_name: 'National vote', option_key: 'red', option_name: 'Red Party', bloc: 'RED',
    votes: 480000, status: 'certified', certified_on: '2030-05-20', source_url: 'https://example.org/results/2030', ...overrides,
  };
}

/** Certified results: national (red 48%, blue 45%, green 7%) and a province (red 40%, blue 52%, green 8%). */
export function buildResults(overrides: Row = {}): Row[] {
  const rows: Row[] = [];
  for (const [contest, votes] of [['tst-2030-national', [480000, 450000, 70000]], ['tst-2030-north', [40000, 52000, 8000]]] as const) {
    (['red', 'blue', 'green'] as const).forEach((key, i) => {
      rows.push(buildResultRow({ contest_key: contest, contest_name: contest === 'tst-2030-national' ? 'National vote' : 'North province', option_key: key, option_name: `${key[0]!.toUpperCase()}${key.slice(1)} Party`, bloc: key.toUpperCase(), votes: votes[i]!, ...overrides }));
    });
  }
  return rows;
}
export const resultsCsv = (rows: Row[] = buildResults()) => toCsv(RESULT_COLUMNS, rows);

/** One poll in the long layout: one row per option. */
export function buildPoll(overrides: Row = {}, shares: Record<string, number> = { red: 46, blue: 44, green: 6, undecided: 4 }): Row[] {
  const base: Row = {
    poll_key: 'tst-poll-1', pollster: 'Alpha Research', sponsor: 'Daily Test', contest_key: 'tst-2030-national', fieldwork_start: '2030-04-20',
    fieldwork_end: '2030-04-24', published_on: '2030-04-26', sample_size: 1000, population: 'lv', mode: 'online', moe: 3.1, ...overrides,
  };
  return Object.entries(shares).map(([option_key, share]) => ({ ...base, option_key, share }));
}
export const pollsCsv = (rows: Row[]) => toCsv(POLL_COLUMNS, rows);
