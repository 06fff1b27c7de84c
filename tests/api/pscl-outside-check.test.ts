/**
 * Outside check on real published data: the 2007 Australian federal election polls from Debian's
 * r-cran-pscl 1.5.5 (datasets AustralianElectionPolling and AustralianElections, GPL-2), extracted
 * by reference-data/pscl/extract.R into Veracast's CSV layouts. reference-data/pscl/check.R computes
 * every poll's signed errors with R alone (no Veracast code); this test imports the same files
 * through the real import path, runs an audit (window 14 days, every poll, raw shares) and checks
 * every figure against R's output.
 */
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type SignedInAgent, type TestApp } from '../helpers/test-app';
import { ROOT } from '../helpers/env';

const dir = path.join(ROOT, 'reference-data/pscl');
interface Expected {
  n_polls: number;
  mean_alp_share_error: number;
  mean_margin_error: number;
  mean_abs_margin_error: number;
  polls: Record<string, { alp_share_error: number; margin_error: number; abs_margin_error: number }>;
}
const expected = JSON.parse(fs.readFileSync(path.join(dir, 'expected.json'), 'utf8')) as Expected;

let t: TestApp;
let reviewer: SignedInAgent;
let auditId: number;
beforeAll(async () => {
  t = await createTestApp();
  reviewer = await t.signIn('reviewer');
});
afterAll(async () => t.close());

describe('pscl 2007 Australian polls: Veracast against R', () => {
  it('imports the extracted results and polls through the real import path', async () => {
    const r = await reviewer.post('/api/v1/imports/results').attach('file', path.join(dir, 'results.csv')).expect(201);
    expect(r.body.created).toBe(6);
    const p = await reviewer.post('/api/v1/imports/polls').attach('file', path.join(dir, 'polls.csv')).expect(201);
    expect(p.body.errors).toEqual([]);
    expect(p.body.created).toBe(239);
  });

  it('audits the final 14 days and matches every poll R computed', async () => {
    const audit = await reviewer
      .post('/api/v1/audits')
      .send({ name: 'pscl 2007 outside check', electionKeys: ['au-2007-federal'], windowDays: 14, finalOnly: false, undecided: 'raw', minPolls: 1 })
      .expect(201);
    auditId = audit.body.id;
    const res = await reviewer.get(`/api/v1/audits/${auditId}/polls?inWindow=true`).expect(200);
    const items = res.body.items as { pollKey: string; refA: string; marginError: number; absMarginError: number; pollA: number; resultA: number }[];
    expect(items.map((i) => i.pollKey).sort()).toEqual(Object.keys(expected.polls).sort());
    expect(items).toHaveLength(expected.n_polls);
    for (const i of items) {
      const e = expected.polls[i.pollKey]!;
      expect(i.refA).toBe('alp');
      // [computed] R 4.2.2, reference-data/pscl/check.R; tolerance 1e-9 (R writes 12 significant digits)
      expect(Math.abs(i.marginError - e.margin_error), i.pollKey).toBeLessThan(1e-9);
      expect(Math.abs(i.absMarginError - e.abs_margin_error), i.pollKey).toBeLessThan(1e-9);
      expect(Math.abs(i.pollA - i.resultA - e.alp_share_error), i.pollKey).toBeLessThan(1e-9);
    }
    const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
    expect(Math.abs(mean(items.map((i) => i.marginError)) - expected.mean_margin_error)).toBeLessThan(1e-9);
    expect(Math.abs(mean(items.map((i) => i.pollA - i.resultA)) - expected.mean_alp_share_error)).toBeLessThan(1e-9);
  });

  it("the audit's headline mean absolute margin error over all window polls equals R's", async () => {
    const audit = await reviewer.get(`/api/v1/audits/${auditId}`).expect(200);
    expect(audit.body.headline.pollsUsed).toBe(expected.n_polls);
    expect(Math.abs(audit.body.headline.meanAbsMarginError - expected.mean_abs_margin_error)).toBeLessThan(1e-9);
  });
});
