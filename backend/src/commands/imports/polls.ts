import { createHash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import {
  MODES, POLL_COLUMNS, POLL_EXTRA_COLUMNS, POLL_WIDE_FIXED_COLUMNS, POPULATIONS, RESERVED_OPTION_KEYS, SPONSOR_TYPES,
  type Mode, type Population, type SponsorType,
} from '@veracast/shared-types';
import { applyColumnMap, ImportFileError, isIsoDate, isUrl, KEY_RE, normalizeName, openCsv, parseBool, refuseRespondentLevel, requireColumns } from './csv';
import { chunk, Collector, recordImport, type ImportOptions } from './common';
import { withConnection } from '../../db/raw';
import type { ImportOutcome } from './results';

export interface PollImportOptions extends ImportOptions {
  layout?: 'long' | 'wide';
  /** Wide layout: file column → option key ('' to ignore the column). */
  optionMap?: Record<string, string>;
  /** Unknown pollster name → id of an existing firm (the name becomes its alias). */
  pollsterMap?: Record<string, number>;
}

/**
 * One poll as read from the file. `cells` is the poll's first row (trimmed cells, by column
 * index); later rows of the poll are compared with it and dropped. `shares` is flat: option key,
 * share, row index, for each distinct option in first-seen order.
 */
interface PollDraft {
  key: string;
  firstIndex: number;
  /** Last row index of the poll; with `firstIndex`, its rows when `scattered` is null. */
  lastIndex: number;
  /** Every row index of the poll, once its rows are not one contiguous run. */
  scattered: number[] | null;
  cells: string[];
  shares: (string | number)[];
}

interface CleanPoll {
  key: string;
  draft: PollDraft;
  pollster: string;
  sponsor: string | null;
  sponsorType: SponsorType | null;
  contestId: number;
  fieldworkStart: string;
  fieldworkEnd: string;
  publishedOn: string;
  sampleSize: number;
  population: Population;
  mode: Mode;
  moe: number | null;
  studyKey: string | null;
  isHeadline: boolean;
  tracking: boolean;
  sourceUrl: string | null;
  questionWording: boolean;
  weightingStatement: boolean;
  tablesUrl: string | null;
}

/** Per-poll fields that must agree on every row of one poll in the long layout. */
const POLL_FIELDS = [...POLL_WIDE_FIXED_COLUMNS.filter((c) => c !== 'poll_key'), ...POLL_EXTRA_COLUMNS];
type PollField = (typeof POLL_FIELDS)[number];
const NUM_RE = /^\d+(\.\d+)?$/;
const NO_CELLS: string[] = [];
/** A value in LOAD DATA's default text format: backslash, tab, newline and CR escaped, NULL as \\N. */
const tsvCell = (v: unknown): string => {
  if (v === null || v === undefined) return '\\N';
  const text = String(v);
  return /[\\\t\n\r]/.test(text) ? text.replace(/[\\\t\n\r]/g, (ch) => (ch === '\\' ? '\\\\' : ch === '\t' ? '\\t' : ch === '\n' ? '\\n' : '\\r')) : text;
};
const round3 = (x: number) => Math.round(x * 1000) / 1000;
const ER_DUP_ENTRY = 1062;

/** A draft's row indexes, in the order they were read. */
function indexesOf(d: PollDraft): number[] {
  if (d.scattered) return d.scattered;
  const out: number[] = [];
  for (let x = d.firstIndex; x <= d.lastIndex; x++) out.push(x);
  return out;
}

function addIndex(d: PollDraft, index: number) {
  if (d.scattered) d.scattered.push(index);
  else if (index === d.lastIndex + 1) d.lastIndex = index;
  else {
    d.scattered = indexesOf(d);
    d.scattered.push(index);
  }
  d.lastIndex = index;
}

function anyBad(d: PollDraft, bad: ReadonlySet<number>): boolean {
  if (d.scattered) return d.scattered.some((x) => bad.has(x));
  for (let x = d.firstIndex; x <= d.lastIndex; x++) if (bad.has(x)) return true;
  return false;
}

/** The poll's shares as [option key, share] in first-seen order. */
function sharesOf(d: PollDraft): [string, number][] {
  const out: [string, number][] = [];
  for (let j = 0; j < d.shares.length; j += 3) out.push([d.shares[j] as string, d.shares[j + 1] as number]);
  return out;
}

/** Memoises a function of one string (for values that repeat across many rows). */
function memo<T>(fn: (s: string) => T): (s: string) => T {
  const cache = new Map<string, T>();
  return (s) => {
    let v = cache.get(s);
    if (v === undefined && !cache.has(s)) {
      v = fn(s);
      cache.set(s, v);
    }
    return v as T;
  };
}

/**
 * Imports published polls (SPEC §3), long or wide layout. Validation is row by row; writing is
 * set-based (multi-row INSERTs in batches) inside one transaction.
 * Counts (created/updated/unchanged/skipped) are of polls; `rows` is the file's data rows.
 */
export async function importPolls(sequelize: Sequelize, buffer: Buffer, opts: PollImportOptions): Promise<ImportOutcome> {
  const fileHash = createHash('sha256').update(buffer).digest('hex');
  const csv = openCsv(buffer);
  refuseRespondentLevel(csv.headers);
  const headers = applyColumnMap(csv.headers, opts.columnMap);
  const layout = opts.layout ?? (headers.includes('option_key') && headers.includes('share') ? 'long' : 'wide');
  const c = new Collector(csv.lineOf);
  const drafts = new Map<string, PollDraft>();
  const at = Object.fromEntries(headers.map((h, i) => [h, i]));
  /** Column index of each per-poll field, -1 when the file lacks it. */
  const fieldCol = POLL_FIELDS.map((f) => at[f] ?? -1);
  const colOf = Object.fromEntries(POLL_FIELDS.map((f, j) => [f, fieldCol[j]!])) as Record<PollField, number>;
  const cell = (cells: string[], col: number) => (col < 0 ? '' : (cells[col] ?? ''));
  const keyCol = at.poll_key ?? -1;
  const isoDate = memo(isIsoDate);
  const optionKeyOk = memo((k: string) => KEY_RE.test(k));
  const lowerOption = memo((k: string) => k.toLowerCase());
  /** A share cell's value: the number, or 'format' / 'over' for the two ways it can be wrong. */
  const shareValue = memo((raw: string): number | 'format' | 'over' => {
    const cleaned = raw.replace(',', '.');
    if (!NUM_RE.test(cleaned)) return 'format';
    const share = Number(cleaned);
    return share > 100 ? 'over' : share;
  });

  // A poll's first row is kept: its per-poll cells share one string per distinct value (dates,
  // firms, contests, modes repeat), up to a few thousand values a column.
  const interned = fieldCol.map(() => new Map<string, string>());
  const keepCells = (cells: string[]) => {
    for (let j = 0; j < fieldCol.length; j++) {
      const col = fieldCol[j]!;
      const v = col < 0 ? undefined : cells[col];
      if (v === undefined || v === '') continue;
      const seen = interned[j]!;
      const same = seen.get(v);
      if (same !== undefined) cells[col] = same;
      else if (seen.size < 5000) seen.set(v, v);
    }
    return cells;
  };

  let rowCount: number;
  if (layout === 'long') {
    requireColumns(headers, POLL_COLUMNS);
    const optionCol = at.option_key ?? -1;
    const shareCol = at.share ?? -1;
    // A poll's rows usually come one after another: the previous row's draft is tried first.
    let previous: PollDraft | undefined;
    rowCount = csv.forEachRow((cells, index) => {
      const key = cell(cells, keyCol);
      if (!key) return c.add(index, 'poll_key', 'required', 'poll_key is required');
      let d = previous !== undefined && previous.key === key ? previous : drafts.get(key);
      previous = d;
      if (!d) {
        d = { key, firstIndex: index, lastIndex: index, scattered: null, cells: keepCells(cells), shares: [] };
        drafts.set(key, d);
        previous = d;
      } else {
        const firstCells = d.cells;
        for (let j = 0; j < fieldCol.length; j++) {
          const col = fieldCol[j]!;
          if (col < 0) continue;
          const v = cells[col] ?? '';
          const first = firstCells[col] ?? '';
          if (v !== first) {
            const f = POLL_FIELDS[j]!;
            c.add(index, f, 'duplicate_key', `poll ${key} has ${f} "${v}" here but "${first}" on row ${csv.lineOf(d.firstIndex)}`);
          }
        }
        addIndex(d, index);
      }
      addShare(d, index, lowerOption(cell(cells, optionCol)), cell(cells, shareCol), 'share');
    });
  } else {
    requireColumns(headers, POLL_WIDE_FIXED_COLUMNS);
    const fixed = new Set<string>([...POLL_WIDE_FIXED_COLUMNS, ...POLL_EXTRA_COLUMNS]);
    const optionColumns = headers
      .map((h, i) => ({ h, i, key: opts.optionMap ? (opts.optionMap[h] ?? opts.optionMap[csv.headers[i] ?? ''] ?? '') : h }))
      .filter((o) => !fixed.has(o.h) && o.key)
      .map((o) => ({ ...o, key: o.key.toLowerCase() }));
    if (!optionColumns.length) throw new ImportFileError('no_option_columns', 'The wide layout needs at least one option column mapped to an option key');
    rowCount = csv.forEachRow((cells, index) => {
      const key = cell(cells, keyCol);
      if (!key) return c.add(index, 'poll_key', 'required', 'poll_key is required');
      const seen = drafts.get(key);
      if (seen) return c.add(index, 'poll_key', 'duplicate_key', `poll ${key} appears twice in a wide file (first on row ${csv.lineOf(seen.firstIndex)})`);
      const d: PollDraft = { key, firstIndex: index, lastIndex: index, scattered: null, cells: keepCells(cells), shares: [] };
      drafts.set(key, d);
      for (const o of optionColumns) {
        const raw = cells[o.i] ?? '';
        if (raw !== '') addShare(d, index, o.key, raw, o.h);
      }
    });
  }

  function addShare(d: PollDraft, index: number, optionKey: string, raw: string, column: string) {
    if (!optionKey) return c.add(index, 'option_key', 'required', 'option_key is required');
    if (!optionKeyOk(optionKey)) return c.add(index, 'option_key', 'bad_key', `option_key "${optionKey}" must use lower-case letters, digits, dot, dash or underscore`);
    const share = shareValue(raw);
    if (share === 'format') return c.add(index, column, 'bad_share', `share "${raw}" must be a number from 0 to 100`);
    if (share === 'over') return c.add(index, column, 'bad_share', `share ${raw} is above 100`);
    const s = d.shares;
    for (let j = 0; j < s.length; j += 3) {
      if (s[j] !== optionKey) continue;
      if (s[j + 1] !== share) return c.add(index, 'option_key', 'duplicate_key', `option ${optionKey} of poll ${d.key} appears again with a different share (first on row ${csv.lineOf(s[j + 2] as number)})`);
      s[j + 2] = index;
      return;
    }
    s.push(optionKey, share, index);
  }

  // Reference data from the database, set-based.
  const contestKeys = [...new Set([...drafts.values()].map((d) => cell(d.cells, colOf.contest_key)))].filter(Boolean);
  const contests = new Map<string, { id: number; date: string; blackoutStart: string | null; options: Set<string> }>();
  for (const part of chunk(contestKeys, 5000)) {
    const found = await sequelize.query<{ id: number; key: string; election_date: string }>(
      'SELECT k.id, k.`key`, e.election_date FROM contests k JOIN elections e ON e.id = k.election_id WHERE k.`key` IN (:keys)',
      { replacements: { keys: part }, type: QueryTypes.SELECT },
    );
    for (const k of found) contests.set(k.key, { id: k.id, date: String(k.election_date).slice(0, 10), blackoutStart: null, options: new Set() });
  }
  if (contests.size) {
    const ids = [...contests.values()].map((k) => k.id);
    const byId = new Map([...contests.values()].map((k) => [k.id, k]));
    for (const part of chunk(ids, 5000)) {
      const opts2 = await sequelize.query<{ contest_id: number; key: string }>('SELECT contest_id, `key` FROM options WHERE contest_id IN (:ids)', { replacements: { ids: part }, type: QueryTypes.SELECT });
      for (const o of opts2) byId.get(o.contest_id)?.options.add(o.key);
    }
  }

  const reservedOption = new Set<string>(RESERVED_OPTION_KEYS);
  const sampleSizeOk = memo((n: string) => /^[1-9]\d{0,8}$/.test(n));
  // Checks of values that repeat across polls (codes, flags, margins) are remembered per value.
  const lower = memo((v: string) => v.toLowerCase());
  const bool = memo(parseBool);
  const moeOf = memo((text: string) => {
    const raw = text.replace(',', '.');
    const moe = raw === '' ? null : Number(raw);
    return { moe, ok: moe === null || (NUM_RE.test(raw) && moe > 0 && moe <= 50) };
  });
  const populationOk = memo((v: string) => (POPULATIONS as readonly string[]).includes(v));
  const modeOk = memo((v: string) => (MODES as readonly string[]).includes(v));
  const sponsorTypeOk = memo((v: string) => !v || (SPONSOR_TYPES as readonly string[]).includes(v));
  const clean: CleanPoll[] = [];
  for (const d of drafts.values()) {
    const i = d.firstIndex;
    const cells = d.cells;
    const f = (name: PollField) => cell(cells, colOf[name]);
    const before = c.badRows.size;
    if (!KEY_RE.test(d.key)) c.add(i, 'poll_key', 'bad_key', `poll_key "${d.key}" must use lower-case letters, digits, dot, dash or underscore`);
    const pollster = f('pollster');
    if (!pollster) c.add(i, 'pollster', 'required', 'pollster is required');
    else if (pollster.length > 200) c.add(i, 'pollster', 'too_long', 'pollster must be at most 200 characters');
    const contestKey = f('contest_key');
    const contest = contests.get(contestKey);
    if (!contestKey) c.add(i, 'contest_key', 'required', 'contest_key is required');
    else if (!contest) c.add(i, 'contest_key', 'unknown_contest', `contest ${contestKey} is unknown; import its results first`);
    const start = f('fieldwork_start');
    const end = f('fieldwork_end');
    const pub = f('published_on');
    const startOk = isoDate(start);
    const endOk = isoDate(end);
    const pubOk = isoDate(pub);
    if (!startOk) c.add(i, 'fieldwork_start', 'bad_date', `fieldwork_start "${start}" must be a date as YYYY-MM-DD`);
    if (!endOk) c.add(i, 'fieldwork_end', 'bad_date', `fieldwork_end "${end}" must be a date as YYYY-MM-DD`);
    if (!pubOk) c.add(i, 'published_on', 'bad_date', `published_on "${pub}" must be a date as YYYY-MM-DD`);
    if (startOk && endOk && end < start) c.add(i, 'fieldwork_end', 'end_before_start', `fieldwork_end ${end} is before fieldwork_start ${start}`);
    if (contest && endOk && end > contest.date) c.add(i, 'fieldwork_end', 'after_election', `fieldwork_end ${end} is after election day ${contest.date}`);
    if (contest && pubOk && pub > contest.date) c.add(i, 'published_on', 'after_election', `published_on ${pub} is after election day ${contest.date}`);
    if (pubOk && endOk && pub < end) c.add(i, 'published_on', 'before_fieldwork_end', `published_on ${pub} is before fieldwork_end ${end}`);
    const n = f('sample_size');
    if (!sampleSizeOk(n)) c.add(i, 'sample_size', 'not_positive_integer', `sample_size "${n}" must be a positive whole number`);
    const populationRaw = f('population');
    const population = lower(populationRaw);
    if (!populationOk(population)) c.add(i, 'population', 'bad_population', `population "${populationRaw}" must be one of ${POPULATIONS.join(', ')}`);
    const modeRaw = f('mode');
    const mode = lower(modeRaw);
    if (!modeOk(mode)) c.add(i, 'mode', 'bad_mode', `mode "${modeRaw}" must be one of ${MODES.join(', ')}`);
    const moeText = f('moe');
    const { moe, ok: moeOk } = moeOf(moeText);
    if (!moeOk) c.add(i, 'moe', 'bad_moe', `moe "${moeText}" must be empty or a number of points above 0 and at most 50`);
    const sponsorType = lower(f('sponsor_type'));
    if (!sponsorTypeOk(sponsorType)) c.add(i, 'sponsor_type', 'bad_sponsor_type', `sponsor_type "${sponsorType}" must be one of ${SPONSOR_TYPES.join(', ')}`);
    const sourceUrl = f('source_url');
    const tablesUrl = f('tables_url');
    if (sourceUrl && !isUrl(sourceUrl)) c.add(i, 'source_url', 'bad_url', `source_url "${sourceUrl}" must be an http(s) URL`);
    if (tablesUrl && !isUrl(tablesUrl)) c.add(i, 'tables_url', 'bad_url', `tables_url "${tablesUrl}" must be an http(s) URL`);
    const bools: Record<string, boolean> = {};
    for (const b of ['is_headline', 'tracking', 'question_wording', 'weighting_statement'] as const) {
      const raw = f(b);
      const v = bool(raw);
      if (v === null) c.add(i, b, 'bad_boolean', `${b} "${raw}" must be yes/no, true/false or 1/0`);
      bools[b] = b === 'is_headline' ? (raw ? Boolean(v) : true) : Boolean(v);
    }
    let sum = 0;
    const s = d.shares;
    for (let j = 0; j < s.length; j += 3) {
      const key = s[j] as string;
      sum += s[j + 1] as number;
      if (contest && !contest.options.has(key) && !reservedOption.has(key)) {
        c.add(s[j + 2] as number, 'option_key', 'unknown_option', `option ${key} is not an option of contest ${contestKey} (nor undecided/other)`);
      }
    }
    if (s.length === 0) c.add(i, 'share', 'no_shares', `poll ${d.key} has no shares`);
    if (sum > 100.5) c.add(d.lastIndex, 'share', 'sum_over_100', `shares of poll ${d.key} sum to ${round3(sum)}, past 100.5`);
    if (c.badRows.size !== before || anyBad(d, c.badRows)) continue;
    const questionWording = f('question_wording');
    clean.push({
      key: d.key, draft: d, pollster, sponsor: f('sponsor') || null,
      sponsorType: (sponsorType || null) as SponsorType | null, contestId: contest!.id, fieldworkStart: start, fieldworkEnd: end,
      publishedOn: pub, sampleSize: Number(n), population: population as Population, mode: mode as Mode, moe,
      studyKey: f('study_key') || null, isHeadline: bools.is_headline!, tracking: bools.tracking!, sourceUrl: sourceUrl || null,
      questionWording: bools.question_wording! || Boolean(questionWording && isUrl(questionWording)),
      weightingStatement: bools.weighting_statement!, tablesUrl: tablesUrl || null,
    });
  }
  // The file's cells are all read into `clean` by now: let them go (about 100 bytes a poll).
  for (const d of drafts.values()) d.cells = NO_CELLS;
  // Polls whose rows were flagged after they were accepted (e.g. a later duplicate row).
  const usable = clean.filter((p) => !anyBad(p.draft, c.badRows));

  // Pollsters: names and aliases, matched on a normalised form.
  const normalized = memo(normalizeName);
  const pollsterRows = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM pollsters', { type: QueryTypes.SELECT });
  const aliasRows = await sequelize.query<{ pollster_id: number; normalized: string }>('SELECT pollster_id, normalized FROM pollster_aliases', { type: QueryTypes.SELECT });
  const firmByNorm = new Map<string, number>();
  for (const p of pollsterRows) firmByNorm.set(normalizeName(p.name), p.id);
  for (const a of aliasRows) firmByNorm.set(a.normalized, a.pollster_id);
  const knownIds = new Set(pollsterRows.map((p) => p.id));
  const newNames = new Map<string, string>(); // normalised → display name
  const mappedAliases: { norm: string; alias: string; id: number }[] = [];
  for (const p of usable) {
    const norm = normalized(p.pollster);
    if (firmByNorm.has(norm) || newNames.has(norm)) continue;
    const mapped = opts.pollsterMap?.[p.pollster];
    if (mapped !== undefined) {
      if (!knownIds.has(mapped)) {
        c.add(p.draft.firstIndex, 'pollster', 'unknown_pollster_id', `pollster "${p.pollster}" is mapped to firm ${mapped}, which does not exist`);
        continue;
      }
      firmByNorm.set(norm, mapped);
      mappedAliases.push({ norm, alias: p.pollster, id: mapped });
    } else newNames.set(norm, p.pollster);
  }
  const finalPolls = usable.filter((p) => !anyBad(p.draft, c.badRows));

  // Existing polls (for upsert counts), set-based: which keys exist (a cheap probe of the key
  // index), then the stored values of those only (none on a first import).
  const existing = new Map<string, { id: number; sig: string }>();
  const existingKeys: string[] = [];
  // Into an empty archive (a first load) there is nothing to look up.
  const anyPoll = (await sequelize.query('SELECT 1 FROM polls LIMIT 1', { type: QueryTypes.SELECT })).length > 0;
  for (const part of anyPoll ? chunk(finalPolls.map((p) => p.key), 5000) : []) {
    const found = await sequelize.query<{ key: string }>('SELECT `key` FROM polls WHERE `key` IN (:keys)', { replacements: { keys: part }, type: QueryTypes.SELECT });
    for (const r of found) existingKeys.push(r.key);
  }
  for (const part of chunk(existingKeys, 5000)) {
    const found = await sequelize.query<Record<string, unknown> & { id: number; key: string }>(
      `SELECT p.id, p.\`key\`, p.pollster_id, s.name AS sponsor, p.contest_id, p.fieldwork_start, p.fieldwork_end, p.published_on, p.sample_size,
              p.population, p.mode, p.moe, p.study_key, p.is_headline, p.tracking, p.source_url, p.question_wording, p.weighting_statement, p.tables_url,
              (SELECT GROUP_CONCAT(CONCAT(ps.option_key, '=', ps.share + 0) ORDER BY ps.option_key SEPARATOR ';') FROM poll_shares ps WHERE ps.poll_id = p.id) AS shares
       FROM polls p LEFT JOIN sponsors s ON s.id = p.sponsor_id WHERE p.\`key\` IN (:keys)`,
      { replacements: { keys: part }, type: QueryTypes.SELECT },
    );
    for (const r of found) existing.set(r.key, { id: r.id, sig: signature({
      pollsterId: Number(r.pollster_id), sponsor: (r.sponsor as string | null) ?? null, contestId: Number(r.contest_id),
      fieldworkStart: String(r.fieldwork_start).slice(0, 10), fieldworkEnd: String(r.fieldwork_end).slice(0, 10), publishedOn: String(r.published_on).slice(0, 10),
      sampleSize: Number(r.sample_size), population: String(r.population), mode: String(r.mode), moe: r.moe == null ? null : Number(r.moe),
      studyKey: (r.study_key as string | null) ?? null, isHeadline: Boolean(Number(r.is_headline)), tracking: Boolean(Number(r.tracking)), sourceUrl: (r.source_url as string | null) ?? null,
      questionWording: Boolean(Number(r.question_wording)), weightingStatement: Boolean(Number(r.weighting_statement)), tablesUrl: (r.tables_url as string | null) ?? null,
      shares: String(r.shares ?? '').split(';').filter(Boolean).map((kv) => {
        const [k, v] = kv.split('=');
        return `${k}=${round3(Number(v))}`;
      }).join(';'),
    }) });
  }

  const hasErrors = c.errors.length > 0;
  const sigOf = (p: CleanPoll, pollsterId: number | null) => signature({
    pollsterId, sponsor: p.sponsor, contestId: p.contestId, fieldworkStart: p.fieldworkStart,
    fieldworkEnd: p.fieldworkEnd, publishedOn: p.publishedOn, sampleSize: p.sampleSize, population: p.population, mode: p.mode, moe: p.moe,
    studyKey: p.studyKey, isHeadline: p.isHeadline, tracking: p.tracking, sourceUrl: p.sourceUrl, questionWording: p.questionWording,
    weightingStatement: p.weightingStatement, tablesUrl: p.tablesUrl,
    shares: sharesOf(p.draft).sort((a, b) => (a[0] < b[0] ? -1 : 1)).map(([k, v]) => `${k}=${round3(v)}`).join(';'),
  });
  let created = 0;
  let unchanged = 0;
  const toWrite: CleanPoll[] = [];
  /** Id of each poll in `toWrite` that already exists (an update); new polls are absent. */
  const updatedIdOf = new Map<CleanPoll, number>();
  for (const p of finalPolls) {
    const e = existing.get(p.key);
    if (!e) {
      created++;
      toWrite.push(p);
      continue;
    }
    const firm = firmByNorm.get(normalized(p.pollster)) ?? null;
    if (firm !== null && sigOf(p, firm) === e.sig) unchanged++;
    else {
      toWrite.push(p);
      updatedIdOf.set(p, e.id);
    }
  }
  const updated = updatedIdOf.size;
  const skipped = drafts.size - finalPolls.length;
  const base = { rows: rowCount, created, updated, unchanged, skipped, errors: c.errors, validOnly: Boolean(opts.validOnly), newPollsters: [...newNames.values()] };

  if (hasErrors && !opts.validOnly) {
    const failed = { ...base, created: 0, updated: 0, unchanged: 0, skipped: drafts.size };
    const importId = await recordImport('polls', opts, fileHash, failed, 'failed');
    return { importId, status: 'failed', ...failed, httpStatus: 422 };
  }
  if (opts.dryRun) {
    const importId = await recordImport('polls', opts, fileHash, base, 'dry_run');
    return { importId, status: 'dry_run', ...base, httpStatus: 201 };
  }

  const importId = await sequelize.transaction(async (transaction) => {
    const esc = (v: string) => sequelize.escape(v);
    const importId = await recordImport('polls', opts, fileHash, base, 'committed', transaction);
    // New firms and aliases.
    for (const [norm, name] of newNames) {
      const [id] = await sequelize.query('INSERT INTO pollsters (name) VALUES (:name)', { replacements: { name }, type: QueryTypes.INSERT, transaction });
      firmByNorm.set(norm, Number(id));
    }
    for (const a of mappedAliases) {
      await sequelize.query('INSERT IGNORE INTO pollster_aliases (pollster_id, alias, normalized) VALUES (:id, :alias, :norm)', { replacements: a, transaction });
    }
    // Sponsors.
    const sponsorNames = [...new Map(toWrite.filter((p) => p.sponsor).map((p) => [p.sponsor!, p.sponsorType ?? 'unknown'])).entries()];
    for (const part of chunk(sponsorNames, 2000)) {
      await sequelize.query(
        `INSERT INTO sponsors (name, type) VALUES ${part.map(([n, t]) => `(${esc(n)}, ${esc(t)})`).join(',')}
         ON DUPLICATE KEY UPDATE type = IF(VALUES(type) = 'unknown', type, VALUES(type))`,
        { transaction },
      );
    }
    const sponsorIds = new Map(
      (await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM sponsors', { type: QueryTypes.SELECT, transaction })).map((s) => [s.name, s.id]),
    );

    /**
     * One poll as a VALUES tuple. Keys match KEY_RE, dates are checked YYYY-MM-DD and population
     * and mode are from fixed lists, so only sponsor-free text (study key, URLs) needs escaping.
     */
    const tuple = (p: CleanPoll) => {
      const firm = firmByNorm.get(normalized(p.pollster));
      const sponsorId = p.sponsor ? sponsorIds.get(p.sponsor) : undefined;
      return `('${p.key}',${firm ?? 'NULL'},${sponsorId ?? 'NULL'},${p.contestId},'${p.fieldworkStart}','${p.fieldworkEnd}','${p.publishedOn}',${p.sampleSize},'${p.population}','${p.mode}',${
        p.moe === null ? 'NULL' : String(p.moe)},${p.studyKey === null ? 'NULL' : esc(p.studyKey)},${p.isHeadline ? 1 : 0},${p.tracking ? 1 : 0},${
        p.sourceUrl === null ? 'NULL' : esc(p.sourceUrl)},${p.questionWording ? 1 : 0},${p.weightingStatement ? 1 : 0},${p.tablesUrl === null ? 'NULL' : esc(p.tablesUrl)},${importId})`;
    };
    const insertPolls = 'INSERT INTO polls (`key`, pollster_id, sponsor_id, contest_id, fieldwork_start, fieldwork_end, published_on, sample_size, population, mode, moe, study_key, is_headline, tracking, source_url, question_wording, weighting_statement, tables_url, import_id) VALUES ';
    const upsertTail = ` ON DUPLICATE KEY UPDATE pollster_id = VALUES(pollster_id), sponsor_id = VALUES(sponsor_id), contest_id = VALUES(contest_id),
           fieldwork_start = VALUES(fieldwork_start), fieldwork_end = VALUES(fieldwork_end), published_on = VALUES(published_on),
           sample_size = VALUES(sample_size), population = VALUES(population), mode = VALUES(mode), moe = VALUES(moe), study_key = VALUES(study_key),
           is_headline = VALUES(is_headline), tracking = VALUES(tracking), source_url = VALUES(source_url), question_wording = VALUES(question_wording),
           weighting_statement = VALUES(weighting_statement), tables_url = VALUES(tables_url), import_id = VALUES(import_id), updated_at = NOW(3)`;
    const selectIds = async (keys: string[]) => new Map(
      (await sequelize.query<{ id: number; key: string }>('SELECT id, `key` FROM polls WHERE `key` IN (:keys)', {
        replacements: { keys }, type: QueryTypes.SELECT, transaction,
      })).map((r) => [r.key, r.id]),
    );
    // A simple multi-row INSERT takes consecutive ids in row order when InnoDB hands them out
    // under the "consecutive" (1) or "traditional" (0) lock mode with an increment of 1.
    const [autoinc] = await sequelize.query<{ mode: number | string; inc: number | string }>(
      'SELECT @@innodb_autoinc_lock_mode AS mode, @@auto_increment_increment AS inc', { type: QueryTypes.SELECT, transaction },
    );
    const consecutiveIds = Number(autoinc?.mode) <= 1 && Number(autoinc?.inc) === 1;
    let bulkLoad = true;

    /**
     * Inserts polls that did not exist and returns their ids. The ids come from the statement's
     * first insert id, after checking that the batch's first and last keys hold the two ends of
     * the id range; otherwise (and when a key was inserted meanwhile) they are read back by key.
     */
    /** One poll as a line of LOAD DATA's default text format (tab-separated, \\N for NULL). */
    const tsvLine = (p: CleanPoll) => {
      const firm = firmByNorm.get(normalized(p.pollster));
      const sponsorId = p.sponsor ? sponsorIds.get(p.sponsor) : undefined;
      // Keys match KEY_RE, dates are checked YYYY-MM-DD, population and mode come from fixed lists:
      // only the free texts need escaping.
      return `${p.key}\t${firm ?? '\\N'}\t${sponsorId ?? '\\N'}\t${p.contestId}\t${p.fieldworkStart}\t${p.fieldworkEnd}\t${p.publishedOn}\t${
        p.sampleSize}\t${p.population}\t${p.mode}\t${p.moe === null ? '\\N' : p.moe}\t${tsvCell(p.studyKey)}\t${p.isHeadline ? 1 : 0}\t${
        p.tracking ? 1 : 0}\t${tsvCell(p.sourceUrl)}\t${p.questionWording ? 1 : 0}\t${p.weightingStatement ? 1 : 0}\t${tsvCell(p.tablesUrl)}\t${importId}`;
    };

    /**
     * New polls through MariaDB's bulk loader (LOAD DATA LOCAL INFILE of a private temporary
     * file, in this transaction): 'loaded', or null when the server or the connector does not
     * allow it (the caller then sends an INSERT). When the loader skipped a row (a key inserted
     * meanwhile by someone else, reported as a warning), every row is written again by the upsert:
     * 'rewritten'.
     */
    const loadNew = async (fresh: CleanPoll[], lines: string): Promise<'loaded' | 'rewritten' | null> => {
      if (!bulkLoad) return null;
      const file = path.join(os.tmpdir(), `veracast-import-${randomBytes(12).toString('hex')}.tsv`);
      // The connector sends only the file named, quoted, in the statement: a plain path is required.
      if (!/^[\w/.-]+$/.test(file)) {
        bulkLoad = false;
        return null;
      }
      try {
        await fs.promises.writeFile(file, lines, { mode: 0o600, flag: 'wx' });
      } catch {
        // No temporary file (a full or read-only disk): INSERT from now on.
        bulkLoad = false;
        return null;
      }
      try {
        const result = (await withConnection(sequelize, transaction, (c) => c.query({
          sql: `LOAD DATA LOCAL INFILE '${file}' INTO TABLE polls CHARACTER SET utf8mb4 FIELDS TERMINATED BY '\\t' ESCAPED BY '\\\\' LINES TERMINATED BY '\\n'
                (\`key\`, pollster_id, sponsor_id, contest_id, fieldwork_start, fieldwork_end, published_on, sample_size, population, mode, moe,
                 study_key, is_headline, tracking, source_url, question_wording, weighting_statement, tables_url, import_id)`,
        }))) as { affectedRows?: number; warningStatus?: number };
        if (Number(result.affectedRows) !== fresh.length || Number(result.warningStatus ?? 0) > 0) {
          await sequelize.query(insertPolls + fresh.map(tuple).join(',') + upsertTail, { transaction });
          return 'rewritten';
        }
        return 'loaded';
      } catch (err) {
        const errno = (err as { errno?: number }).errno;
        // Loading local files refused by the server (1148, 4166) or the connector (45033, 45034): INSERT from now on.
        if (errno === 1148 || errno === 4166 || errno === 45033 || errno === 45034) {
          bulkLoad = false;
          return null;
        }
        throw err;
      } finally {
        await fs.promises.rm(file, { force: true });
      }
    };

    const insertNew = async (fresh: CleanPoll[], lines: string | null): Promise<Map<string, number>> => {
      // The statement's first id: an INSERT reports it; after LOAD DATA (which reports none) it is
      // read from the batch's first row below.
      let firstId: number | null = null;
      const loaded = lines === null ? null : await loadNew(fresh, lines);
      if (loaded === 'rewritten') return selectIds(fresh.map((p) => p.key));
      if (loaded !== 'loaded') {
        const values = fresh.map(tuple).join(',');
        try {
          const [id] = await sequelize.query(insertPolls + values, { type: QueryTypes.INSERT, transaction });
          firstId = Number(id);
        } catch (err) {
          if ((err as { parent?: { errno?: number } }).parent?.errno !== ER_DUP_ENTRY) throw err;
          await sequelize.query(insertPolls + values + upsertTail, { transaction });
          return selectIds(fresh.map((p) => p.key));
        }
      }
      if (consecutiveIds) {
        // Ids of one statement grow in row order (under these lock modes a LOAD DATA or a
        // multi-row INSERT takes one run of ids), so n ids whose first and last rows hold first
        // and first + n - 1 are exactly that range.
        const firstKey = fresh[0]!.key;
        const lastKey = fresh[fresh.length - 1]!.key;
        const ends = new Map(
          (await sequelize.query<{ id: number; key: string }>('SELECT id, `key` FROM polls WHERE `key` IN (:keys)', {
            replacements: { keys: [firstKey, lastKey] }, type: QueryTypes.SELECT, transaction,
          })).map((r) => [r.key, Number(r.id)]),
        );
        const first = firstId ?? ends.get(firstKey);
        if (first !== undefined && Number.isSafeInteger(first) && first > 0 && ends.get(firstKey) === first && ends.get(lastKey) === first + fresh.length - 1) {
          return new Map(fresh.map((p, j) => [p.key, first + j]));
        }
      }
      return selectIds(fresh.map((p) => p.key));
    };

    /** A batch split into new and existing polls, with their VALUES lists built. */
    const prepare = (part: CleanPoll[]) => {
      const fresh = part.filter((p) => !updatedIdOf.has(p));
      const changed = part.filter((p) => updatedIdOf.has(p));
      // The new polls' lines for the bulk loader; their INSERT text only if the loader is refused.
      return { part, fresh, changed, freshLines: bulkLoad ? `${fresh.map(tsvLine).join('\n')}\n` : null, changedValues: changed.map(tuple).join(',') };
    };
    /** Lets a statement just handed to the connector go out before a long synchronous step. */
    const yieldToIo = () => new Promise<void>((resolve) => setImmediate(resolve));

    // Polls, then their shares, batch by batch. The next batch's VALUES are built while the
    // server writes this batch's shares.
    const parts = chunk(toWrite, 5000);
    let next = parts.length ? prepare(parts[0]!) : null;
    let batch = 0;
    while (next) {
      const { part, fresh, changed, freshLines, changedValues } = next;
      const following = parts[batch + 1];
      next = null;
      const ids = fresh.length ? await insertNew(fresh, freshLines) : new Map<string, number>();
      if (changed.length) {
        await sequelize.query(insertPolls + changedValues + upsertTail, { transaction });
        for (const p of changed) ids.set(p.key, updatedIdOf.get(p)!);
        await sequelize.query('DELETE FROM poll_shares WHERE poll_id IN (:ids)', { replacements: { ids: changed.map((p) => updatedIdOf.get(p)!) }, transaction });
      }
      const shareRows: (string | number)[][] = [];
      for (const p of part) {
        const id = ids.get(p.key)!;
        const s = p.draft.shares;
        for (let j = 0; j < s.length; j += 3) shareRows.push([id, s[j] as string, round3(s[j + 1] as number)]);
      }
      // The shares go in one bulk statement (MariaDB's binary bulk protocol: one prepared
      // INSERT, every row's values sent as binary, no SQL text to parse per row).
      const running = withConnection(sequelize, transaction, (c) => c.batch('INSERT INTO poll_shares (poll_id, option_key, share) VALUES (?, ?, ?)', shareRows));
      if (following) {
        running.catch(() => undefined); // awaited just below; a failure must not count as unhandled meanwhile
        await yieldToIo();
        next = prepare(following);
      }
      await running;
      if (!next && following) next = prepare(following);
      batch++;
      await opts.afterBatch?.(batch);
    }
    return importId;
  });
  return { importId, status: 'committed', ...base, httpStatus: 201 };
}

function signature(v: Record<string, unknown>): string {
  return JSON.stringify(v);
}
