import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { gunzipSync } from 'node:zlib';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { decodePollChunk } from '../../backend/src/commands/audits/stored-polls';
import { ensureAnalyses } from '../../backend/src/commands/audits/analyses';
import { HASH_SCHEME, loadAuditInputs } from '../../backend/src/commands/audits/inputs';
import { createTestApp, type SignedInAgent, type TestApp } from '../helpers/test-app';
import { buildPoll, buildResultRow, pollsCsv, resultsCsv } from '../helpers/factories';

let t: TestApp;
let reviewer: SignedInAgent;
let analyst: SignedInAgent;
let viewer: SignedInAgent;

const E = 'ref-2030';
/** Three contests whose certified shares are METHODS §1's check cases (other parties in `other`). */
const results = [
  ['ref-c1', [502000, 473000, 25000]],
  ['ref-c2', [48000, 49500, 2500]],
  ['ref-c3', [50500, 49500, 0]],
].flatMap(([contest, votes]) =>
  (['red', 'blue', 'other'] as const).map((option, i) =>
    buildResultRow({ election_key: E, election_date: '2030-05-05', contest_key: contest as string, contest_name: contest as string, option_key: option, option_name: option, bloc: option === 'other' ? '' : option.toUpperCase(), votes: (votes as number[])[i]! }),
  ),
);
const polls = [
  ...buildPoll({ poll_key: 'ref-p1', contest_key: 'ref-c1', sample_size: 1000 }, { red: 48, blue: 44, other: 2, undecided: 6 }),
  ...buildPoll({ poll_key: 'ref-p2', contest_key: 'ref-c2', sample_size: 1000 }, { red: 47, blue: 45, undecided: 8 }),
  ...buildPoll({ poll_key: 'ref-p3', contest_key: 'ref-c3', sample_size: 1000 }, { red: 46, blue: 46, undecided: 8 }),
  ...buildPoll({ poll_key: 'ref-early', contest_key: 'ref-c1', fieldwork_start: '2030-03-01', fieldwork_end: '2030-03-03', published_on: '2030-03-04' }, { red: 40, blue: 50, undecided: 10 }),
  ...buildPoll({ poll_key: 'csv-1', pollster: "=cmd|' /C calc'!A0", contest_key: 'ref-c3' }, { red: 45, blue: 45 }),
  ...buildPoll({ poll_key: 'csv-2', pollster: '+SUM(1)', contest_key: 'ref-c3' }, { red: 45, blue: 45 }),
  ...buildPoll({ poll_key: 'csv-3', pollster: '-2+3 Research', contest_key: 'ref-c3' }, { red: 45, blue: 45 }),
  ...buildPoll({ poll_key: 'csv-4', pollster: '@Mention Polls', contest_key: 'ref-c3' }, { red: 45, blue: 45 }),
];

/** Creates an audit through the API and waits until its analyses are stored too (they follow the 201). */
async function audit(undecided: 'raw' | 'proportional' | 'two_party', extra: object = {}) {
  const res = await analyst.post('/api/v1/audits').send({ name: `ref ${undecided}`, electionKeys: [E], undecided, finalOnly: false, ...extra }).expect(201);
  await ensureAnalyses(t.ctx.sequelize, res.body.id as number);
  return res.body as { id: number; dataHash: string; outOfDate: boolean };
}
async function pollsOf(id: number) {
  const res = await viewer.get(`/api/v1/audits/${id}/polls`).expect(200);
  return new Map((res.body.items as { pollKey: string }[]).map((i) => [i.pollKey, i as Record<string, unknown>]));
}

beforeAll(async () => {
  t = await createTestApp();
  reviewer = await t.signIn('reviewer');
  analyst = await t.signIn('analyst');
  viewer = await t.signIn('viewer');
  await reviewer.post('/api/v1/imports/results').attach('file', resultsCsv(results), 'r.csv').expect(201);
  await analyst.post('/api/v1/imports/polls').attach('file', pollsCsv(polls), 'p.csv').expect(201);
  await reviewer.put(`/api/v1/elections/${E}/orientation`).send({ blocA: 'RED', blocB: 'BLUE' }).expect(200);
});
afterAll(async () => t.close());

describe('POST /api/v1/audits', () => {
  it('401 signed out, 403 for a viewer', async () => {
    await request(t.app).post('/api/v1/audits').send({ name: 'x', electionKeys: [E] }).expect(401);
    const res = await viewer.post('/api/v1/audits').send({ name: 'x', electionKeys: [E] }).expect(403);
    expect(res.body.error.message).toMatch(/analyst/);
  });

  it.each([
    [{ electionKeys: [E] }, 'name'],
    [{ name: 'x', electionKeys: [] }, 'electionKeys'],
    [{ name: 'x', electionKeys: [E], windowDays: -1 }, 'windowDays'],
    [{ name: 'x', electionKeys: [E], undecided: 'ignore' }, 'undecided'],
    [{ name: 'x', electionKeys: [E], minPolls: 0 }, 'minPolls'],
    [{ name: 'x', electionKeys: [E], designEffect: 0.5 }, 'designEffect'],
    [{ name: 'x', electionKeys: [E], finalOnly: 'yes' }, 'finalOnly'],
  ])('400 naming the bad field %#', async (body, field) => {
    const res = await analyst.post('/api/v1/audits').send(body).expect(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('422 for an unknown election, 404 for an unknown audit', async () => {
    const res = await analyst.post('/api/v1/audits').send({ name: 'x', electionKeys: ['nope-2030'] }).expect(422);
    expect(res.body.error.message).toMatch(/nope-2030/);
    await viewer.get('/api/v1/audits/999999').expect(404);
  });
});

describe('the three undecided treatments end to end (METHODS §1 check cases)', () => {
  // [computed] METHODS.md §1 table: numpy 1.24.2 / R 4.2.2; tolerance 1e-6
  it('raw', async () => {
    const a = await audit('raw');
    const p = await pollsOf(a.id);
    expect(p.get('ref-p1')!.marginError as number).toBeCloseTo(1.1, 6);
    expect(p.get('ref-p2')!.marginError as number).toBeCloseTo(3.5, 6);
    expect(p.get('ref-p3')!.marginError as number).toBeCloseTo(-1.0, 6);
    expect(p.get('ref-p1')!.twoPartyShareError as number).toBeCloseTo(0.686734, 6);
    expect(p.get('ref-p2')!.twoPartyShareError as number).toBeCloseTo(1.856187, 6);
    expect(p.get('ref-p3')!.twoPartyShareError as number).toBeCloseTo(-0.5, 6);
    expect([p.get('ref-p1')!.winnerCalled, p.get('ref-p2')!.winnerCalled, p.get('ref-p3')!.winnerCalled]).toEqual([true, false, null]);
    expect(p.get('ref-p1')!.lean).toBe('A');
    expect(p.get('ref-p3')!.lean).toBe('B');
  });

  it('proportional', async () => {
    const p = await pollsOf((await audit('proportional')).id);
    expect(p.get('ref-p1')!.marginError as number).toBeCloseTo(1.355319, 6);
    expect(p.get('ref-p2')!.marginError as number).toBeCloseTo(3.673913, 6);
    expect(p.get('ref-p3')!.marginError as number).toBeCloseTo(-1.0, 6);
  });

  it('two_party: the margin error is twice the two-party share error', async () => {
    const p = await pollsOf((await audit('two_party')).id);
    expect(p.get('ref-p1')!.marginError as number).toBeCloseTo(2 * 0.686734, 5);
    expect(p.get('ref-p2')!.marginError as number).toBeCloseTo(2 * 1.856187, 5);
    expect(p.get('ref-p3')!.marginError as number).toBeCloseTo(-1.0, 6);
  });

  it('marks the window: an early poll is outside 21 days and is never final', async () => {
    const a = await audit('raw', { finalOnly: true });
    const p = await pollsOf(a.id);
    expect(p.get('ref-early')).toMatchObject({ inWindow: false, isFinal: false });
    expect(p.get('ref-p1')).toMatchObject({ inWindow: true, isFinal: true });
    const used = await viewer.get(`/api/v1/audits/${a.id}/polls?used=true`).expect(200);
    expect(used.body.items.map((i: { pollKey: string }) => i.pollKey)).not.toContain('ref-early');
  });
});

describe('frozen audits', () => {
  it('the database refuses to change a stored audit', async () => {
    const a = await audit('raw');
    await expect(t.ctx.sequelize.query(`UPDATE audits SET name = 'tampered' WHERE id = ${a.id}`)).rejects.toThrow(/frozen/);
    await expect(t.ctx.sequelize.query(`UPDATE audit_parts SET payload = '{}' WHERE audit_id = ${a.id} AND kind = 'polls'`)).rejects.toThrow(/frozen/);
    await expect(t.ctx.sequelize.query(`UPDATE audit_parts SET payload = '{}' WHERE audit_id = ${a.id} AND kind = 'scorecards'`)).rejects.toThrow(/frozen/);
  });

  it('says out of date after a result changes, keeps its numbers, and a re-run makes a new audit', async () => {
    const a = await audit('raw');
    const before = await pollsOf(a.id);
    expect((await viewer.get(`/api/v1/audits/${a.id}`).expect(200)).body.outOfDate).toBe(false);
    await reviewer
      .put('/api/v1/contests/ref-c1/result')
      .send({ status: 'certified', certifiedOn: '2030-05-20', sourceUrl: 'https://example.org/results/2030', votes: { red: 512000 }, reason: 'Recount' })
      .expect(200);
    const after = (await viewer.get(`/api/v1/audits/${a.id}`).expect(200)).body;
    expect(after.outOfDate).toBe(true);
    expect(after.currentHash).not.toBe(a.dataHash);
    expect((await pollsOf(a.id)).get('ref-p1')!.marginError).toBe(before.get('ref-p1')!.marginError);
    await viewer.post(`/api/v1/audits/${a.id}/rerun`).expect(403);
    const rerun = (await analyst.post(`/api/v1/audits/${a.id}/rerun`).expect(201)).body;
    expect(rerun.id).not.toBe(a.id);
    expect(rerun.rerunOf).toBe(a.id);
    expect(rerun.dataHash).toBe(after.currentHash);
    expect((await pollsOf(rerun.id)).get('ref-p1')!.marginError).not.toBe(before.get('ref-p1')!.marginError);
  });
});

describe('data hash schemes', () => {
  it('an audit is checked against the hash scheme it was stored with; earlier audits keep scheme 1', async () => {
    const a = await audit('raw');
    const q = t.ctx.sequelize;
    const [row] = await q.query<{ hash_scheme: number }>('SELECT hash_scheme FROM audits WHERE id = ?', { replacements: [a.id], type: QueryTypes.SELECT });
    expect(row!.hash_scheme).toBe(HASH_SCHEME);
    const v1 = (await loadAuditInputs(q, [E], 1)).dataHash;
    expect(v1).not.toBe(a.dataHash);
    // Copies of the audit as stored before schemes existed (scheme 1, its hash), and a mismatched one.
    const copy = async (hash: string, scheme: number) => {
      await q.query(`INSERT INTO audits (name, settings, data_hash, hash_scheme, core_version, poll_count, summary, created_by_id)
        SELECT 'scheme copy', settings, ?, ?, core_version, poll_count, summary, created_by_id FROM audits WHERE id = ?`, { replacements: [hash, scheme, a.id] });
      const [last] = await q.query<{ id: number }>('SELECT MAX(id) AS id FROM audits', { type: QueryTypes.SELECT });
      return (await viewer.get(`/api/v1/audits/${last!.id}`).expect(200)).body as { outOfDate: boolean; currentHash: string };
    };
    expect(await copy(v1, 1)).toMatchObject({ outOfDate: false, currentHash: v1 });
    expect(await copy(v1, 2)).toMatchObject({ outOfDate: true, currentHash: a.dataHash });
    expect(await copy(a.dataHash, 1)).toMatchObject({ outOfDate: true, currentHash: v1 });
  });
});

describe('storage', () => {
  const rows = async (sql: string) => (await t.ctx.sequelize.query(sql, { type: QueryTypes.SELECT })) as Record<string, unknown>[];

  it('stores poll rows, scorecards and analyses as gzip-compressed parts and no audit_polls rows', async () => {
    const a = await audit('raw');
    const parts = await rows(`SELECT kind, part_key, chunk, encoding, payload FROM audit_parts WHERE audit_id = ${a.id} ORDER BY kind, part_key, chunk`);
    // ORDER BY an ENUM column follows the order of its values.
    expect(parts.map((p) => [p.kind, p.part_key, p.chunk, p.encoding])).toEqual([
      ['scorecards', '', 0, 'gzip'], ['shared_error', E, 0, 'gzip'], ['polls', E, 0, 'gzip'],
    ]);
    // A binary block: 'VCP3', the JSON header's length, the header (text columns), then number and flag columns.
    const block = gunzipSync(parts[2]!.payload as Buffer);
    expect(block.subarray(0, 4).toString('latin1')).toBe('VCP3');
    const header = JSON.parse(block.toString('utf8', 8, 8 + block.readUInt32LE(4))) as { format: string; n: number; values: Record<string, unknown[]> };
    expect(header.format).toBe('audit-polls/3');
    const chunk = decodePollChunk(block);
    const api = await pollsOf(a.id);
    expect(api.size).toBe(8);
    expect(header.n).toBe(8);
    expect([...(header.values.pollKey as string[])].sort()).toEqual([...api.keys()].sort());
    expect(chunk).toEqual([...api.values()].sort((a, b) => (`${a.contestKey}|${a.pollKey}` < `${b.contestKey}|${b.pollKey}` ? -1 : 1)));
    expect(await rows(`SELECT 1 FROM audit_polls WHERE audit_id = ${a.id}`)).toEqual([]);
  });

  it('still reads an audit stored in the earlier forms (audit_polls rows, plain JSON parts, analyses on the audit row)', async () => {
    const a = await audit('raw');
    const items = [...(await pollsOf(a.id)).values()];
    const scorecards = (await viewer.get(`/api/v1/audits/${a.id}/scorecards`).expect(200)).body;
    const q = t.ctx.sequelize;
    // A copy of the audit as the earlier versions stored it: one audit_polls row per poll.
    await q.query(`INSERT INTO audits (name, settings, data_hash, hash_scheme, core_version, poll_count, summary, scorecards, shared_error, created_by_id)
      SELECT 'earlier form', settings, data_hash, hash_scheme, core_version, poll_count, summary, NULL, NULL, created_by_id FROM audits WHERE id = ${a.id}`);
    const [{ id }] = (await rows('SELECT MAX(id) AS id FROM audits')) as [{ id: number }];
    const fields = Object.keys(items[0]!);
    for (const [n, item] of items.entries()) {
      // The first poll in the oldest form (a JSON object), the others tagged arrays.
      const metrics = n === 0 ? JSON.stringify(item) : JSON.stringify(['audit-poll/1', ...fields.map((f) => item[f])]);
      await q.query('INSERT INTO audit_polls (audit_id, poll_key, election_key, contest_key, pollster_id, in_window, is_final, abs_margin_error, metrics) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)', {
        replacements: [id, item.pollKey, item.electionKey, item.contestKey, item.pollsterId, item.inWindow, item.isFinal, item.absMarginError, metrics],
      });
    }
    const stored = (await rows(`SELECT payload FROM audit_parts WHERE audit_id = ${a.id} AND kind = 'scorecards'`))[0]!.payload as Buffer;
    await q.query(`INSERT INTO audit_parts (audit_id, kind, part_key, chunk, encoding, payload) VALUES (?, 'scorecards', '', 0, 'json', ?)`, {
      replacements: [id, gunzipSync(stored).toString('utf8')],
    });
    expect([...(await pollsOf(id)).values()]).toEqual(items);
    expect((await viewer.get(`/api/v1/audits/${id}/scorecards`).expect(200)).body).toEqual(scorecards);
  });
});

describe('exports', () => {
  it('CSV neutralises cells a spreadsheet would run as formulas', async () => {
    const a = await audit('raw');
    const res = await viewer.get(`/api/v1/audits/${a.id}/polls?format=csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    for (const bad of ["=cmd|' /C calc'!A0", '+SUM(1)', '-2+3 Research', '@Mention Polls']) {
      expect(res.text).toContain(`'${bad.replace(/"/g, '""')}`);
      expect(res.text).not.toMatch(new RegExp(`(^|,)"?${bad.replace(/[|()+*$^.?[\]\\]/g, '\\$&')}`, 'm'));
    }
    // Negative numbers stay numbers.
    expect(res.text).toMatch(/,-1(\.0+)?,/);
  });

  it('viewers read audits, polls, scorecards and shared error; signed-out callers do not', async () => {
    const a = await audit('raw');
    for (const path of [`/api/v1/audits/${a.id}`, `/api/v1/audits/${a.id}/polls`, `/api/v1/audits/${a.id}/scorecards`, `/api/v1/audits/${a.id}/shared-error?election=${E}`, `/api/v1/audits/${a.id}/breakdowns`, `/api/v1/audits/${a.id}/history`, '/api/v1/audits']) {
      await viewer.get(path).expect(200);
      await request(t.app).get(path).expect(401);
    }
    const missing = await viewer.get(`/api/v1/audits/${a.id}/shared-error`).expect(400);
    expect(missing.body.error.details[0].field).toBe('election');
  });
});
