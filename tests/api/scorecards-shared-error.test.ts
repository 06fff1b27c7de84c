import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type SignedInAgent, type TestApp } from '../helpers/test-app';
import { buildPoll, buildResultRow, pollsCsv, resultsCsv } from '../helpers/factories';

let t: TestApp;
let analyst: SignedInAgent;
let viewer: SignedInAgent;
let auditId: number;

/**
 * Six contests certified at RED 50 / BLUE 50. Four firms poll every contest once; every firm
 * understates RED by a shared 3 margin points, plus its own house effect: Alpha (phone) +2,
 * Beta (phone) 0, Gamma (online) −2, Delta (online) 0, plus a small contest-specific wobble.
 * A fifth firm, Epsilon, polls two contests only.
 */
const contests = ['c1', 'c2', 'c3', 'c4', 'c5', 'c6'];
const wobble = [0.4, -0.2, 0.6, -0.6, 0.2, -0.4];
const firms = [
  { name: 'Alpha', mode: 'phone', house: 2 },
  { name: 'Beta', mode: 'phone', house: 0 },
  { name: 'Gamma', mode: 'online', house: -2 },
  { name: 'Delta', mode: 'online', house: 0 },
];
const results = contests.flatMap((c) =>
  ['red', 'blue'].map((o) => buildResultRow({ election_key: 'se-2030', election_date: '2030-05-05', contest_key: c, contest_name: c, option_key: o, option_name: o, bloc: o.toUpperCase(), votes: 50000 })),
);
// margin error e = (pRed − pBlue) − 0 with pRed + pBlue = 100: pRed = 50 + e/2.
const pollRows = [
  ...firms.flatMap((f, fi) =>
    contests.map((c, ci) => {
      const e = -3 + f.house + wobble[(ci + fi) % 6]!;
      return buildPoll({ poll_key: `${f.name}-${c}`.toLowerCase(), pollster: f.name, mode: f.mode, contest_key: c, sample_size: 1000 }, { red: 50 + e / 2, blue: 50 - e / 2 });
    }),
  ).flat(),
  ...['c1', 'c2'].flatMap((c) => buildPoll({ poll_key: `eps-${c}`, pollster: 'Epsilon', mode: 'phone', contest_key: c }, { red: 49, blue: 51 })),
];

beforeAll(async () => {
  t = await createTestApp();
  analyst = await t.signIn('reviewer');
  viewer = await t.signIn('viewer');
  await analyst.post('/api/v1/imports/results').attach('file', resultsCsv(results), 'r.csv').expect(201);
  await analyst.post('/api/v1/imports/polls').attach('file', pollsCsv(pollRows), 'p.csv').expect(201);
  // The blocs tie on votes; orient the election RED against BLUE explicitly.
  await analyst.put('/api/v1/elections/se-2030/orientation').send({ blocA: 'RED', blocB: 'BLUE' }).expect(200);
  auditId = (await analyst.post('/api/v1/audits').send({ name: 'se', electionKeys: ['se-2030'], minPolls: 5 }).expect(201)).body.id;
});
afterAll(async () => t.close());

describe('scorecards through the API', () => {
  it('401 signed out; figures match the construction; firms under the minimum are listed, not ranked', async () => {
    await request(t.app).get(`/api/v1/audits/${auditId}/scorecards`).expect(401);
    const res = await viewer.get(`/api/v1/audits/${auditId}/scorecards`).expect(200);
    const by = Object.fromEntries(res.body.items.map((i: { pollster: string }) => [i.pollster, i]));
    // Alpha's errors: −1 + wobble over the six contests; the wobbles sum to 0, so the mean is −1 [hand computation].
    expect(by.Alpha.meanSignedError).toBeCloseTo(-1, 10);
    expect(by.Gamma.meanSignedError).toBeCloseTo(-5, 10);
    expect(by.Alpha.polls).toBe(6);
    expect(by.Epsilon).toMatchObject({ polls: 2, ranked: false, rank: null });
    expect(by.Epsilon.reason).toMatch(/5/);
    expect(res.body.items.filter((i: { ranked: boolean }) => i.ranked)).toHaveLength(4);
    // Alpha misses least on average (|−1 ± wobble|), Gamma most: their contest-adjusted ranks say so.
    expect(by.Alpha.rank).toBeLessThan(by.Gamma.rank);
  });

  it('the same audit gives the same bootstrap numbers every time', async () => {
    const a = (await viewer.get(`/api/v1/audits/${auditId}/scorecards?minPolls=2`).expect(200)).body.items;
    const b = (await viewer.get(`/api/v1/audits/${auditId}/scorecards?minPolls=2`).expect(200)).body.items;
    expect(a.map((i: { rankInterval: unknown }) => i.rankInterval)).toEqual(b.map((i: { rankInterval: unknown }) => i.rankInterval));
  });

  it('a mode filter keeps only that mode\'s polls and changes the numbers', async () => {
    const all = (await viewer.get(`/api/v1/audits/${auditId}/scorecards`).expect(200)).body;
    const phone = (await viewer.get(`/api/v1/audits/${auditId}/scorecards?modes=phone&minPolls=2`).expect(200)).body;
    expect(phone.filtered).toBe(true);
    expect(phone.items.map((i: { pollster: string }) => i.pollster).sort()).toEqual(['Alpha', 'Beta', 'Epsilon']);
    const alphaAll = all.items.find((i: { pollster: string }) => i.pollster === 'Alpha');
    const alphaPhone = phone.items.find((i: { pollster: string }) => i.pollster === 'Alpha');
    expect(alphaPhone.meanSignedError).toBeCloseTo(alphaAll.meanSignedError, 10);
    expect(alphaPhone.excessError).not.toBeCloseTo(alphaAll.excessError, 6);
    const bad = await viewer.get(`/api/v1/audits/${auditId}/scorecards?modes=carrier-pigeon`).expect(400);
    expect(bad.body.error.details[0].field).toBe('modes.0');
  });
});

describe('shared error through the API', () => {
  it('finds the shared miss of about −3 points, clustered by contest', async () => {
    const se = (await viewer.get(`/api/v1/audits/${auditId}/shared-error?election=se-2030`).expect(200)).body;
    expect(se.contests).toBe(6);
    // Mean over all final polls: −3 shared, house effects +2, 0, −2, 0 average to 0, Epsilon −2 on two contests [hand computation]
    const expectedMean = (24 * -3 + 2 * -2) / 26;
    expect(se.meanSignedError).toBeCloseTo(expectedMean, 10);
    expect(se.p).toBeLessThan(0.001);
    expect(se.ciHigh).toBeLessThan(0);
    expect(se.pairs.find((p: { a: string; b: string }) => [p.a, p.b].sort().join() === 'Alpha,Beta').n).toBe(6);
    expect(se.pairs.find((p: { a: string; b: string }) => [p.a, p.b].includes('Epsilon')).insufficient).toBe(true);
    const csv = await viewer.get(`/api/v1/audits/${auditId}/shared-error?election=se-2030&format=csv&part=pairs`).expect(200);
    expect(csv.text.split("\n")[0]).toMatch(/^\uFEFF?a,b,n,.*pearson/);
    await viewer.get(`/api/v1/audits/${auditId}/shared-error?election=unknown`).expect(404);
  });
});
