import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import * as mariadb from 'mariadb';
import { QueryTypes, Sequelize } from 'sequelize';
import { POLL_COLUMNS } from '@veracast/shared-types';
import { createTestApp, type SignedInAgent, type TestApp } from '../helpers/test-app';
import { buildPoll, buildResults, pollsCsv, resultsCsv, toCsv } from '../helpers/factories';
import { importPolls } from '../../backend/src/commands/imports/polls';

let t: TestApp;
let analyst: SignedInAgent;
let reviewer: SignedInAgent;
const count = async (table: string) =>
  Number((await t.ctx.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table}`, { type: QueryTypes.SELECT }))[0]!.n);

beforeAll(async () => {
  t = await createTestApp({ UPLOAD_MAX_MB: '1' });
  analyst = await t.signIn('analyst');
  reviewer = await t.signIn('reviewer');
  await reviewer.post('/api/v1/imports/results').attach('file', resultsCsv(), 'results.csv').expect(201);
});
afterAll(async () => t.close());

describe('roles', () => {
  it('401 signed out, 403 for a viewer', async () => {
    await request(t.app).post('/api/v1/imports/polls').attach('file', pollsCsv(buildPoll()), 'p.csv').expect(401);
    const viewer = await t.signIn('viewer');
    const res = await viewer.post('/api/v1/imports/polls').attach('file', pollsCsv(buildPoll()), 'p.csv').expect(403);
    expect(res.body.error.code).toBe('forbidden');
    await viewer.get('/api/v1/imports').expect(200);
  });

  it('an analyst cannot certify a result: the row says so and nothing is written', async () => {
    const rows = buildResults({ election_key: 'tst-2031-x', election_date: '2031-01-01', certified_on: '2031-01-10' }).map((r) => ({ ...r, contest_key: `${r.contest_key}-31` }));
    const res = await analyst.post('/api/v1/imports/results').attach('file', resultsCsv(rows), 'r.csv').expect(422);
    expect(res.body.errors[0]).toMatchObject({ row: 2, column: 'status', code: 'role_required' });
    expect(res.body.errors[0].message).toMatch(/needs the reviewer role/);
    const ok = await analyst.post('/api/v1/imports/results').attach('file', resultsCsv(rows.map((r) => ({ ...r, status: 'provisional' }))), 'r.csv').expect(201);
    expect(ok.body.created).toBe(6);
  });
});

describe('results import', () => {
  it('committed the certified results with their votes', async () => {
    const votes = await t.ctx.sequelize.query<{ key: string; votes: number }>("SELECT o.`key`, o.votes FROM options o JOIN contests c ON c.id = o.contest_id WHERE c.`key` = 'tst-2030-national' ORDER BY o.`key`", { type: QueryTypes.SELECT });
    expect(votes.map((v) => [v.key, Number(v.votes)])).toEqual([['blue', 450000], ['green', 70000], ['red', 480000]]);
  });

  it('re-importing the same file changes nothing', async () => {
    const res = await reviewer.post('/api/v1/imports/results').attach('file', resultsCsv(), 'results.csv').expect(201);
    expect(res.body).toMatchObject({ status: 'committed', rows: 6, created: 0, updated: 0, unchanged: 6 });
  });

  it('names row, column and rule for each bad row', async () => {
    const rows = buildResults();
    rows[1] = { ...rows[1]!, votes: '12.5' };
    rows[2] = { ...rows[2]!, election_date: '2030-02-30' };
    rows[3] = { ...rows[3]!, status: 'final' };
    rows[4] = { ...rows[4]!, option_key: 'Blue Party' };
    const res = await reviewer.post('/api/v1/imports/results').attach('file', resultsCsv(rows), 'bad.csv').expect(422);
    const has = (row: number, column: string, code: string) => expect(res.body.errors).toContainEqual(expect.objectContaining({ row, column, code }));
    has(3, 'votes', 'not_integer');
    has(4, 'election_date', 'bad_date');
    has(5, 'status', 'bad_status');
    has(6, 'option_key', 'bad_key');
    expect(res.body.errors.find((e: { row: number; column: string }) => e.row === 3 && e.column === 'votes').message).toBe('votes "12.5" must be a non-negative whole number');
  });

  it('a certified result cannot be changed without a reason; with one the change log keeps before and after', async () => {
    const changed = buildResults().map((r) => (r.contest_key === 'tst-2030-north' && r.option_key === 'red' ? { ...r, votes: 41000 } : r));
    const refused = await reviewer.post('/api/v1/imports/results').attach('file', resultsCsv(changed), 'fix.csv').expect(422);
    expect(refused.body.errors[0]).toMatchObject({ column: 'votes', code: 'reason_required' });
    const res = await reviewer.post('/api/v1/imports/results').field('reason', 'Recount in North province').attach('file', resultsCsv(changed), 'fix.csv').expect(201);
    expect(res.body).toMatchObject({ updated: 1, unchanged: 5 });
    const log = await t.ctx.sequelize.query<{ action: string; reason: string; before_value: string; after_value: string }>("SELECT action, reason, before_value, after_value FROM change_log WHERE entity_key = 'tst-2030-north' ORDER BY id", { type: QueryTypes.SELECT });
    const last = log[log.length - 1]!;
    expect(last.action).toBe('change_certified');
    expect(last.reason).toBe('Recount in North province');
    expect(JSON.parse(last.before_value).votes.red).toBe(40000);
    expect(JSON.parse(last.after_value).votes.red).toBe(41000);
    // The log is append-only in the database itself.
    await expect(t.ctx.sequelize.query('DELETE FROM change_log')).rejects.toThrow(/append-only/);
  });
});

describe('polls import', () => {
  it('validates every rule with a message naming row and column', async () => {
    const rows = [
      ...buildPoll({ poll_key: 'p-unknown', contest_key: 'nowhere' }),
      ...buildPoll({ poll_key: 'p-sum' }, { red: 60, blue: 41 }),
      ...buildPoll({ poll_key: 'p-dates', fieldwork_start: '2030-04-25', fieldwork_end: '2030-04-20', published_on: '2030-04-26' }),
      ...buildPoll({ poll_key: 'p-n', sample_size: '800.5' }),
      ...buildPoll({ poll_key: 'p-late', fieldwork_end: '2030-05-06', published_on: '2030-05-07' }),
      ...buildPoll({ poll_key: 'p-pop', population: 'voters', mode: 'carrier-pigeon' }),
      ...buildPoll({ poll_key: 'p-opt' }, { red: 40, purple: 10 }),
    ];
    rows.push({ ...rows[rows.length - 1]!, option_key: 'red', share: 41 });
    const res = await analyst.post('/api/v1/imports/polls').attach('file', pollsCsv(rows), 'bad.csv').expect(422);
    const codes = new Set(res.body.errors.map((e: { code: string }) => e.code));
    for (const code of ['unknown_contest', 'sum_over_100', 'end_before_start', 'not_positive_integer', 'after_election', 'bad_population', 'bad_mode', 'unknown_option', 'duplicate_key']) {
      expect(codes, code).toContain(code);
    }
    const sum = res.body.errors.find((e: { code: string }) => e.code === 'sum_over_100');
    expect(sum.message).toBe('shares of poll p-sum sum to 101, past 100.5');
    expect(sum.row).toBe(7); // header row 1, p-unknown rows 2–5, p-sum rows 6–7
    expect(await count('polls')).toBe(0);
    const listed = await analyst.get(`/api/v1/imports/${res.body.importId}/errors?format=csv`).expect(200);
    expect(listed.text).toMatch(/row,column,code,message/);
  });

  it('imports, then re-imports the same rows with no change', async () => {
    const rows = [...buildPoll({ poll_key: 'a-1' }), ...buildPoll({ poll_key: 'a-2', pollster: 'Beta Polling', fieldwork_end: '2030-05-01', published_on: '2030-05-02' })];
    const first = await analyst.post('/api/v1/imports/polls').attach('file', pollsCsv(rows), 'p.csv').expect(201);
    expect(first.body).toMatchObject({ status: 'committed', rows: 8, created: 2, updated: 0, unchanged: 0 });
    expect(first.body.newPollsters.sort()).toEqual(['Alpha Research', 'Beta Polling']);
    const before = await count('poll_shares');
    const again = await analyst.post('/api/v1/imports/polls').attach('file', pollsCsv(rows), 'p.csv').expect(201);
    expect(again.body).toMatchObject({ created: 0, updated: 0, unchanged: 2 });
    expect(await count('poll_shares')).toBe(before);
    const changed = rows.map((r) => (r.poll_key === 'a-2' && r.option_key === 'red' ? { ...r, share: 45 } : r));
    const third = await analyst.post('/api/v1/imports/polls').attach('file', pollsCsv(changed), 'p.csv').expect(201);
    expect(third.body).toMatchObject({ created: 0, updated: 1, unchanged: 1 });
  });

  it('a dry run reports what would change and writes nothing', async () => {
    const before = await count('polls');
    const res = await analyst.post('/api/v1/imports/polls?dryRun=true').attach('file', pollsCsv(buildPoll({ poll_key: 'dry-1' })), 'p.csv').expect(201);
    expect(res.body).toMatchObject({ status: 'dry_run', created: 1 });
    expect(await count('polls')).toBe(before);
  });

  it('matches pollster aliases and spelling variants to one firm', async () => {
    await analyst.post('/api/v1/imports/polls').attach('file', pollsCsv(buildPoll({ poll_key: 'al-1', pollster: 'ALPHA  research.' })), 'p.csv').expect(201);
    const firms = await t.ctx.sequelize.query<{ name: string }>("SELECT DISTINCT f.name FROM polls p JOIN pollsters f ON f.id = p.pollster_id WHERE p.`key` IN ('a-1','al-1')", { type: QueryTypes.SELECT });
    expect(firms).toEqual([{ name: 'Alpha Research' }]);
    // An unknown name mapped explicitly to a firm becomes its alias.
    const alpha = (await t.ctx.sequelize.query<{ id: number }>("SELECT id FROM pollsters WHERE name = 'Alpha Research'", { type: QueryTypes.SELECT }))[0]!.id;
    await analyst.post('/api/v1/imports/polls').field('pollsterMap', JSON.stringify({ 'AR Institute': alpha })).attach('file', pollsCsv(buildPoll({ poll_key: 'al-2', pollster: 'AR Institute' })), 'p.csv').expect(201);
    const alias = await t.ctx.sequelize.query<{ pollster_id: number }>("SELECT pollster_id FROM pollster_aliases WHERE alias = 'AR Institute'", { type: QueryTypes.SELECT });
    expect(alias[0]?.pollster_id).toBe(alpha);
  });

  it('maps a wide layout and its option columns', async () => {
    const header = ['poll_key', 'pollster', 'sponsor', 'contest_key', 'fieldwork_start', 'fieldwork_end', 'published_on', 'sample_size', 'population', 'mode', 'moe', 'Red %', 'Blue %', 'Green %', 'DK'];
    const body = toCsv(header, [{ poll_key: 'w-1', pollster: 'Gamma', sponsor: '', contest_key: 'tst-2030-north', fieldwork_start: '2030-04-01', fieldwork_end: '2030-04-03', published_on: '2030-04-04', sample_size: 600, population: 'rv', mode: 'phone', moe: '', 'Red %': 41, 'Blue %': 50, 'Green %': 6, DK: 3 }]);
    const optionMap = { 'red %': 'red', 'blue %': 'blue', 'green %': 'green', dk: 'undecided' };
    const res = await analyst.post('/api/v1/imports/polls?layout=wide').field('optionMap', JSON.stringify(optionMap)).attach('file', body, 'wide.csv').expect(201);
    expect(res.body.created).toBe(1);
    const shares = await t.ctx.sequelize.query<{ option_key: string; share: string }>("SELECT s.option_key, s.share FROM poll_shares s JOIN polls p ON p.id = s.poll_id WHERE p.`key` = 'w-1' ORDER BY s.option_key", { type: QueryTypes.SELECT });
    expect(shares.map((s) => [s.option_key, Number(s.share)])).toEqual([['blue', 50], ['green', 6], ['red', 41], ['undecided', 3]]);
  });

  it('refuses respondent-level files', async () => {
    const body = toCsv(['respondent_id', 'age', 'gender', 'vote_intention'], [{ respondent_id: 1, age: 34, gender: 'f', vote_intention: 'red' }]);
    const res = await analyst.post('/api/v1/imports/polls').attach('file', body, 'micro.csv').expect(422);
    expect(res.body.error.code).toBe('respondent_level');
    expect(res.body.error.message).toMatch(/only published aggregates/);
  });

  it('takes only the valid polls when asked, and records that choice', async () => {
    const rows = [...buildPoll({ poll_key: 'v-good' }), ...buildPoll({ poll_key: 'v-bad', sample_size: 0 })];
    const res = await analyst.post('/api/v1/imports/polls?validOnly=true').attach('file', pollsCsv(rows), 'p.csv').expect(201);
    expect(res.body).toMatchObject({ created: 1, skipped: 1, validOnly: true });
    expect(res.body.errors[0]).toMatchObject({ column: 'sample_size', code: 'not_positive_integer' });
    const record = await analyst.get(`/api/v1/imports/${res.body.importId}`).expect(200);
    expect(record.body.validOnly).toBe(true);
  });

  it('is all or nothing: a failure after the first batch leaves nothing written', async () => {
    const rows = Array.from({ length: 5200 }, (_, i) => buildPoll({ poll_key: `bulk-${i}` }, { red: 45, blue: 45 })).flat();
    const before = await count('polls');
    const beforeShares = await count('poll_shares');
    await expect(
      importPolls(t.ctx.sequelize, pollsCsv(rows), { fileName: 'bulk.csv', userId: analyst.user.id, userRole: 'analyst', afterBatch: (b) => { if (b === 1) throw new Error('injected failure'); } }),
    ).rejects.toThrow('injected failure');
    expect(await count('polls')).toBe(before);
    expect(await count('poll_shares')).toBe(beforeShares);
  });

  it('refuses an upload past the size limit with a clear message', async () => {
    const res = await analyst.post('/api/v1/imports/polls').attach('file', Buffer.alloc(1024 * 1024 + 10, 'a'), 'big.csv').expect(413);
    expect(res.body.error.message).toMatch(/larger than the 1 MB upload limit/);
  });

  it('lists imports with who ran them', async () => {
    const res = await analyst.get('/api/v1/imports').expect(200);
    expect(res.body.items.length).toBeGreaterThan(3);
    expect(res.body.items.some((i: { user: string; status: string }) => i.user === analyst.user.email && i.status === 'failed')).toBe(true);
  });
});

describe('how new polls are written', () => {
  const COLUMNS = ['pollster_id', 'sponsor_id', 'contest_id', 'fieldwork_start', 'fieldwork_end', 'published_on', 'sample_size', 'population', 'mode', 'moe',
    'study_key', 'is_headline', 'tracking', 'source_url', 'question_wording', 'weighting_statement', 'tables_url'];
  /** Two polls whose free texts hold what LOAD DATA's text format escapes (backslash, tab). */
  const file = (prefix: string) => {
    const extra = ['sponsor_type', 'study_key', 'source_url', 'tables_url', 'question_wording', 'weighting_statement', 'is_headline', 'tracking'];
    const rows = [
      ...buildPoll({ poll_key: `${prefix}-1`, sponsor_type: 'media', study_key: 'wave\\1\tlv', source_url: 'https://example.org/a\\b', tables_url: '', question_wording: 'yes', weighting_statement: 'no', is_headline: 'yes', tracking: 'no' }),
      ...buildPoll({ poll_key: `${prefix}-2`, moe: '', sponsor: '', sponsor_type: '', study_key: '', source_url: '', tables_url: 'https://example.org/t?x=1', question_wording: 'no', weighting_statement: 'yes', is_headline: 'no', tracking: 'yes' }),
    ];
    return toCsv([...POLL_COLUMNS, ...extra], rows);
  };
  const stored = async (prefix: string) =>
    t.ctx.sequelize.query<Record<string, unknown>>(
      `SELECT ${COLUMNS.map((c) => `CAST(${c} AS CHAR) AS ${c}`).join(', ')} FROM polls WHERE \`key\` LIKE :p ORDER BY \`key\``,
      { replacements: { p: `${prefix}-%` }, type: QueryTypes.SELECT },
    );

  it('through the bulk loader and, where loading local files is refused, through INSERT: the same rows', async () => {
    const user = await t.createUser('analyst');
    const loaded = await importPolls(t.ctx.sequelize, file('bulk'), { fileName: 'bulk.csv', userId: user.user.id, userRole: 'analyst' });
    expect(loaded.status).toBe('committed');
    // A connection that refuses LOAD DATA LOCAL: the import falls back to INSERT.
    const { config } = t;
    const refusing = new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, {
      dialect: 'mariadb', dialectModule: mariadb, host: config.DB_HOST, port: config.DB_PORT, timezone: '+00:00', logging: false,
      dialectOptions: { permitLocalInfile: false },
    });
    try {
      const inserted = await importPolls(refusing, file('text'), { fileName: 'text.csv', userId: user.user.id, userRole: 'analyst' });
      expect(inserted.status).toBe('committed');
    } finally {
      await refusing.close();
    }
    const viaLoader = await stored('bulk');
    expect(viaLoader).toHaveLength(2);
    expect(viaLoader[0]!.study_key).toBe('wave\\1\tlv');
    expect(viaLoader[0]!.source_url).toBe('https://example.org/a\\b');
    expect(viaLoader[1]!.moe).toBeNull();
    expect(viaLoader[1]!.sponsor_id).toBeNull();
    expect(await stored('text')).toEqual(viaLoader);
    const shares = async (prefix: string) => t.ctx.sequelize.query<{ option_key: string; share: string }>(
      'SELECT s.option_key, CAST(s.share AS CHAR) AS share FROM poll_shares s JOIN polls p ON p.id = s.poll_id WHERE p.`key` LIKE :p ORDER BY p.`key`, s.option_key',
      { replacements: { p: `${prefix}-%` }, type: QueryTypes.SELECT },
    );
    expect(await shares('text')).toEqual(await shares('bulk'));
    expect((await shares('bulk')).length).toBe(8);
  });
});
