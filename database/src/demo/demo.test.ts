import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import {
  DEMO_POLLSTERS,
  DEMO_SHARED_MISS,
  generateBenchArchive,
  generateDemo,
  writeDemoFiles,
} from './index';
import { apportion } from './random';
import { csvField } from './text';

// The column lists of SPEC.md §3, typed out from the spec (not imported from the module).
const SPEC_RESULTS_HEADER =
  'election_key,election_date,election_name,jurisdiction,contest_key,contest_name,option_key,option_name,bloc,votes,status,certified_on,source_url';
const SPEC_POLLS_HEADER =
  'poll_key,pollster,sponsor,contest_key,fieldwork_start,fieldwork_end,published_on,sample_size,population,mode,moe,option_key,share';

type Row = Record<string, string>;

function parseCsv(text: string): Row[] {
  const parsed = Papa.parse<Row>(text, { header: true, skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
}

function day(iso: string): number {
  expect(iso).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  const ms = Date.parse(`${iso}T00:00:00Z`);
  expect(new Date(ms).toISOString().slice(0, 10)).toBe(iso);
  return ms / 86_400_000;
}

interface Contest {
  election: string;
  electionDay: number;
  options: Map<string, { bloc: string; votes: number }>;
}

interface Poll {
  key: string;
  rows: Row[];
  first: Row;
}

interface Archive {
  results: Row[];
  contests: Map<string, Contest>;
  /** Orientation blocs per election: the two blocs with the most certified votes (SPEC §4). */
  orientation: Map<string, [string, string]>;
  polls: Poll[];
}

function load(resultsCsv: string, pollsCsv: string): Archive {
  const results = parseCsv(resultsCsv);
  const contests = new Map<string, Contest>();
  const blocVotes = new Map<string, Map<string, number>>();
  for (const r of results) {
    const key = r.contest_key ?? '';
    let contest = contests.get(key);
    if (!contest) {
      contest = { election: r.election_key ?? '', electionDay: day(r.election_date ?? ''), options: new Map() };
      contests.set(key, contest);
    }
    contest.options.set(r.option_key ?? '', { bloc: r.bloc ?? '', votes: Number(r.votes) });
    if (r.bloc) {
      const perElection = blocVotes.get(contest.election) ?? new Map<string, number>();
      perElection.set(r.bloc, (perElection.get(r.bloc) ?? 0) + Number(r.votes));
      blocVotes.set(contest.election, perElection);
    }
  }
  const orientation = new Map<string, [string, string]>();
  for (const [election, totals] of blocVotes) {
    const sorted = [...totals].sort((a, b) => b[1] - a[1]);
    orientation.set(election, [sorted[0]?.[0] ?? '', sorted[1]?.[0] ?? '']);
  }
  const byKey = new Map<string, Row[]>();
  for (const r of parseCsv(pollsCsv)) {
    const rows = byKey.get(r.poll_key ?? '') ?? [];
    rows.push(r);
    byKey.set(r.poll_key ?? '', rows);
  }
  const polls = [...byKey].map(([key, rows]) => ({ key, rows, first: rows[0] as Row }));
  return { results, contests, orientation, polls };
}

/**
 * Signed margin error of a poll, SPEC §4 / METHODS §1: (pA − pB) − (VA − VB) in points, shares
 * as published (raw treatment), A and B given as blocs. Undefined when a bloc does not stand.
 */
function marginError(archive: Archive, poll: Poll, blocA: string, blocB: string): number | undefined {
  const contest = archive.contests.get(poll.first.contest_key ?? '');
  if (!contest) return undefined;
  const total = [...contest.options.values()].reduce((a, o) => a + o.votes, 0);
  const optionOf = (bloc: string) => [...contest.options].find(([, o]) => o.bloc === bloc);
  const a = optionOf(blocA);
  const b = optionOf(blocB);
  if (!a || !b) return undefined;
  const share = (key: string) => Number(poll.rows.find((r) => r.option_key === key)?.share ?? NaN);
  const certified = (100 * (a[1].votes - b[1].votes)) / total;
  return share(a[0]) - share(b[0]) - certified;
}

/** Polls whose fieldwork ended 0–21 days before election day (the default audit window, SPEC §5). */
function inWindow(archive: Archive, poll: Poll): boolean {
  const contest = archive.contests.get(poll.first.contest_key ?? '');
  if (!contest) return false;
  const daysOut = contest.electionDay - day(poll.first.fieldwork_end ?? '');
  return daysOut >= 0 && daysOut <= 21;
}

function electionErrors(archive: Archive, election: string): number[] {
  const [a, b] = archive.orientation.get(election) ?? ['', ''];
  const errors: number[] = [];
  for (const poll of archive.polls) {
    const contest = archive.contests.get(poll.first.contest_key ?? '');
    if (contest?.election !== election || !inWindow(archive, poll)) continue;
    const e = marginError(archive, poll, a, b);
    if (e !== undefined) errors.push(e);
  }
  return errors;
}

const mean = (xs: readonly number[]) => xs.reduce((s, x) => s + x, 0) / xs.length;

const canonicalOf = new Map<string, string>();
for (const f of DEMO_POLLSTERS) for (const spelling of [f.name, ...f.aliases]) canonicalOf.set(spelling, f.name);

const demo = generateDemo();
const archive = load(demo.resultsCsv, demo.pollsCsv);

describe('generateDemo: determinism', () => {
  it('gives byte-identical files for the same seed, and the default seed is 20261202', () => {
    const again = generateDemo(20261202);
    expect(again.resultsCsv).toBe(demo.resultsCsv);
    expect(again.pollsCsv).toBe(demo.pollsCsv);
    expect(again.summary).toEqual(demo.summary);
  });

  it('gives different numbers for a different seed, with the same names', () => {
    const other = generateDemo(7);
    expect(other.resultsCsv).not.toBe(demo.resultsCsv);
    expect(other.pollsCsv).not.toBe(demo.pollsCsv);
    const contestsOf = (csv: string) => new Set(parseCsv(csv).map((r) => r.contest_key));
    expect(contestsOf(other.resultsCsv)).toEqual(contestsOf(demo.resultsCsv));
  });
});

describe('generateDemo: file format', () => {
  it('starts with the exact SPEC §3 headers, extra columns only after them', () => {
    const resultsHeader = demo.resultsCsv.slice(0, demo.resultsCsv.indexOf('\n'));
    const pollsHeader = demo.pollsCsv.slice(0, demo.pollsCsv.indexOf('\n'));
    expect(resultsHeader).toBe(`${SPEC_RESULTS_HEADER},contest_kind`);
    expect(pollsHeader).toBe(`${SPEC_POLLS_HEADER},sponsor_type,source_url`);
  });

  it('quotes cells that hold commas so a CSV reader gets them back whole', () => {
    expect(csvField('Institute for Civic Studies, Oridane')).toBe('"Institute for Civic Studies, Oridane"');
    expect(csvField('say "yes"')).toBe('"say ""yes"""');
    expect(csvField("Lowland Farmers' List")).toBe("Lowland Farmers' List");
    const sponsors = new Set(archive.polls.map((p) => p.first.sponsor));
    expect(sponsors.has('Institute for Civic Studies, Oridane')).toBe(true);
  });

  it('writes the same two files to disk', () => {
    const dir = mkdtempSync(join(tmpdir(), 'veracast-demo-'));
    try {
      const written = writeDemoFiles(dir);
      expect(readFileSync(written.resultsPath, 'utf8')).toBe(demo.resultsCsv);
      expect(readFileSync(written.pollsPath, 'utf8')).toBe(demo.pollsCsv);
      expect(written.resultsPath).toBe(join(dir, 'results.csv'));
      expect(written.pollsPath).toBe(join(dir, 'polls.csv'));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('generateDemo: certified results', () => {
  it('has at least four elections, about ten provinces, a referendum and whole vote counts', () => {
    const elections = new Set(archive.results.map((r) => r.election_key));
    // [practice] the brief asks for at least 4 elections over time
    expect(elections.size).toBeGreaterThanOrEqual(4);
    const provinces = new Set(archive.results.filter((r) => r.contest_kind === 'province').map((r) => r.jurisdiction));
    // [practice] the brief asks for about 8–10 provinces
    expect(provinces.size).toBeGreaterThanOrEqual(8);
    expect(provinces.size).toBeLessThanOrEqual(10);
    for (const key of elections) expect(key).toMatch(/^almerand-\d{4}-(general|referendum)$/);

    const referendums = [...archive.contests].filter(([, c]) =>
      c.options.size === 2 && c.options.get('yes')?.bloc === 'YES' && c.options.get('no')?.bloc === 'NO');
    expect(referendums.length).toBeGreaterThanOrEqual(1);

    for (const r of archive.results) {
      expect(r.votes).toMatch(/^[1-9]\d*$/);
      expect(r.contest_key).toMatch(/^[a-z0-9][a-z0-9._-]{0,99}$/);
      expect(r.option_key).toMatch(/^[a-z0-9][a-z0-9._-]{0,99}$/);
      expect(r.source_url).toMatch(/^https:\/\/[a-z.]*example\.org\//);
      if (r.status === 'certified') {
        expect(day(r.certified_on ?? '')).toBeGreaterThan(day(r.election_date ?? ''));
      } else {
        expect(r.status).toBe('provisional');
        expect(r.certified_on).toBe('');
      }
    }
  });

  it('keeps a couple of recent contests provisional and the rest certified', () => {
    const provisional = new Set(archive.results.filter((r) => r.status === 'provisional').map((r) => r.contest_key));
    // [practice] the brief allows "a couple of provinces" of one recent election to stay provisional
    expect(provisional.size).toBe(2);
    for (const key of provisional) expect(key).toMatch(/^almerand-2026-general-/);
  });

  it('has blocs shared by an ally, parties without a bloc, and never two options of one bloc in a contest', () => {
    const partiesPerBloc = new Map<string, Set<string>>();
    for (const r of archive.results) {
      if (!r.bloc || r.bloc === 'YES' || r.bloc === 'NO') continue;
      const set = partiesPerBloc.get(r.bloc) ?? new Set<string>();
      set.add(r.option_key ?? '');
      partiesPerBloc.set(r.bloc, set);
    }
    expect([...partiesPerBloc.values()].some((s) => s.size >= 2)).toBe(true);
    expect(archive.results.some((r) => r.bloc === '' && r.option_key?.startsWith('ind-'))).toBe(true);
    expect(archive.results.some((r) => r.bloc === '' && r.option_key === 'farmers')).toBe(true);
    for (const contest of archive.contests.values()) {
      const blocs = [...contest.options.values()].map((o) => o.bloc).filter((b) => b !== '');
      expect(new Set(blocs).size).toBe(blocs.length);
    }
  });
});

describe('generateDemo: polls', () => {
  it('has about 1,000 polls from at least 12 firms, some under variant spellings', () => {
    // [practice] the brief asks for about 1,000 polls
    expect(archive.polls.length).toBeGreaterThanOrEqual(900);
    expect(archive.polls.length).toBeLessThanOrEqual(1100);
    expect(demo.summary.polls).toBe(archive.polls.length);
    expect(demo.summary.pollRows).toBe(archive.polls.reduce((n, p) => n + p.rows.length, 0));

    const spellings = new Set(archive.polls.map((p) => p.first.pollster ?? ''));
    for (const s of spellings) expect(canonicalOf.has(s)).toBe(true);
    const firms = new Set([...spellings].map((s) => canonicalOf.get(s)));
    // [practice] the brief asks for at least 12 polling firms
    expect(firms.size).toBeGreaterThanOrEqual(12);
    expect(spellings.size).toBeGreaterThan(firms.size);
  });

  it('has every kind of sponsor, mode and population', () => {
    const types = new Set(archive.polls.map((p) => p.first.sponsor_type));
    for (const t of ['media', 'academic', 'party', 'campaign', '']) expect(types.has(t)).toBe(true);
    const modes = new Set(archive.polls.map((p) => p.first.mode));
    // SPEC §3 lists seven modes and three populations
    for (const m of ['phone', 'ivr', 'online', 'text', 'mixed', 'face', 'mail']) expect(modes.has(m)).toBe(true);
    const populations = new Set(archive.polls.map((p) => p.first.population));
    expect([...populations].sort()).toEqual(['a', 'lv', 'rv']);
    expect(archive.polls.some((p) => p.first.moe === '')).toBe(true);
    expect(archive.polls.some((p) => p.first.moe !== '')).toBe(true);
  });

  it('has valid shares: known options, undecided always, one decimal at most, summing to 99–100.5', () => {
    for (const poll of archive.polls) {
      const contest = archive.contests.get(poll.first.contest_key ?? '');
      expect(contest, poll.key).toBeDefined();
      let sum = 0;
      const seen = new Set<string>();
      for (const r of poll.rows) {
        // every poll-level column is the same on all rows of one poll
        for (const col of ['pollster', 'contest_key', 'fieldwork_start', 'fieldwork_end', 'published_on', 'sample_size', 'moe']) {
          expect(r[col]).toBe(poll.first[col]);
        }
        const option = r.option_key ?? '';
        expect(seen.has(option)).toBe(false);
        seen.add(option);
        expect(option === 'undecided' || option === 'other' || contest?.options.has(option)).toBe(true);
        expect(r.share).toMatch(/^\d{1,3}(\.\d)?$/);
        sum += Number(r.share);
      }
      expect(seen.has('undecided')).toBe(true);
      // [practice] published totals differ from 100 only by rounding; SPEC §3 rejects sums past 100.5
      expect(sum).toBeGreaterThanOrEqual(99 - 1e-9);
      expect(sum).toBeLessThanOrEqual(100.5 + 1e-9);
    }
    expect(archive.polls.some((p) => p.rows.some((r) => r.option_key === 'other'))).toBe(true);
  });

  it('has valid sizes, margins of error and dates within the rules', () => {
    let withinSixWeeks = 0;
    for (const poll of archive.polls) {
      const r = poll.first;
      expect(r.sample_size).toMatch(/^[1-9]\d*$/);
      if (r.moe !== '') expect(Number(r.moe)).toBeGreaterThan(0);
      const contest = archive.contests.get(r.contest_key ?? '');
      const election = contest?.electionDay ?? NaN;
      const start = day(r.fieldwork_start ?? '');
      const end = day(r.fieldwork_end ?? '');
      const published = day(r.published_on ?? '');
      expect(end).toBeGreaterThanOrEqual(start);
      expect(end).toBeLessThan(election);
      // [practice] the brief: published 1–4 days after fieldwork ends, never after election day
      expect(published - end).toBeGreaterThanOrEqual(1);
      expect(published - end).toBeLessThanOrEqual(4);
      expect(published).toBeLessThanOrEqual(election);
      if (election - end <= 42) withinSixWeeks += 1;
    }
    // [practice] "mostly within the last 6 weeks": at least three in four
    expect(withinSixWeeks / archive.polls.length).toBeGreaterThanOrEqual(0.75);
    expect(withinSixWeeks).toBeLessThan(archive.polls.length);
  });
});

describe('generateDemo: the errors the analyses should find', () => {
  it('orients the shared-miss election on the designed blocs', () => {
    expect(archive.orientation.get(DEMO_SHARED_MISS.electionKey)).toEqual([DEMO_SHARED_MISS.blocA, DEMO_SHARED_MISS.blocB]);
  });

  it.each([20261202, 1, 2, 3])('seed %i: the shared-miss election misses by the designed margin, the others by little', (seed) => {
    const data = seed === 20261202 ? archive : (() => {
      const d = generateDemo(seed);
      return load(d.resultsCsv, d.pollsCsv);
    })();
    const missErrors = electionErrors(data, DEMO_SHARED_MISS.electionKey);
    expect(missErrors.length).toBeGreaterThan(50);
    // [practice] design value DEMO_SHARED_MISS.marginPoints (−4.5, the scenario's input);
    // house leans, sampling noise and undecided attenuation may move the mean by up to 1 point
    expect(Math.abs(mean(missErrors) - DEMO_SHARED_MISS.marginPoints)).toBeLessThan(1);

    for (const election of data.orientation.keys()) {
      if (election === DEMO_SHARED_MISS.electionKey) continue;
      const errors = electionErrors(data, election);
      expect(errors.length).toBeGreaterThan(20);
      // [practice] the other elections' designed shared errors are ≤ 1.2 margin points, plus lag
      expect(Math.abs(mean(errors))).toBeLessThan(2.5);
    }
  });

  it('shows the miss in most firms, not just a few', () => {
    const perFirm = new Map<string, number[]>();
    for (const poll of archive.polls) {
      const contest = archive.contests.get(poll.first.contest_key ?? '');
      if (contest?.election !== DEMO_SHARED_MISS.electionKey || !inWindow(archive, poll)) continue;
      const e = marginError(archive, poll, DEMO_SHARED_MISS.blocA, DEMO_SHARED_MISS.blocB);
      if (e === undefined) continue;
      const firm = canonicalOf.get(poll.first.pollster ?? '') ?? '';
      perFirm.set(firm, [...(perFirm.get(firm) ?? []), e]);
    }
    const firms = [...perFirm.values()].filter((xs) => xs.length >= 3);
    const negative = firms.filter((xs) => mean(xs) < 0).length;
    // [practice] "shared by most firms": at least two thirds understate the winner's margin
    expect(negative / firms.length).toBeGreaterThanOrEqual(2 / 3);
  });

  it('gives firms house effects that show through the shared error', () => {
    // Beaconrow Data leans 3 points to OAK, Halloway & Finch 2.5 to LAN (scenario inputs): over
    // the same elections their OAK − LAN errors must differ clearly, in that direction.
    const firmMean = (name: string) => {
      const errors: number[] = [];
      for (const poll of archive.polls) {
        if (canonicalOf.get(poll.first.pollster ?? '') !== name) continue;
        const contest = archive.contests.get(poll.first.contest_key ?? '');
        if (!contest || !/-(2022|2026)-general$/.test(contest.election)) continue;
        const e = marginError(archive, poll, 'OAK', 'LAN');
        if (e !== undefined) errors.push(e);
      }
      return mean(errors);
    };
    // [practice] a 5.5-point share lean gap is about 8 margin points; half of it must show
    expect(firmMean('Beaconrow Data') - firmMean('Halloway & Finch')).toBeGreaterThan(4);
  });

  it('moves opinion late in the campaign, so early polls lag the result', () => {
    // Forward Almerand rose by 3 points over the 2022 campaign (scenario input).
    const fwd = (from: number, to: number) => {
      const shares: number[] = [];
      for (const poll of archive.polls) {
        if (poll.first.contest_key !== 'almerand-2022-general-national') continue;
        const daysOut = (archive.contests.get('almerand-2022-general-national')?.electionDay ?? 0) - day(poll.first.fieldwork_end ?? '');
        const row = poll.rows.find((r) => r.option_key === 'forward');
        if (row && daysOut >= from && daysOut <= to) shares.push(Number(row.share));
      }
      return mean(shares);
    };
    // [practice] at least a third of the designed 3-point rise must separate early from late polls
    expect(fwd(0, 10) - fwd(36, 120)).toBeGreaterThan(1);
  });
});

describe('apportion', () => {
  it('splits a whole total by largest remainders, ties to the earlier item', () => {
    // [computed] by hand: 10/3 = 3.33 each, one unit left goes to the first
    expect(apportion(10, [1, 1, 1])).toEqual([4, 3, 3]);
    // [computed] by hand: 100 × (0.375, 0.25, 0.375) = 37.5, 25, 37.5 → 38, 25, 37
    expect(apportion(100, [3, 2, 3])).toEqual([38, 25, 37]);
  });
});

describe('generateBenchArchive', () => {
  it('is deterministic and valid by the import rules', () => {
    const bench = generateBenchArchive(2_000, 5);
    expect(generateBenchArchive(2_000, 5)).toEqual(bench);
    expect(generateBenchArchive(2_000, 6).pollsCsv).not.toBe(bench.pollsCsv);
    expect(bench.resultsCsv.slice(0, bench.resultsCsv.indexOf('\n'))).toBe(SPEC_RESULTS_HEADER);
    expect(bench.pollsCsv.slice(0, bench.pollsCsv.indexOf('\n'))).toBe(SPEC_POLLS_HEADER);

    const data = load(bench.resultsCsv, bench.pollsCsv);
    expect(data.polls.length).toBe(2_000);
    const keys = new Set<string>();
    for (const poll of data.polls) {
      expect(keys.has(poll.key)).toBe(false);
      keys.add(poll.key);
      const contest = data.contests.get(poll.first.contest_key ?? '');
      expect(contest).toBeDefined();
      expect(poll.rows.length).toBe(4);
      const sum = poll.rows.reduce((s, r) => s + Number(r.share), 0);
      // SPEC §3: a poll's shares may not sum past 100.5
      expect(sum).toBeLessThanOrEqual(100.5);
      expect(sum).toBeGreaterThanOrEqual(99);
      expect(poll.first.sample_size).toMatch(/^[1-9]\d*$/);
      const start = day(poll.first.fieldwork_start ?? '');
      const end = day(poll.first.fieldwork_end ?? '');
      const published = day(poll.first.published_on ?? '');
      expect(end).toBeGreaterThanOrEqual(start);
      expect(end).toBeLessThan(contest?.electionDay ?? NaN);
      expect(published).toBeGreaterThan(end);
      expect(published).toBeLessThanOrEqual(contest?.electionDay ?? NaN);
    }
  });

  it('rejects a non-positive or fractional poll count', () => {
    expect(() => generateBenchArchive(0, 1)).toThrow(RangeError);
    expect(() => generateBenchArchive(2.5, 1)).toThrow(RangeError);
  });

  it('builds 100,000 polls (400,000 share rows) in a few seconds', () => {
    const started = performance.now();
    const bench = generateBenchArchive(100_000, 1);
    const elapsed = performance.now() - started;
    let lines = 0;
    for (let i = bench.pollsCsv.indexOf('\n'); i !== -1; i = bench.pollsCsv.indexOf('\n', i + 1)) lines += 1;
    // header + 4 rows per poll
    expect(lines).toBe(1 + 400_000);
    // [practice] "a few seconds"; measured about 0.6 s on the 2-core dev machine
    expect(elapsed).toBeLessThan(8_000);
  }, 30_000);
});
