import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type SignedInAgent, type TestApp } from '../helpers/test-app';
import { buildPoll, pollsCsv, resultsCsv } from '../helpers/factories';

let t: TestApp;
let reviewer: SignedInAgent;
let analyst: SignedInAgent;
let viewer: SignedInAgent;

beforeAll(async () => {
  t = await createTestApp();
  reviewer = await t.signIn('reviewer');
  analyst = await t.signIn('analyst');
  viewer = await t.signIn('viewer');
  await reviewer.post('/api/v1/imports/results').attach('file', resultsCsv(), 'r.csv').expect(201);
  const polls = [
    ...buildPoll({ poll_key: 'dup-a' }),
    ...buildPoll({ poll_key: 'dup-b', fieldwork_start: '2030-04-22', fieldwork_end: '2030-04-25' }),
    ...buildPoll({ poll_key: 'low-sum', pollster: 'Beta Polling' }, { red: 40, blue: 40 }),
  ];
  await analyst.post('/api/v1/imports/polls').attach('file', pollsCsv(polls), 'p.csv').expect(201);
});
afterAll(async () => t.close());

const readRoutes = ['/api/v1/elections', '/api/v1/elections/tst-2030-general', '/api/v1/contests/tst-2030-national', '/api/v1/contests/tst-2030-national/polls', '/api/v1/polls', '/api/v1/polls/dup-a', '/api/v1/pollsters', '/api/v1/quality'];

describe('reading the archive', () => {
  it.each(readRoutes)('%s: 401 signed out, 200 for a viewer', async (path) => {
    await request(t.app).get(path).expect(401);
    await viewer.get(path).expect(200);
  });

  it('an election lists its contests with certification, turnout base, poll counts and orientation', async () => {
    const e = (await viewer.get('/api/v1/elections/tst-2030-general').expect(200)).body;
    expect(e).toMatchObject({ contestCount: 2, certifiedCount: 2, pollCount: 3, blocA: 'RED', blocB: 'BLUE', orientationSource: 'default' });
    const national = e.contests.find((c: { key: string }) => c.key === 'tst-2030-national');
    expect(national.validVotes).toBe(1_000_000);
    expect(national.options.find((o: { key: string }) => o.key === 'red').share).toBeCloseTo(48, 10);
  });

  it('the quality checks flag the possible duplicate and the shares far from 100', async () => {
    const q = (await viewer.get('/api/v1/quality?election=tst-2030-general').expect(200)).body.items as { code: string; pollKeys: string[] }[];
    expect(q.find((i) => i.code === 'possible_duplicate')?.pollKeys.sort()).toEqual(['dup-a', 'dup-b']);
    expect(q.find((i) => i.code === 'shares_off_100')?.pollKeys).toEqual(['low-sum']);
  });

  it("a contest's polls carry their metrics; a poll's page carries all three treatments", async () => {
    const polls = (await viewer.get('/api/v1/contests/tst-2030-national/polls').expect(200)).body.items;
    const a = polls.find((p: { key: string }) => p.key === 'dup-a');
    // poll 46/44 against 48/45: (46 − 44) − (48 − 45) = −1 [hand computation]
    expect(a.metrics.marginError).toBeCloseTo(-1, 10);
    const one = (await viewer.get('/api/v1/polls/dup-a').expect(200)).body;
    expect(Object.keys(one.metrics).sort()).toEqual(['proportional', 'raw', 'two_party']);
    // proportional: (46 − 44)/0.96 − 3 = −0.916667 [hand computation]
    expect(one.metrics.proportional.marginError).toBeCloseTo(2 / 0.96 - 3, 10);
    expect(one.disclosure.items.sponsor).toBe(true);
    expect(one.disclosure.completeness).toBeCloseTo(0.7, 10);
    await viewer.get('/api/v1/polls/none-such').expect(404);
  });
});

describe('editing', () => {
  it('creates an election and a contest; viewers are refused; fields are validated', async () => {
    await viewer.post('/api/v1/elections').send({ key: 'new-2031', name: 'New', date: '2031-01-01', jurisdiction: 'X' }).expect(403);
    const bad = await analyst.post('/api/v1/elections').send({ key: 'Bad Key', name: '', date: '2031-02-30', jurisdiction: 'X' }).expect(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field).sort()).toEqual(['date', 'key', 'name']);
    await analyst.post('/api/v1/elections').send({ key: 'new-2031', name: 'New', date: '2031-01-01', jurisdiction: 'X' }).expect(201);
    await analyst.post('/api/v1/elections').send({ key: 'new-2031', name: 'New', date: '2031-01-01', jurisdiction: 'X' }).expect(409);
    const contest = { key: 'new-2031-q', electionKey: 'new-2031', name: 'Question', kind: 'referendum', options: [{ key: 'yes', name: 'Yes', bloc: 'YES' }, { key: 'no', name: 'No', bloc: 'NO' }] };
    await analyst.post('/api/v1/contests').send({ ...contest, options: [contest.options[0]] }).expect(400);
    await analyst.post('/api/v1/contests').send(contest).expect(201);
  });

  it('an analyst enters a provisional result but cannot certify; a reviewer certifies with a source; changing it needs a reason; the history keeps before and after', async () => {
    await analyst.put('/api/v1/contests/new-2031-q/result').send({ status: 'provisional', votes: { yes: 600, no: 400 } }).expect(200);
    const refused = await analyst.put('/api/v1/contests/new-2031-q/result').send({ status: 'certified', certifiedOn: '2031-01-10', sourceUrl: 'https://example.org/r', votes: { yes: 600, no: 400 } }).expect(403);
    expect(refused.body.error.message).toMatch(/reviewer/);
    const noSource = await reviewer.put('/api/v1/contests/new-2031-q/result').send({ status: 'certified', certifiedOn: '2031-01-10', votes: { yes: 600, no: 400 } }).expect(400);
    expect(noSource.body.error.details[0]).toEqual({ field: 'sourceUrl', message: 'a certified result needs a source' });
    await reviewer.put('/api/v1/contests/new-2031-q/result').send({ status: 'certified', certifiedOn: '2031-01-10', sourceUrl: 'https://example.org/r', votes: { yes: 600, no: 400 } }).expect(200);
    const noReason = await reviewer.put('/api/v1/contests/new-2031-q/result').send({ status: 'certified', certifiedOn: '2031-01-10', sourceUrl: 'https://example.org/r', votes: { yes: 601, no: 400 } }).expect(400);
    expect(noReason.body.error.details[0].field).toBe('reason');
    await analyst.put('/api/v1/contests/new-2031-q/result').send({ status: 'certified', certifiedOn: '2031-01-10', sourceUrl: 'https://example.org/r', votes: { yes: 601, no: 400 }, reason: 'typo' }).expect(403);
    await reviewer.put('/api/v1/contests/new-2031-q/result').send({ status: 'certified', certifiedOn: '2031-01-10', sourceUrl: 'https://example.org/r', votes: { yes: 601, no: 400 }, reason: 'Typo in the count sheet' }).expect(200);
    const c = (await viewer.get('/api/v1/contests/new-2031-q').expect(200)).body;
    expect(c.history.map((h: { action: string }) => h.action)).toEqual(['change_certified', 'certify', 'edit_provisional']);
    expect(c.history[0]).toMatchObject({ reason: 'Typo in the count sheet', before: { votes: { yes: 600 } }, after: { votes: { yes: 601 } } });
    await reviewer.put('/api/v1/contests/new-2031-q/result').send({ status: 'provisional', votes: { maybe: 3 }, reason: 'x' }).expect(400);
  });

  it('only a reviewer sets the orientation blocs, and only to blocs that stand', async () => {
    await analyst.put('/api/v1/elections/tst-2030-general/orientation').send({ blocA: 'BLUE', blocB: 'RED' }).expect(403);
    const bad = await reviewer.put('/api/v1/elections/tst-2030-general/orientation').send({ blocA: 'BLUE', blocB: 'PURPLE' }).expect(400);
    expect(bad.body.error.details[0].field).toBe('blocB');
    const ok = await reviewer.put('/api/v1/elections/tst-2030-general/orientation').send({ blocA: 'BLUE', blocB: 'RED' }).expect(200);
    expect(ok.body).toMatchObject({ blocA: 'BLUE', blocB: 'RED', orientationSource: 'set' });
  });

  it('creates a pollster with aliases, refuses an alias that belongs to another firm, and a poll by form', async () => {
    const firm = (await analyst.post('/api/v1/pollsters').send({ name: 'Gamma Surveys', aliases: ['Gamma Surveys Ltd', 'GS'] }).expect(201)).body;
    expect(firm.aliases).toEqual(['GS', 'Gamma Surveys Ltd']);
    const other = (await analyst.post('/api/v1/pollsters').send({ name: 'Delta' }).expect(201)).body;
    const clash = await analyst.patch(`/api/v1/pollsters/${other.id}`).send({ aliases: ['gs'] }).expect(409);
    expect(clash.body.error.code).toBe('alias_taken');
    const poll = { key: 'form-1', pollsterId: firm.id, contestKey: 'tst-2030-north', fieldworkStart: '2030-04-01', fieldworkEnd: '2030-04-03', publishedOn: '2030-04-04', sampleSize: 800, population: 'lv', mode: 'phone', shares: { red: 41, blue: 50, undecided: 9 } };
    const late = await analyst.post('/api/v1/polls').send({ ...poll, fieldworkEnd: '2030-05-06', publishedOn: '2030-05-07' }).expect(400);
    expect(late.body.error.details.map((d: { field: string }) => d.field)).toContain('fieldworkEnd');
    const sum = await analyst.post('/api/v1/polls').send({ ...poll, shares: { red: 60, blue: 50 } }).expect(400);
    expect(sum.body.error.message).toMatch(/past 100.5/);
    await viewer.post('/api/v1/polls').send(poll).expect(403);
    const created = (await analyst.post('/api/v1/polls').send(poll).expect(201)).body;
    expect(created.pollster).toBe('Gamma Surveys');
    const edited = (await analyst.put('/api/v1/polls/form-1').send({ ...poll, sampleSize: 900 }).expect(200)).body;
    expect(edited.sampleSize).toBe(900);
  });
});
