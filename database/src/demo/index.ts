/**
 * Veracast's demo scenario: the Republic of Almerand, an invented country (SPEC §9).
 *
 * Everything here is fiction: the country, its nine provinces, seven parties, fourteen polling
 * firms, candidates, sponsors and URLs (all under example.org). Screens that show it must label it
 * as fictional. The data come from a seeded generator (seedrandom's ARC4), so the same seed gives
 * byte-identical files on every machine.
 *
 * Elections (keys `almerand-<year>-<kind>`):
 *   - almerand-2014-general, almerand-2018-general, almerand-2022-general, almerand-2026-general:
 *     a national list vote (`…-national`), nine governor races (`…-<province>`, candidates by
 *     party, sometimes an independent with an empty bloc); 2026 also has a referendum question
 *     (`almerand-2026-general-fixed-terms`) and two governor races still provisional.
 *   - almerand-2020-referendum: one question (`almerand-2020-referendum-water-authority`),
 *     options `yes` / `no` with blocs YES / NO.
 * Blocs: OAK (Oakbound Union, and its regional ally Vennick Isles Compact, which stands in the
 * Vennick Isles governor race in its place), LAN (Lantern Party), TDL (Tidewater Liberals),
 * VRD (Verdant Commons), FWD (Forward Almerand, founded 2017); Lowland Farmers' List and
 * independents have no bloc.
 *
 * The shared miss (DEMO_SHARED_MISS): in almerand-2022-general most firms understated Oakbound by
 * about 3 points and overstated Lantern by about 1.5, so the OAK − LAN margin was about 4.5 points
 * too low in every contest. The other elections carry small shared errors (≤ 1.5 margin points;
 * the 2020 referendum polls understated YES by about 1.5 margin points while YES faded late).
 * Opinion moves late in every campaign, so early polls lag the result.
 *
 * CSV files follow SPEC §3 exactly, in that column order, `\n` line ends, no BOM, then extra
 * optional columns that an importer may read or ignore:
 *   - results.csv: `contest_kind` = national | province | referendum
 *   - polls.csv:   `sponsor_type` = media | academic | party | campaign | (empty: unsponsored)
 *                  `source_url`   = the (fictional) page where the poll was published
 * Provisional results have an empty `certified_on`. Firms' names sometimes appear under aliases
 * (DEMO_POLLSTERS[i].aliases), e.g. "Brightfen Polling Ltd" / "Brightfen Polling" /
 * "BRIGHTFEN POLLING LTD"; an importer should match them to one firm.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { buildDemoData, pollsCsvOf, resultsCsvOf, summarise, type DemoSummary } from './generate';

export const DEMO_DEFAULT_SEED = 20261202;

export interface DemoFiles {
  readonly resultsCsv: string;
  readonly pollsCsv: string;
  readonly summary: DemoSummary;
}

/** The whole demo scenario as two CSV files (results and polls) and a summary of counts. */
export function generateDemo(seed: number = DEMO_DEFAULT_SEED): DemoFiles {
  const data = buildDemoData(seed);
  const results = resultsCsvOf(data.elections);
  const polls = pollsCsvOf(data.polls);
  return {
    resultsCsv: results.csv,
    pollsCsv: polls.csv,
    summary: summarise(data, seed, results.rows, polls.rows),
  };
}

/** Writes `results.csv` and `polls.csv` into `dir` (created if missing); returns their paths. */
export function writeDemoFiles(
  dir: string,
  seed: number = DEMO_DEFAULT_SEED,
): { resultsPath: string; pollsPath: string; summary: DemoSummary } {
  const demo = generateDemo(seed);
  mkdirSync(dir, { recursive: true });
  const resultsPath = join(dir, 'results.csv');
  const pollsPath = join(dir, 'polls.csv');
  writeFileSync(resultsPath, demo.resultsCsv, 'utf8');
  writeFileSync(pollsPath, demo.pollsCsv, 'utf8');
  return { resultsPath, pollsPath, summary: demo.summary };
}

export { generateBenchArchive } from './bench';
export { POLLS_COLUMNS as DEMO_POLLS_COLUMNS, RESULTS_COLUMNS as DEMO_RESULTS_COLUMNS } from './generate';
export type { DemoSummary } from './generate';
export {
  DEMO_COUNTRY,
  DEMO_ELECTIONS,
  DEMO_PARTIES,
  DEMO_POLLSTERS,
  DEMO_PROVINCES,
  DEMO_SHARED_MISS,
} from './scenario';
export type {
  DemoElectionSpec,
  DemoParty,
  DemoPollster,
  DemoProvince,
  DemoReferendumSpec,
  DemoSponsor,
  PollMode,
  PollPopulation,
  SponsorType,
} from './scenario';
