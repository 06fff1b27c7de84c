/**
 * A large synthetic archive for load tests of the importers and the audit engine.
 *
 * Not part of the demo story: generic elections `bench-NNN-general`, each with 40 contests of
 * three options (blocs BA, BB and one option without a bloc), about 50 polls per contest from
 * 60 firms, each poll with four share rows (three options and `undecided`). The files follow the
 * same rules as real imports: every poll's contest exists in the results, shares add to exactly
 * 100, fieldwork end ≥ start and before election day, publication 1–4 days after fieldwork and
 * not after election day, sample sizes positive integers. Lines are built in bounded chunks.
 */
import { apportion, createRng } from './random';
import { CsvChunks, csvLine, dayNumber, isoDate } from './text';

const RESULTS_HEADER =
  'election_key,election_date,election_name,jurisdiction,contest_key,contest_name,option_key,option_name,bloc,votes,status,certified_on,source_url';
const POLLS_HEADER =
  'poll_key,pollster,sponsor,contest_key,fieldwork_start,fieldwork_end,published_on,sample_size,population,mode,moe,option_key,share';

const CONTESTS_PER_ELECTION = 40;
const POLLS_PER_CONTEST = 50;
const FIRMS = 60;
const MODES = ['phone', 'ivr', 'online', 'text', 'mixed', 'face', 'mail'] as const;
const POPULATIONS = ['lv', 'rv', 'a'] as const;
const OPTIONS = [
  { key: 'a', bloc: 'BA' },
  { key: 'b', bloc: 'BB' },
  { key: 'c', bloc: '' },
] as const;

interface BenchContest {
  readonly key: string;
  readonly electionDay: number;
  /** Certified shares of a, b, c (fractions). */
  readonly truth: readonly [number, number, number];
  /** Shared error of the contest, added to a and taken from b (fraction). */
  readonly bias: number;
}

export function generateBenchArchive(nPolls: number, seed: number | string = 1): { resultsCsv: string; pollsCsv: string } {
  if (!Number.isInteger(nPolls) || nPolls < 1) {
    throw new RangeError(`nPolls must be a positive integer, got ${nPolls}`);
  }
  const rng = createRng(`bench/${seed}`);
  const nContests = Math.max(1, Math.ceil(nPolls / POLLS_PER_CONTEST));
  const nElections = Math.ceil(nContests / CONTESTS_PER_ELECTION);
  const firstDay = dayNumber('2000-03-05');
  const dates = new Map<number, string>();
  const iso = (day: number): string => {
    let text = dates.get(day);
    if (text === undefined) {
      text = isoDate(day);
      dates.set(day, text);
    }
    return text;
  };

  const results = new CsvChunks();
  results.push(`${RESULTS_HEADER}\n`);
  const contests: BenchContest[] = [];
  for (let e = 0; e < nElections; e += 1) {
    const electionKey = `bench-${String(e + 1).padStart(3, '0')}-general`;
    const electionDay = firstDay + e * 91;
    const date = iso(electionDay);
    const electionName = `Benchmark general election ${e + 1}`;
    const certified = iso(electionDay + 14);
    const electionBias = rng.normal(0, 0.015);
    for (let c = 0; c < CONTESTS_PER_ELECTION && contests.length < nContests; c += 1) {
      const contestKey = `${electionKey}-c${String(c + 1).padStart(3, '0')}`;
      const third = rng.uniform(0.03, 0.15);
      const aShare = (1 - third) * rng.uniform(0.38, 0.62);
      const truth: [number, number, number] = [aShare, 1 - third - aShare, third];
      const votes = apportion(rng.int(20_000, 900_000), truth);
      contests.push({ key: contestKey, electionDay, truth, bias: electionBias + rng.normal(0, 0.01) });
      OPTIONS.forEach((o, i) => {
        results.push(csvLine([
          electionKey, date, electionName, `District ${c + 1}`, contestKey, `District ${c + 1} seat`,
          o.key, `Candidate ${o.key.toUpperCase()}`, o.bloc, votes[i] ?? 0, 'certified', certified,
          `https://results.example.org/bench/${contestKey}`,
        ]));
      });
    }
  }

  const firmLean = Array.from({ length: FIRMS }, () => rng.normal(0, 0.01));
  const polls = new CsvChunks();
  polls.push(`${POLLS_HEADER}\n`);
  for (let i = 0; i < nPolls; i += 1) {
    const contest = contests[i % contests.length] as BenchContest;
    const firm = rng.int(0, FIRMS - 1);
    const daysOut = rng.int(2, 60);
    const end = contest.electionDay - daysOut;
    const start = end - rng.int(0, 5);
    const published = end + Math.min(rng.int(1, 4), daysOut - 1);
    const n = rng.int(300, 2500);
    const undecided = rng.uniform(0.02, 0.15);
    const shift = contest.bias + (firmLean[firm] ?? 0);
    const sd = 1 / Math.sqrt(n);
    const a = Math.max(0.01, contest.truth[0] + shift + rng.normal(0, sd * 0.5));
    const b = Math.max(0.01, contest.truth[1] - shift + rng.normal(0, sd * 0.5));
    const c = Math.max(0.005, contest.truth[2] + rng.normal(0, sd * 0.25));
    const decided = (1 - undecided) / (a + b + c);
    const shares = apportion(100, [a * decided, b * decided, c * decided, undecided]);
    const firmName = `Bench Firm ${String(firm + 1).padStart(2, '0')}`;
    const head = `bench-poll-${String(i + 1).padStart(7, '0')},${firmName},,${contest.key},${iso(start)},${iso(end)},${iso(published)},${n},${POPULATIONS[firm % 3]},${MODES[firm % 7]},${(98 / Math.sqrt(n)).toFixed(1)},`;
    polls.push(`${head}a,${shares[0]}\n`);
    polls.push(`${head}b,${shares[1]}\n`);
    polls.push(`${head}c,${shares[2]}\n`);
    polls.push(`${head}undecided,${shares[3]}\n`);
  }
  return { resultsCsv: results.toString(), pollsCsv: polls.toString() };
}
