import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import { RESULT_COLUMNS, roleAtLeast, type ImportSummary } from '@veracast/shared-types';
import { ChangeLogModel, ContestModel, ElectionModel, OptionModel } from '../../db/models';
import { applyColumnMap, isIsoDate, isUrl, KEY_RE, parseCsv, refuseRespondentLevel, requireColumns } from './csv';
import { chunk, Collector, recordImport, sqlValue, type ImportOptions } from './common';

interface ResultRow {
  index: number;
  electionKey: string;
  electionDate: string;
  electionName: string;
  jurisdiction: string;
  contestKey: string;
  contestName: string;
  contestKind: 'candidate' | 'referendum' | null;
  optionKey: string;
  optionName: string;
  bloc: string | null;
  votes: number;
  status: 'provisional' | 'certified';
  certifiedOn: string | null;
  sourceUrl: string | null;
  certifyingBody: string | null;
  rejectedBallots: number | null;
  electorate: number | null;
}

export interface ImportOutcome extends ImportSummary {
  /** 201 when written or dry-run, 422 when the file has errors and nothing was written. */
  httpStatus: 201 | 422;
}

const INT_RE = /^\d+$/;

/**
 * Imports certified (or provisional) results per SPEC §3: validate every row, then upsert
 * elections, contests and options in one transaction. Changes to certified results need the
 * reviewer role and a reason, and each is written to the append-only change log.
 */
export async function importResults(sequelize: Sequelize, buffer: Buffer, opts: ImportOptions): Promise<ImportOutcome> {
  const fileHash = createHash('sha256').update(buffer).digest('hex');
  const csv = parseCsv(buffer);
  refuseRespondentLevel(csv.headers);
  const headers = applyColumnMap(csv.headers, opts.columnMap);
  requireColumns(headers, RESULT_COLUMNS);
  const col = (name: string) => headers.indexOf(name);
  const idx = Object.fromEntries([...RESULT_COLUMNS, 'contest_kind', 'certifying_body', 'rejected_ballots', 'electorate'].map((c) => [c, col(c)]));
  const c = new Collector(csv.lineOf);
  const canCertify = roleAtLeast(opts.userRole, 'reviewer');

  const rows: ResultRow[] = [];
  csv.rows.forEach((cells, index) => {
    const get = (name: string) => (idx[name]! >= 0 ? (cells[idx[name]!] ?? '') : '');
    const key = (name: string) => {
      const v = get(name);
      if (!v) c.add(index, name, 'required', `${name} is required`);
      else if (!KEY_RE.test(v)) c.add(index, name, 'bad_key', `${name} "${v}" must use lower-case letters, digits, dot, dash or underscore`);
      return v;
    };
    const text = (name: string, max = 200) => {
      const v = get(name);
      if (!v) c.add(index, name, 'required', `${name} is required`);
      else if (v.length > max) c.add(index, name, 'too_long', `${name} must be at most ${max} characters`);
      return v;
    };
    const optInt = (name: string) => {
      const v = get(name);
      if (!v) return null;
      if (!INT_RE.test(v)) {
        c.add(index, name, 'not_integer', `${name} "${v}" must be a non-negative whole number`);
        return null;
      }
      return Number(v);
    };
    const electionDate = get('election_date');
    if (!isIsoDate(electionDate)) c.add(index, 'election_date', 'bad_date', `election_date "${electionDate}" must be a date as YYYY-MM-DD`);
    const votesRaw = get('votes');
    if (!INT_RE.test(votesRaw)) c.add(index, 'votes', 'not_integer', `votes "${votesRaw}" must be a non-negative whole number`);
    const status = get('status').toLowerCase();
    if (status !== 'provisional' && status !== 'certified') c.add(index, 'status', 'bad_status', `status "${status}" must be provisional or certified`);
    const certifiedOn = get('certified_on') || null;
    if (certifiedOn && !isIsoDate(certifiedOn)) c.add(index, 'certified_on', 'bad_date', `certified_on "${certifiedOn}" must be a date as YYYY-MM-DD`);
    if (status === 'certified' && !certifiedOn) c.add(index, 'certified_on', 'required', 'a certified result needs its certified_on date');
    if (certifiedOn && isIsoDate(electionDate) && certifiedOn < electionDate) c.add(index, 'certified_on', 'before_election', `certified_on ${certifiedOn} is before the election date ${electionDate}`);
    const sourceUrl = get('source_url') || null;
    if (sourceUrl && !isUrl(sourceUrl)) c.add(index, 'source_url', 'bad_url', `source_url "${sourceUrl}" must be an http(s) URL`);
    if (status === 'certified' && !sourceUrl) c.add(index, 'source_url', 'required', 'a certified result needs a source (source_url)');
    if (status === 'certified' && !canCertify) c.add(index, 'status', 'role_required', 'marking a result certified needs the reviewer role; import it as provisional');
    const kindRaw = get('contest_kind').toLowerCase();
    // national, province and race are accepted as synonyms of a candidate race.
    const kind = ['national', 'province', 'race', 'candidate'].includes(kindRaw) ? 'candidate' : kindRaw || null;
    if (kind && kind !== 'candidate' && kind !== 'referendum') c.add(index, 'contest_kind', 'bad_kind', `contest_kind "${kindRaw}" must be candidate or referendum`);
    const optionKey = key('option_key');
    if (optionKey === 'undecided') c.add(index, 'option_key', 'reserved_key', 'undecided is reserved for poll data and cannot have votes');
    rows.push({
      index,
      electionKey: key('election_key'),
      electionDate,
      electionName: text('election_name'),
      jurisdiction: text('jurisdiction', 120),
      contestKey: key('contest_key'),
      contestName: text('contest_name'),
      contestKind: kind === 'candidate' || kind === 'referendum' ? kind : null,
      optionKey,
      optionName: text('option_name'),
      bloc: get('bloc') || null,
      votes: INT_RE.test(votesRaw) ? Number(votesRaw) : 0,
      status: status === 'certified' ? 'certified' : 'provisional',
      certifiedOn,
      sourceUrl,
      certifyingBody: get('certifying_body') || null,
      rejectedBallots: optInt('rejected_ballots'),
      electorate: optInt('electorate'),
    });
  });

  // Consistency across rows: an election's and a contest's fields agree on every row.
  const firstOfElection = new Map<string, ResultRow>();
  const firstOfContest = new Map<string, ResultRow>();
  const seenOption = new Map<string, ResultRow>();
  const duplicateRows = new Set<number>();
  for (const r of rows) {
    const e = firstOfElection.get(r.electionKey);
    if (!e) firstOfElection.set(r.electionKey, r);
    else {
      // jurisdiction may name a contest's own area (a province); the election keeps the first one given.
      for (const [field, column] of [['electionDate', 'election_date'], ['electionName', 'election_name']] as const) {
        if (e[field] !== r[field]) c.add(r.index, column, 'inconsistent', `${column} "${r[field]}" differs from "${e[field]}" given for election ${r.electionKey} on row ${csv.lineOf(e.index)}`);
      }
    }
    const k = firstOfContest.get(r.contestKey);
    if (!k) firstOfContest.set(r.contestKey, r);
    else {
      for (const [field, column] of [['electionKey', 'election_key'], ['contestName', 'contest_name'], ['status', 'status'], ['certifiedOn', 'certified_on'], ['sourceUrl', 'source_url']] as const) {
        if (k[field] !== r[field]) c.add(r.index, column, 'inconsistent', `${column} "${r[field] ?? ''}" differs from "${k[field] ?? ''}" given for contest ${r.contestKey} on row ${csv.lineOf(k.index)}`);
      }
    }
    const ok = `${r.contestKey}\u0000${r.optionKey}`;
    const prev = seenOption.get(ok);
    if (!prev) seenOption.set(ok, r);
    else if (prev.votes !== r.votes || prev.optionName !== r.optionName || prev.bloc !== r.bloc) {
      c.add(r.index, 'option_key', 'duplicate_key', `option ${r.optionKey} of contest ${r.contestKey} appears again with different values (first on row ${csv.lineOf(prev.index)})`);
    } else duplicateRows.add(r.index);
  }

  // Against the database.
  const contestKeys = [...firstOfContest.keys()];
  const existingContests = contestKeys.length ? await ContestModel.findAll({ where: { key: contestKeys } }) : [];
  const existingElections = await ElectionModel.findAll({ where: { key: [...firstOfElection.keys()] } });
  const electionById = new Map(existingElections.map((e) => [e.id, e]));
  const otherElections = existingContests.some((k) => !electionById.has(k.electionId))
    ? await ElectionModel.findAll({ where: { id: existingContests.map((k) => k.electionId) } })
    : [];
  for (const e of otherElections) electionById.set(e.id, e);
  const contestByKey = new Map(existingContests.map((k) => [k.key, k]));
  const existingOptions = existingContests.length ? await OptionModel.findAll({ where: { contestId: existingContests.map((k) => k.id) } }) : [];
  const optionByKey = new Map(existingOptions.map((o) => [`${o.contestId}\u0000${o.key}`, o]));

  /** Certified contests the file changes, with their state before the change. */
  const contestChanges = new Map<string, { before: unknown }>();
  for (const r of rows) {
    const existing = contestByKey.get(r.contestKey);
    if (!existing || c.badRows.has(r.index)) continue;
    const owner = electionById.get(existing.electionId);
    if (owner && owner.key !== r.electionKey) {
      c.add(r.index, 'contest_key', 'contest_elsewhere', `contest ${r.contestKey} already belongs to election ${owner.key}`);
      continue;
    }
    if (existing.resultStatus === 'certified') {
      const o = optionByKey.get(`${existing.id}\u0000${r.optionKey}`);
      const changed =
        !o || Number(o.votes) !== r.votes || o.name !== r.optionName || (o.bloc ?? null) !== r.bloc ||
        r.status !== 'certified' || existing.certifiedOn !== r.certifiedOn || (existing.sourceUrl ?? null) !== r.sourceUrl;
      if (changed) {
        if (!canCertify) c.add(r.index, 'votes', 'role_required', `contest ${r.contestKey} is certified; changing it needs the reviewer role`);
        else if (!opts.reason?.trim()) c.add(r.index, 'votes', 'reason_required', `contest ${r.contestKey} is certified; changing it needs a reason`);
        const entry = contestChanges.get(r.contestKey) ?? { before: snapshot(existing, existingOptions) };
        contestChanges.set(r.contestKey, entry);
      }
    }
  }

  const skippedContests = new Set<string>();
  for (const r of rows) if (c.badRows.has(r.index)) skippedContests.add(r.contestKey);
  const hasErrors = c.errors.length > 0;
  const usable = rows.filter((r) => !skippedContests.has(r.contestKey) && !duplicateRows.has(r.index));
  const skipped = hasErrors ? rows.length - usable.length - duplicateRows.size : 0;

  // Counts per result row (option).
  let created = 0;
  let updated = 0;
  let unchanged = duplicateRows.size;
  for (const r of usable) {
    const k = contestByKey.get(r.contestKey);
    const o = k ? optionByKey.get(`${k.id}\u0000${r.optionKey}`) : undefined;
    if (!k || !o) created++;
    else {
      const same =
        Number(o.votes) === r.votes && o.name === r.optionName && (o.bloc ?? null) === r.bloc && k.resultStatus === r.status &&
        (k.certifiedOn ?? null) === r.certifiedOn && (k.sourceUrl ?? null) === r.sourceUrl && k.name === r.contestName;
      if (same) unchanged++;
      else updated++;
    }
  }
  const base = { rows: rows.length, created, updated, unchanged, skipped, errors: c.errors, validOnly: Boolean(opts.validOnly) };

  if (hasErrors && !opts.validOnly) {
    const importId = await recordImport('results', opts, fileHash, { ...base, created: 0, updated: 0, unchanged: 0, skipped: rows.length }, 'failed');
    return { importId, status: 'failed', ...base, created: 0, updated: 0, unchanged: 0, skipped: rows.length, httpStatus: 422 };
  }
  if (opts.dryRun) {
    const importId = await recordImport('results', opts, fileHash, base, 'dry_run');
    return { importId, status: 'dry_run', ...base, httpStatus: 201 };
  }

  const importId = await sequelize.transaction(async (transaction) => {
    const esc = (v: string) => sequelize.escape(v);
    // Elections. When rows name different jurisdictions (a province's own area), the election takes
    // the one of its largest contest by votes: the national race.
    const contestVotes = new Map<string, number>();
    for (const r of usable) contestVotes.set(r.contestKey, (contestVotes.get(r.contestKey) ?? 0) + r.votes);
    const electionRow = new Map<string, ResultRow>();
    for (const r of usable) {
      const cur = electionRow.get(r.electionKey);
      if (!cur || (contestVotes.get(r.contestKey) ?? 0) > (contestVotes.get(cur.contestKey) ?? 0)) electionRow.set(r.electionKey, r);
    }
    const elections = [...electionRow.values()];
    if (elections.length) {
      await sequelize.query(
        `INSERT INTO elections (\`key\`, name, election_date, jurisdiction) VALUES ${elections
          .map((r) => `(${[r.electionKey, r.electionName, r.electionDate, r.jurisdiction].map((v) => sqlValue(esc, v)).join(',')})`)
          .join(',')} ON DUPLICATE KEY UPDATE name = VALUES(name), election_date = VALUES(election_date), jurisdiction = VALUES(jurisdiction), updated_at = IF(name <=> VALUES(name) AND election_date <=> VALUES(election_date) AND jurisdiction <=> VALUES(jurisdiction), updated_at, NOW(3))`,
        { transaction },
      );
    }
    const electionIds = new Map(
      (await sequelize.query<{ id: number; key: string }>('SELECT id, `key` FROM elections WHERE `key` IN (:keys)', {
        replacements: { keys: elections.map((e) => e.electionKey).concat(['\u0000']) }, type: QueryTypes.SELECT, transaction,
      })).map((e) => [e.key, e.id]),
    );
    // Contests.
    const contests = [...new Map(usable.map((r) => [r.contestKey, r])).values()];
    for (const part of chunk(contests, 2000)) {
      await sequelize.query(
        `INSERT INTO contests (election_id, \`key\`, name, kind, result_status, certified_on, certifying_body, source_url, rejected_ballots, electorate) VALUES ${part
          .map((r) => `(${[electionIds.get(r.electionKey), r.contestKey, r.contestName, r.contestKind ?? (r.bloc === 'YES' || r.bloc === 'NO' ? 'referendum' : 'candidate'), r.status, r.certifiedOn, r.certifyingBody, r.sourceUrl, r.rejectedBallots, r.electorate].map((v) => sqlValue(esc, v)).join(',')})`)
          .join(',')} ON DUPLICATE KEY UPDATE name = VALUES(name), kind = VALUES(kind), result_status = VALUES(result_status), certified_on = VALUES(certified_on),
          certifying_body = COALESCE(VALUES(certifying_body), certifying_body), source_url = VALUES(source_url),
          rejected_ballots = COALESCE(VALUES(rejected_ballots), rejected_ballots), electorate = COALESCE(VALUES(electorate), electorate), updated_at = NOW(3)`,
        { transaction },
      );
    }
    const contestIds = new Map<string, number>();
    for (const part of chunk(contests.map((k) => k.contestKey), 5000)) {
      const found = await sequelize.query<{ id: number; key: string }>('SELECT id, `key` FROM contests WHERE `key` IN (:keys)', { replacements: { keys: part }, type: QueryTypes.SELECT, transaction });
      for (const k of found) contestIds.set(k.key, k.id);
    }
    // Options with their votes.
    let batch = 0;
    for (const part of chunk(usable, 5000)) {
      await sequelize.query(
        `INSERT INTO options (contest_id, \`key\`, name, bloc, votes) VALUES ${part
          .map((r) => `(${[contestIds.get(r.contestKey), r.optionKey, r.optionName, r.bloc, r.votes].map((v) => sqlValue(esc, v)).join(',')})`)
          .join(',')} ON DUPLICATE KEY UPDATE name = VALUES(name), bloc = VALUES(bloc), votes = VALUES(votes)`,
        { transaction },
      );
      await opts.afterBatch?.(++batch);
    }
    // Change log: certifications and every change to a certified result.
    const logged = new Set<string>();
    for (const r of contests) {
      const before = contestChanges.get(r.contestKey)?.before;
      const wasCertified = contestByKey.get(r.contestKey)?.resultStatus === 'certified';
      if (!before && !(r.status === 'certified' && !wasCertified)) continue;
      if (logged.has(r.contestKey)) continue;
      logged.add(r.contestKey);
      const after = {
        status: r.status, certifiedOn: r.certifiedOn, sourceUrl: r.sourceUrl,
        votes: Object.fromEntries(usable.filter((x) => x.contestKey === r.contestKey).map((x) => [x.optionKey, x.votes])),
      };
      await ChangeLogModel.create(
        { entity: 'result', entityKey: r.contestKey, action: before ? 'change_certified' : 'certify', userId: opts.userId, reason: opts.reason?.trim() || null, beforeValue: before ? JSON.stringify(before) : null, afterValue: JSON.stringify(after) },
        { transaction },
      );
    }
    return recordImport('results', opts, fileHash, base, 'committed', transaction);
  });
  return { importId, status: 'committed', ...base, httpStatus: 201 };
}

function snapshot(contest: ContestModel, options: OptionModel[]) {
  return {
    status: contest.resultStatus,
    certifiedOn: contest.certifiedOn,
    sourceUrl: contest.sourceUrl,
    votes: Object.fromEntries(options.filter((o) => o.contestId === contest.id).map((o) => [o.key, o.votes == null ? null : Number(o.votes)])),
  };
}

