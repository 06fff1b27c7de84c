/**
 * Audits split over worker threads (commands/audits/workers.ts) store exactly what the main thread
 * alone stores, and a worker that dies makes the audit fail with nothing written.
 */
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { auditCreateSchema, type AuditSettings } from '@veracast/shared-types';
import { createAudit } from '../../backend/src/commands/audits/create-audit';
import { ensureAnalyses } from '../../backend/src/commands/audits/analyses';
import { AuditWorker, configureAuditWorkers, readyAuditWorkers, stopAuditWorkers } from '../../backend/src/commands/audits/workers';
import { loadDemo } from '../../backend/src/commands/load-demo';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let settings: AuditSettings;

beforeAll(async () => {
  t = await createTestApp();
  // The fictional demo: 5 elections, 14 firms, about 1,000 polls.
  expect((await loadDemo(t.ctx.sequelize, null)).loaded).toBe(true);
  const keys = (await t.ctx.sequelize.query<{ key: string }>('SELECT `key` FROM elections ORDER BY `key`', { type: QueryTypes.SELECT })).map((r) => r.key);
  expect(keys.length).toBeGreaterThanOrEqual(4);
  settings = auditCreateSchema.parse({ name: 'threads', electionKeys: keys });
});
afterAll(async () => {
  await stopAuditWorkers();
  configureAuditWorkers(null);
  await t.close();
});

/** Everything an audit stored, decompressed, in key order. */
async function stored(id: number) {
  const q = t.ctx.sequelize;
  const [audit] = await q.query<{ data_hash: string; summary: string; poll_count: number }>('SELECT data_hash, summary, poll_count FROM audits WHERE id = ?', { replacements: [id], type: QueryTypes.SELECT });
  const parts = await q.query<{ kind: string; part_key: string; chunk: number; encoding: string; payload: Buffer }>(
    'SELECT kind, part_key, chunk, encoding, payload FROM audit_parts WHERE audit_id = ? ORDER BY kind, part_key, chunk',
    { replacements: [id], type: QueryTypes.SELECT },
  );
  return { audit, parts: parts.map((p) => ({ kind: p.kind, partKey: p.part_key, chunk: p.chunk, encoding: p.encoding, payload: gunzipSync(p.payload).toString('base64') })) };
}

describe('audits over worker threads', () => {
  it('store the same rows, headline, scorecards and analyses as the main thread alone, with 1 and 2 workers', async () => {
    const alone = await createAudit(t.ctx.sequelize, 'main thread', settings, null, null, { parallel: false });
    expect(alone.threads).toBe(1);
    expect(await alone.analyses).toEqual({ ok: true });
    const expected = await stored(alone.id);
    expect(expected.audit!.poll_count).toBeGreaterThan(900);
    expect(expected.parts.filter((p) => p.kind === 'polls').length).toBe(settings.electionKeys.length);
    expect(expected.parts.filter((p) => p.kind === 'shared_error').length).toBe(settings.electionKeys.length);
    for (const workers of [1, 2]) {
      configureAuditWorkers(workers);
      const split = await createAudit(t.ctx.sequelize, `${workers} workers`, settings, null, null, { parallel: true });
      expect(split.threads).toBe(1 + workers);
      expect(await split.analyses).toEqual({ ok: true });
      expect(await stored(split.id)).toEqual(expected);
    }
  });

  it('readers wait for the analyses that follow an audit, and recompute the same ones when they are missing', async () => {
    const created = await createAudit(t.ctx.sequelize, 'analyses', settings, null, null, { parallel: false });
    // Right after the audit is committed, a reader waits for the analyses being stored.
    await ensureAnalyses(t.ctx.sequelize, created.id);
    const expected = await stored(created.id);
    expect(expected.parts.map((p) => p.kind)).toContain('scorecards');
    // Lost (the process stopped before storing them): computed again from the stored poll rows, the same.
    await t.ctx.sequelize.query("DELETE FROM audit_parts WHERE audit_id = ? AND kind <> 'polls'", { replacements: [created.id] });
    expect((await stored(created.id)).parts.some((p) => p.kind === 'scorecards')).toBe(false);
    await Promise.all([ensureAnalyses(t.ctx.sequelize, created.id), ensureAnalyses(t.ctx.sequelize, created.id)]);
    expect(await stored(created.id)).toEqual(expected);
  });

  it('a worker that has stopped makes the audit fail and leaves nothing written', async () => {
    const [count] = await t.ctx.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM audits', { type: QueryTypes.SELECT });
    const worker = new AuditWorker();
    await worker.ready;
    await worker.terminate();
    await expect(createAudit(t.ctx.sequelize, 'dead worker', settings, null, null, { parallel: true, workers: [worker] })).rejects.toThrow(/audit worker stopped/);
    const [after] = await t.ctx.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM audits', { type: QueryTypes.SELECT });
    expect(Number(after!.n)).toBe(Number(count!.n));
  });

  it('with no worker configured, a large audit runs on the main thread', async () => {
    configureAuditWorkers(0);
    expect(await readyAuditWorkers()).toEqual([]);
    const audit = await createAudit(t.ctx.sequelize, 'no workers', settings, null, null, { parallel: true });
    expect(audit.threads).toBe(1);
    expect(await audit.analyses).toEqual({ ok: true });
  });
});
