import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { ContestKind, Mode, Population, ResultStatus, SponsorType } from '@veracast/shared-types';
import { DISCLOSURE_ITEMS, type DisclosureDto } from '@veracast/shared-types';
import { rawRows, withSnapshot, type SelectRows } from '../db/raw';

/** Set-based loaders of the archive (elections, contests with options, polls with shares). */

export interface ElectionRow {
  id: number; key: string; name: string; date: string; jurisdiction: string; blocA: string | null; blocB: string | null;
  blackoutStart: string | null; blackoutEnd: string | null; fictional: boolean;
}
export interface OptionRow { key: string; name: string; bloc: string | null; votes: number | null }
export interface ContestRow {
  id: number; key: string; name: string; kind: ContestKind; electionId: number; status: ResultStatus | null; certifiedOn: string | null;
  certifyingBody: string | null; sourceUrl: string | null; rejectedBallots: number | null; electorate: number | null; options: OptionRow[];
}
export interface PollRow {
  id: number; key: string; pollsterId: number; pollster: string; sponsor: string | null; sponsorType: SponsorType | null; contestId: number;
  fieldworkStart: string; fieldworkEnd: string; publishedOn: string; sampleSize: number; population: Population; mode: Mode; moe: number | null;
  studyKey: string | null; isHeadline: boolean; tracking: boolean; sourceUrl: string | null; questionWording: boolean; weightingStatement: boolean;
  tablesUrl: string | null; shares: Record<string, number>;
}

const day = (v: unknown) => (v == null ? null : String(v).slice(0, 10));
const num = (v: unknown) => (v == null ? null : Number(v));

/** Elections (newest first); in `transaction` when given (so that they belong to its snapshot). */
export async function loadElections(s: Sequelize, where: { keys?: string[]; ids?: number[] } = {}, transaction?: Transaction): Promise<ElectionRow[]> {
  const cond = where.keys ? 'WHERE `key` IN (:keys)' : where.ids ? 'WHERE id IN (:ids)' : '';
  if ((where.keys && !where.keys.length) || (where.ids && !where.ids.length)) return [];
  const rows = await s.query<Record<string, unknown>>(`SELECT * FROM elections ${cond} ORDER BY election_date DESC, \`key\``, { replacements: where, type: QueryTypes.SELECT, transaction });
  return rows.map((r) => ({
    id: Number(r.id), key: String(r.key), name: String(r.name), date: day(r.election_date)!, jurisdiction: String(r.jurisdiction),
    blocA: (r.bloc_a as string | null) ?? null, blocB: (r.bloc_b as string | null) ?? null, blackoutStart: day(r.blackout_start), blackoutEnd: day(r.blackout_end),
    fictional: Boolean(Number(r.fictional)),
  }));
}

/** Contests with their options (most votes first); in `transaction` when given. */
export async function loadContests(s: Sequelize, where: { electionIds?: number[]; keys?: string[]; ids?: number[] }, transaction?: Transaction): Promise<ContestRow[]> {
  const [col, vals] = where.electionIds ? ['election_id', where.electionIds] : where.keys ? ['`key`', where.keys] : ['id', where.ids ?? []];
  if (!vals.length) return [];
  const rows = await s.query<Record<string, unknown>>(
    `SELECT id, \`key\`, name, kind, election_id, result_status, certified_on, certifying_body, source_url, rejected_ballots, electorate FROM contests WHERE ${col} IN (:vals) ORDER BY \`key\``,
    { replacements: { vals }, type: QueryTypes.SELECT, transaction },
  );
  const contests: ContestRow[] = rows.map((r) => ({
    id: Number(r.id), key: String(r.key), name: String(r.name), kind: r.kind as ContestKind, electionId: Number(r.election_id),
    status: (r.result_status as ResultStatus | null) ?? null, certifiedOn: day(r.certified_on), certifyingBody: (r.certifying_body as string | null) ?? null,
    sourceUrl: (r.source_url as string | null) ?? null, rejectedBallots: num(r.rejected_ballots), electorate: num(r.electorate), options: [],
  }));
  const byId = new Map(contests.map((c) => [c.id, c]));
  if (contests.length) {
    const opts = await s.query<Record<string, unknown>>('SELECT contest_id, `key`, name, bloc, votes FROM options WHERE contest_id IN (:ids) ORDER BY votes DESC, `key`', {
      replacements: { ids: contests.map((c) => c.id) }, type: QueryTypes.SELECT, transaction,
    });
    for (const o of opts) byId.get(Number(o.contest_id))?.options.push({ key: String(o.key), name: String(o.name), bloc: (o.bloc as string | null) || null, votes: num(o.votes) });
  }
  return contests;
}

/** Which polls to read: of these contests, of this firm, with these keys (all given conditions hold). */
export interface PollFilter {
  contestIds?: number[];
  pollsterId?: number;
  keys?: string[];
}

/**
 * Polls with their shares (option keys in code-unit order), ordered by fieldwork end then key
 * (code-unit order). Two set-based statements in one read-only snapshot, through the raw
 * connection, sorted here rather than by the server: at 100,000 polls this takes ~0.8 s where
 * Sequelize's row mapping took ~3 s (an ORDER BY on the server costs more than the sort here).
 */
export async function loadPolls(s: Sequelize, where: PollFilter): Promise<PollRow[]> {
  return withSnapshot(s, (select) => readPolls(select, where));
}

/**
 * Polls as {@link loadPolls} returns them, read with `select` (rows as arrays, see `rawRows`):
 * both statements see the same state when `select` runs in one snapshot. Used on any connection
 * of the mariadb connector, in the audit worker threads too.
 */
export async function readPolls(select: SelectRows, where: PollFilter): Promise<PollRow[]> {
  if ((where.contestIds && !where.contestIds.length) || (where.keys && !where.keys.length)) return [];
  const conds: string[] = [];
  const values: unknown[] = [];
  if (where.contestIds) {
    conds.push('p.contest_id IN (?)');
    values.push(where.contestIds);
  }
  if (where.pollsterId !== undefined) {
    conds.push('p.pollster_id = ?');
    values.push(where.pollsterId);
  }
  if (where.keys) {
    conds.push('p.`key` IN (?)');
    values.push(where.keys);
  }
  const filter = conds.length ? `WHERE ${conds.join(' AND ')}` : '';
  const rows = await select(
    `SELECT p.id, p.\`key\`, p.pollster_id, p.contest_id, p.fieldwork_start, p.fieldwork_end, p.published_on, p.sample_size, p.population, p.mode, p.moe,
       p.study_key, p.is_headline, p.tracking, p.source_url, p.question_wording, p.weighting_statement, p.tables_url,
       f.name AS pollster_name, sp.name AS sponsor_name, sp.type AS sponsor_type
     FROM polls p JOIN pollsters f ON f.id = p.pollster_id LEFT JOIN sponsors sp ON sp.id = p.sponsor_id ${filter}`,
    values,
  );
  const shareRows = await select(`SELECT x.poll_id, x.option_key, x.share FROM poll_shares x JOIN polls p ON p.id = x.poll_id ${filter}`, values);
  return pollRows(rows, shareRows);
}

function pollRows(rows: unknown[][], shareRows: unknown[][]): PollRow[] {
  const polls: PollRow[] = new Array<PollRow>(rows.length);
  const byId = new Map<number, PollRow>();
  for (let i = 0; i < polls.length; i++) {
    const r = rows[i]!;
    const id = Number(r[0]);
    const poll: PollRow = {
      id, key: String(r[1]), pollsterId: Number(r[2]), pollster: String(r[18]), sponsor: (r[19] as string | null) ?? null,
      sponsorType: (r[20] as SponsorType | null) ?? null, contestId: Number(r[3]), fieldworkStart: day(r[4])!, fieldworkEnd: day(r[5])!,
      publishedOn: day(r[6])!, sampleSize: Number(r[7]), population: r[8] as Population, mode: r[9] as Mode, moe: num(r[10]),
      studyKey: (r[11] as string | null) ?? null, isHeadline: Boolean(Number(r[12])), tracking: Boolean(Number(r[13])),
      sourceUrl: (r[14] as string | null) ?? null, questionWording: Boolean(Number(r[15])), weightingStatement: Boolean(Number(r[16])),
      tablesUrl: (r[17] as string | null) ?? null, shares: {},
    };
    polls[i] = poll;
    byId.set(id, poll);
  }
  // Shares usually arrive in key order per poll (the primary key's); a poll whose did not is re-sorted.
  const lastKey = new Map<PollRow, string>();
  const unsorted = new Set<PollRow>();
  for (const r of shareRows) {
    const poll = byId.get(Number(r[0]));
    if (!poll) continue;
    const key = String(r[1]);
    const last = lastKey.get(poll);
    if (last !== undefined && key < last) unsorted.add(poll);
    lastKey.set(poll, key);
    poll.shares[key] = Number(r[2]);
  }
  for (const poll of unsorted) {
    const sorted: Record<string, number> = {};
    for (const key of Object.keys(poll.shares).sort(codeUnits)) sorted[key] = poll.shares[key]!;
    poll.shares = sorted;
  }
  return polls.sort(byFieldworkEndThenKey);
}

/** How many polls the elections hold, in all. */
export async function countElectionPolls(s: Sequelize, electionIds: readonly number[]): Promise<number> {
  if (!electionIds.length) return 0;
  const [row] = await rawRows(s, 'SELECT COUNT(*) FROM polls p JOIN contests k ON k.id = p.contest_id WHERE k.election_id IN (?)', [[...electionIds]]);
  return Number(row?.[0] ?? 0);
}

/** Poll counts per contest, set-based (for splitting work before reading the polls). */
export async function countPolls(s: Sequelize, contestIds: readonly number[], transaction?: Transaction): Promise<Map<number, number>> {
  if (!contestIds.length) return new Map();
  const rows = await rawRows(s, 'SELECT contest_id, COUNT(*) FROM polls WHERE contest_id IN (?) GROUP BY contest_id', [[...contestIds]], transaction);
  return new Map(rows.map((r) => [Number(r[0]), Number(r[1])]));
}

const codeUnits = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
/** The order of polls everywhere: fieldwork end, then key (code units). */
export const byFieldworkEndThenKey = (a: { fieldworkEnd: string; key: string }, b: { fieldworkEnd: string; key: string }) =>
  codeUnits(a.fieldworkEnd, b.fieldworkEnd) || codeUnits(a.key, b.key);

/** Certified shares in points: votes over the sum of all options' votes. */
export function certifiedShares(options: readonly OptionRow[]): Record<string, number> | null {
  const total = options.reduce((a, o) => a + (o.votes ?? 0), 0);
  if (!total) return null;
  return Object.fromEntries(options.map((o) => [o.key, (100 * (o.votes ?? 0)) / total]));
}

/**
 * An election's orientation blocs: the ones a reviewer set, else the two blocs with the most
 * certified votes summed over its contests (A the larger) — SPEC §4.
 */
export function orientationOf(election: ElectionRow, contests: readonly ContestRow[]): { blocA: string | null; blocB: string | null; source: 'set' | 'default' | 'none' } {
  if (election.blocA && election.blocB) return { blocA: election.blocA, blocB: election.blocB, source: 'set' };
  const totals = new Map<string, number>();
  for (const c of contests) if (c.electionId === election.id) for (const o of c.options) if (o.bloc) totals.set(o.bloc, (totals.get(o.bloc) ?? 0) + (o.votes ?? 0));
  const ranked = [...totals].filter(([, v]) => v > 0).sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1));
  if (ranked.length < 2) return { blocA: null, blocB: null, source: 'none' };
  return { blocA: ranked[0]![0], blocB: ranked[1]![0], source: 'default' };
}

/** `disclosureOf(p).completeness` without building the items (for every poll of an audit). */
export function disclosureCompleteness(p: PollRow): number {
  const present = (p.sponsor ? 1 : 0) + (p.pollster ? 1 : 0) + (p.fieldworkStart && p.fieldworkEnd ? 1 : 0) + (p.population ? 1 : 0) + (p.sampleSize > 0 ? 1 : 0)
    + (p.mode ? 1 : 0) + (p.moe != null ? 1 : 0) + (p.weightingStatement ? 1 : 0) + (p.questionWording ? 1 : 0) + (p.tablesUrl ? 1 : 0);
  return present / DISCLOSURE_ITEMS.length;
}

/** The standard disclosure items present in a published poll (kept apart from accuracy). */
export function disclosureOf(p: PollRow): DisclosureDto {
  const items = {
    sponsor: Boolean(p.sponsor), firm: Boolean(p.pollster), fieldworkDates: Boolean(p.fieldworkStart && p.fieldworkEnd), population: Boolean(p.population),
    sampleSize: p.sampleSize > 0, mode: Boolean(p.mode), statedMoe: p.moe != null, weightingStatement: p.weightingStatement,
    questionWording: p.questionWording, tablesLink: Boolean(p.tablesUrl),
  };
  const present = DISCLOSURE_ITEMS.filter((k) => items[k]).length;
  return { items, completeness: present / DISCLOSURE_ITEMS.length };
}
