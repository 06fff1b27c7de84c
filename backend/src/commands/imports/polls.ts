import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import {
  MODES, POLL_COLUMNS, POLL_EXTRA_COLUMNS, POLL_WIDE_FIXED_COLUMNS, POPULATIONS, RESERVED_OPTION_KEYS, SPONSOR_TYPES,
  type Mode, type Population, type SponsorType,
} from '@veracast/shared-types';
import { applyColumnMap, ImportFileError, isIsoDate, isUrl, KEY_RE, normalizeName, parseBool, parseCsv, refuseRespondentLevel, requireColumns } from './csv';
import { chunk, Collector, recordImport, sqlValue, type ImportOptions } from './common';
import type { ImportOutcome } from './results';

export interface PollImportOptions extends ImportOptions {
  layout?: 'long' | 'wide';
  /** Wide layout: file column → option key ('' to ignore the column). */
  optionMap?: Record<string, string>;
  /** Unknown pollster name → id of an existing firm (the name becomes its alias). */
  pollsterMap?: Record<string, number>;
}

interface PollDraft {
  key: string;
  firstIndex: number;
  indexes: number[];
  fields: Record<string, string>;
  shares: Map<string, { share: number; index: number }>;
}

interface CleanPoll {
  key: string;
  indexes: number[];
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
  shares: [string, number][];
}

/** Per-poll fields that must agree on every row of one poll in the long layout. */
const POLL_FIELDS = [...POLL_WIDE_FIXED_COLUMNS.filter((c) => c !== 'poll_key'), ...POLL_EXTRA_COLUMNS];
const NUM_RE = /^\d+(\.\d+)?$/;
const round3 = (x: number) => Math.round(x * 1000) / 1000;

/**
 * Imports published polls (SPEC §3), long or wide layout. Validation is row by row; writing is
 * set-based (multi-row INSERT … ON DUPLICATE KEY UPDATE in batches) inside one transaction.
 * Counts (created/updated/unchanged/skipped) are of polls; `rows` is the file's data rows.
 */
export async function importPolls(sequelize: Sequelize, buffer: Buffer, opts: PollImportOptions): Promise<ImportOutcome> {
  const fileHash = createHash('sha256').update(buffer).digest('hex');
  const csv = parseCsv(buffer);
  refuseRespondentLevel(csv.headers);
  const headers = applyColumnMap(csv.headers, opts.columnMap);
  const layout = opts.layout ?? (headers.includes('option_key') && headers.includes('share') ? 'long' : 'wide');
  const c = new Collector(csv.lineOf);
  const drafts = new Map<string, PollDraft>();
  const at = Object.fromEntries(headers.map((h, i) => [h, i]));
  const field = (cells: string[], name: string) => (at[name] !== undefined ? (cells[at[name]!] ?? '') : '');

  if (layout === 'long') {
    requireColumns(headers, POLL_COLUMNS);
    csv.rows.forEach((cells, index) => {
      const key = field(cells, 'poll_key');
      if (!key) return c.add(index, 'poll_key', 'required', 'poll_key is required');
      let d = drafts.get(key);
      if (!d) {
        d = { key, firstIndex: index, indexes: [], fields: Object.fromEntries(POLL_FIELDS.map((f) => [f, field(cells, f)])), shares: new Map() };
        drafts.set(key, d);
      } else {
        for (const f of POLL_FIELDS) {
          const v = field(cells, f);
          if (v !== d.fields[f]) c.add(index, f, 'duplicate_key', `poll ${key} has ${f} "${v}" here but "${d.fields[f]}" on row ${csv.lineOf(d.firstIndex)}`);
        }
      }
      d.indexes.push(index);
      addShare(d, index, field(cells, 'option_key').toLowerCase(), field(cells, 'share'), 'share');
    });
  } else {
    requireColumns(headers, POLL_WIDE_FIXED_COLUMNS);
    const fixed = new Set<string>([...POLL_WIDE_FIXED_COLUMNS, ...POLL_EXTRA_COLUMNS]);
    const optionColumns = headers
      .map((h, i) => ({ h, i, key: opts.optionMap ? (opts.optionMap[h] ?? opts.optionMap[csv.headers[i] ?? ''] ?? '') : h }))
      .filter((o) => !fixed.has(o.h) && o.key);
    if (!optionColumns.length) throw new ImportFileError('no_option_columns', 'The wide layout needs at least one option column mapped to an option key');
    csv.rows.forEach((cells, index) => {
      const key = field(cells, 'poll_key');
      if (!key) return c.add(index, 'poll_key', 'required', 'poll_key is required');
      if (drafts.has(key)) return c.add(index, 'poll_key', 'duplicate_key', `poll ${key} appears twice in a wide file (first on row ${csv.lineOf(drafts.get(key)!.firstIndex)})`);
      const d: PollDraft = { key, firstIndex: index, indexes: [index], fields: Object.fromEntries(POLL_FIELDS.map((f) => [f, field(cells, f)])), shares: new Map() };
      drafts.set(key, d);
      for (const o of optionColumns) {
        const raw = cells[o.i] ?? '';
        if (raw !== '') addShare(d, index, o.key.toLowerCase(), raw, o.h);
      }
    });
  }

  function addShare(d: PollDraft, index: number, optionKey: string, raw: string, column: string) {
    if (!optionKey) return c.add(index, 'option_key', 'required', 'option_key is required');
    if (!KEY_RE.test(optionKey)) return c.add(index, 'option_key', 'bad_key', `option_key "${optionKey}" must use lower-case letters, digits, dot, dash or underscore`);
    const cleaned = raw.replace(',', '.');
    if (!NUM_RE.test(cleaned)) return c.add(index, column, 'bad_share', `share "${raw}" must be a number from 0 to 100`);
    const share = Number(cleaned);
    if (share > 100) return c.add(index, column, 'bad_share', `share ${raw} is above 100`);
    const prev = d.shares.get(optionKey);
    if (prev && prev.share !== share) return c.add(index, 'option_key', 'duplicate_key', `option ${optionKey} of poll ${d.key} appears again with a different share (first on row ${csv.lineOf(prev.index)})`);
    d.shares.set(optionKey, { share, index });
  }

  // Reference data from the database, set-based.
  const contestKeys = [...new Set([...drafts.values()].map((d) => d.fields.contest_key ?? ''))].filter(Boolean);
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

  const clean: CleanPoll[] = [];
  for (const d of drafts.values()) {
    const i = d.firstIndex;
    const f = d.fields as Record<string, string>;
    const before = c.badRows.size;
    if (!KEY_RE.test(d.key)) c.add(i, 'poll_key', 'bad_key', `poll_key "${d.key}" must use lower-case letters, digits, dot, dash or underscore`);
    if (!f.pollster) c.add(i, 'pollster', 'required', 'pollster is required');
    else if (f.pollster.length > 200) c.add(i, 'pollster', 'too_long', 'pollster must be at most 200 characters');
    const contest = contests.get(f.contest_key ?? '');
    if (!f.contest_key) c.add(i, 'contest_key', 'required', 'contest_key is required');
    else if (!contest) c.add(i, 'contest_key', 'unknown_contest', `contest ${f.contest_key} is unknown; import its results first`);
    for (const name of ['fieldwork_start', 'fieldwork_end', 'published_on'] as const) {
      if (!isIsoDate(f[name] ?? '')) c.add(i, name, 'bad_date', `${name} "${f[name] ?? ''}" must be a date as YYYY-MM-DD`);
    }
    const start = f.fieldwork_start ?? '';
    const end = f.fieldwork_end ?? '';
    const pub = f.published_on ?? '';
    if (isIsoDate(start) && isIsoDate(end) && end < start) c.add(i, 'fieldwork_end', 'end_before_start', `fieldwork_end ${end} is before fieldwork_start ${start}`);
    if (contest && isIsoDate(end) && end > contest.date) c.add(i, 'fieldwork_end', 'after_election', `fieldwork_end ${end} is after election day ${contest.date}`);
    if (contest && isIsoDate(pub) && pub > contest.date) c.add(i, 'published_on', 'after_election', `published_on ${pub} is after election day ${contest.date}`);
    if (isIsoDate(pub) && isIsoDate(end) && pub < end) c.add(i, 'published_on', 'before_fieldwork_end', `published_on ${pub} is before fieldwork_end ${end}`);
    const n = f.sample_size ?? '';
    if (!/^[1-9]\d{0,8}$/.test(n)) c.add(i, 'sample_size', 'not_positive_integer', `sample_size "${n}" must be a positive whole number`);
    const population = (f.population ?? '').toLowerCase();
    if (!(POPULATIONS as readonly string[]).includes(population)) c.add(i, 'population', 'bad_population', `population "${f.population ?? ''}" must be one of ${POPULATIONS.join(', ')}`);
    const mode = (f.mode ?? '').toLowerCase();
    if (!(MODES as readonly string[]).includes(mode)) c.add(i, 'mode', 'bad_mode', `mode "${f.mode ?? ''}" must be one of ${MODES.join(', ')}`);
    const moeRaw = (f.moe ?? '').replace(',', '.');
    const moe = moeRaw === '' ? null : Number(moeRaw);
    if (moe !== null && !(NUM_RE.test(moeRaw) && moe > 0 && moe <= 50)) c.add(i, 'moe', 'bad_moe', `moe "${f.moe ?? ''}" must be empty or a number of points above 0 and at most 50`);
    const sponsorType = (f.sponsor_type ?? '').toLowerCase();
    if (sponsorType && !(SPONSOR_TYPES as readonly string[]).includes(sponsorType)) c.add(i, 'sponsor_type', 'bad_sponsor_type', `sponsor_type "${sponsorType}" must be one of ${SPONSOR_TYPES.join(', ')}`);
    for (const u of ['source_url', 'tables_url'] as const) if (f[u] && !isUrl(f[u]!)) c.add(i, u, 'bad_url', `${u} "${f[u]}" must be an http(s) URL`);
    const bools: Record<string, boolean> = {};
    for (const b of ['is_headline', 'tracking', 'question_wording', 'weighting_statement'] as const) {
      const v = parseBool(f[b] ?? '');
      if (v === null) c.add(i, b, 'bad_boolean', `${b} "${f[b]}" must be yes/no, true/false or 1/0`);
      bools[b] = b === 'is_headline' ? (f[b] ? Boolean(v) : true) : Boolean(v);
    }
    let sum = 0;
    for (const [key, s] of d.shares) {
      sum += s.share;
      if (contest && !contest.options.has(key) && !(RESERVED_OPTION_KEYS as readonly string[]).includes(key)) {
        c.add(s.index, 'option_key', 'unknown_option', `option ${key} is not an option of contest ${f.contest_key} (nor undecided/other)`);
      }
    }
    if (d.shares.size === 0) c.add(i, 'share', 'no_shares', `poll ${d.key} has no shares`);
    if (sum > 100.5) c.add(d.indexes[d.indexes.length - 1]!, 'share', 'sum_over_100', `shares of poll ${d.key} sum to ${round3(sum)}, past 100.5`);
    if (c.badRows.size !== before || d.indexes.some((x) => c.badRows.has(x))) continue;
    clean.push({
      key: d.key, indexes: d.indexes, pollster: f.pollster!, sponsor: f.sponsor || null,
      sponsorType: (sponsorType || null) as SponsorType | null, contestId: contest!.id, fieldworkStart: start, fieldworkEnd: end,
      publishedOn: pub, sampleSize: Number(n), population: population as Population, mode: mode as Mode, moe,
      studyKey: f.study_key || null, isHeadline: bools.is_headline!, tracking: bools.tracking!, sourceUrl: f.source_url || null,
      questionWording: bools.question_wording! || Boolean(f.question_wording && isUrl(f.question_wording)),
      weightingStatement: bools.weighting_statement!, tablesUrl: f.tables_url || null,
      shares: [...d.shares].map(([k, v]) => [k, v.share]),
    });
  }
  // Polls whose rows were flagged after they were accepted (e.g. a later duplicate row).
  const usable = clean.filter((p) => !p.indexes.some((x) => c.badRows.has(x)));

  // Pollsters: names and aliases, matched on a normalised form.
  const pollsterRows = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM pollsters', { type: QueryTypes.SELECT });
  const aliasRows = await sequelize.query<{ pollster_id: number; normalized: string }>('SELECT pollster_id, normalized FROM pollster_aliases', { type: QueryTypes.SELECT });
  const firmByNorm = new Map<string, number>();
  for (const p of pollsterRows) firmByNorm.set(normalizeName(p.name), p.id);
  for (const a of aliasRows) firmByNorm.set(a.normalized, a.pollster_id);
  const knownIds = new Set(pollsterRows.map((p) => p.id));
  const newNames = new Map<string, string>(); // normalised → display name
  const mappedAliases: { norm: string; alias: string; id: number }[] = [];
  for (const p of usable) {
    const norm = normalizeName(p.pollster);
    if (firmByNorm.has(norm) || newNames.has(norm)) continue;
    const mapped = opts.pollsterMap?.[p.pollster];
    if (mapped !== undefined) {
      if (!knownIds.has(mapped)) {
        c.add(p.indexes[0]!, 'pollster', 'unknown_pollster_id', `pollster "${p.pollster}" is mapped to firm ${mapped}, which does not exist`);
        continue;
      }
      firmByNorm.set(norm, mapped);
      mappedAliases.push({ norm, alias: p.pollster, id: mapped });
    } else newNames.set(norm, p.pollster);
  }
  const finalPolls = usable.filter((p) => !p.indexes.some((x) => c.badRows.has(x)));

  // Existing polls (for upsert counts), set-based.
  const existing = new Map<string, { id: number; sig: string }>();
  for (const part of chunk(finalPolls.map((p) => p.key), 5000)) {
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
    shares: [...p.shares].sort((a, b) => (a[0] < b[0] ? -1 : 1)).map(([k, v]) => `${k}=${round3(v)}`).join(';'),
  });
  let created = 0;
  let unchanged = 0;
  const toWrite: CleanPoll[] = [];
  const updatedIds: number[] = [];
  const updatedSet = new Set<number>();
  for (const p of finalPolls) {
    const e = existing.get(p.key);
    if (!e) {
      created++;
      toWrite.push(p);
      continue;
    }
    const firm = firmByNorm.get(normalizeName(p.pollster)) ?? null;
    if (firm !== null && sigOf(p, firm) === e.sig) unchanged++;
    else {
      toWrite.push(p);
      updatedIds.push(e.id);
      updatedSet.add(e.id);
    }
  }
  const updated = updatedIds.length;
  const skipped = drafts.size - finalPolls.length;
  const base = { rows: csv.rows.length, created, updated, unchanged, skipped, errors: c.errors, validOnly: Boolean(opts.validOnly), newPollsters: [...newNames.values()] };

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
    // Polls, then their shares.
    let batch = 0;
    for (const part of chunk(toWrite, 5000)) {
      await sequelize.query(
        `INSERT INTO polls (\`key\`, pollster_id, sponsor_id, contest_id, fieldwork_start, fieldwork_end, published_on, sample_size, population, mode, moe,
           study_key, is_headline, tracking, source_url, question_wording, weighting_statement, tables_url, import_id) VALUES ${part
          .map((p) => `(${[p.key, firmByNorm.get(normalizeName(p.pollster)), p.sponsor ? sponsorIds.get(p.sponsor) : null, p.contestId, p.fieldworkStart, p.fieldworkEnd,
            p.publishedOn, p.sampleSize, p.population, p.mode, p.moe, p.studyKey, p.isHeadline, p.tracking, p.sourceUrl, p.questionWording,
            p.weightingStatement, p.tablesUrl, importId].map((v) => sqlValue(esc, v)).join(',')})`)
          .join(',')}
         ON DUPLICATE KEY UPDATE pollster_id = VALUES(pollster_id), sponsor_id = VALUES(sponsor_id), contest_id = VALUES(contest_id),
           fieldwork_start = VALUES(fieldwork_start), fieldwork_end = VALUES(fieldwork_end), published_on = VALUES(published_on),
           sample_size = VALUES(sample_size), population = VALUES(population), mode = VALUES(mode), moe = VALUES(moe), study_key = VALUES(study_key),
           is_headline = VALUES(is_headline), tracking = VALUES(tracking), source_url = VALUES(source_url), question_wording = VALUES(question_wording),
           weighting_statement = VALUES(weighting_statement), tables_url = VALUES(tables_url), import_id = VALUES(import_id), updated_at = NOW(3)`,
        { transaction },
      );
      const ids = new Map(
        (await sequelize.query<{ id: number; key: string }>('SELECT id, `key` FROM polls WHERE `key` IN (:keys)', {
          replacements: { keys: part.map((p) => p.key) }, type: QueryTypes.SELECT, transaction,
        })).map((r) => [r.key, r.id]),
      );
      const replaced = part.map((p) => ids.get(p.key)!).filter((id) => updatedSet.has(id));
      if (replaced.length) await sequelize.query('DELETE FROM poll_shares WHERE poll_id IN (:ids)', { replacements: { ids: replaced }, transaction });
      const shareRows: string[] = [];
      for (const p of part) {
        const id = ids.get(p.key)!;
        for (const [k, v] of p.shares) shareRows.push(`(${id},${esc(k)},${round3(v)})`);
      }
      for (const rows of chunk(shareRows, 20000)) {
        await sequelize.query(`INSERT INTO poll_shares (poll_id, option_key, share) VALUES ${rows.join(',')}`, { transaction });
      }
      await opts.afterBatch?.(++batch);
    }
    return importId;
  });
  return { importId, status: 'committed', ...base, httpStatus: 201 };
}

function signature(v: Record<string, unknown>): string {
  return JSON.stringify(v);
}
