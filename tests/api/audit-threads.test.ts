/**
 * Audits split over worker threads (commands/audits/workers.ts) store exactly what the main thread
 * alone stores, read one committed state across their connections, and a worker that dies makes
 * the audit fail with nothing written.
 */
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { QueryTypes } from 'sequelize';
import { auditCreateSchema, type AuditSettings } from '@veracast/shared-types';
import { createAudit } from '../../backend/src/commands/audits/create-audit';
import { ensureAnalyses } from '../../backend/src/commands/audits/analyses';
import { loadAuditInputs } from '../../backend/src/commands/audits/inputs';
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
    // The hash the threads made apart is the one the out-of-date check makes from the whole.
    expect(expected.audit!.data_hash).toBe((await loadAuditInputs(t.ctx.sequelize, settings.electionKeys)).dataHash);
  });

  it('read one committed state: a write under way when the audit starts is waited for, then read by every thread', async () => {
    configureAuditWorkers(1);
    const q = t.ctx.sequelize;
    const before = await createAudit(q, 'before the write', settings, null, null, { parallel: true });
    expect(before.threads).toBe(2);
    await before.analyses;
    // A writer adds a poll (in the last election by key) and has not committed when the audit starts.
    const writer = await q.transaction();
    await q.query(
      `INSERT INTO polls (\`key\`, pollster_id, contest_id, fieldwork_start, fieldwork_end, published_on, sample_size, population, mode)
       SELECT CONCAT(p.\`key\`, '-late'), p.pollster_id, p.contest_id, p.fieldwork_start, p.fieldwork_end, p.published_on, p.sample_size, p.population, p.mode
       FROM polls p JOIN contests k ON k.id = p.contest_id JOIN elections e ON e.id = k.election_id WHERE e.\`key\` = ? ORDER BY p.id LIMIT 1`,
      { replacements: [settings.electionKeys.at(-1)], transaction: writer },
    );
    let settled = false;
    const during = createAudit(q, 'during the write', settings, null, null, { parallel: true }).finally(() => (settled = true));
    await new Promise((resolve) => setTimeout(resolve, 400));
    // The audit waits for the writer instead of reading around it.
    expect(settled).toBe(false);
    await writer.commit();
    const audit = await during;
    expect(audit.threads).toBe(2);
    expect(audit.pollCount).toBe(before.pollCount + 1);
    expect(audit.dataHash).toBe((await loadAuditInputs(q, settings.electionKeys)).dataHash);
    expect(audit.dataHash).not.toBe(before.dataHash);
    await audit.analyses;
    await q.query("DELETE FROM polls WHERE `key` LIKE '%-late'");
  });

  it('give up with 409 archive_busy, nothing written, when a write stays open longer than the wait', async () => {
    configureAuditWorkers(1);
    const q = t.ctx.sequelize;
    const [count] = await q.query<{ n: number }>('SELECT COUNT(*) AS n FROM audits', { type: QueryTypes.SELECT });
    const writer = await q.transaction();
    try {
      await q.query("UPDATE elections SET name = CONCAT(name, ' (editing)') WHERE `key` = ?", { replacements: [settings.electionKeys[0]], transaction: writer });
      const started = Date.now();
      await expect(createAudit(q, 'blocked', settings, null, null, { parallel: true, lockWaitSeconds: 1 })).rejects.toMatchObject({ status: 409, code: 'archive_busy' });
      expect(Date.now() - started).toBeGreaterThanOrEqual(900);
    } finally {
      await writer.rollback();
    }
    const [after] = await q.query<{ n: number }>('SELECT COUNT(*) AS n FROM audits', { type: QueryTypes.SELECT });
    expect(Number(after!.n)).toBe(Number(count!.n));
    // Once the write is over, the same audit goes through with its worker.
    const audit = await createAudit(q, 'unblocked', settings, null, null, { parallel: true, lockWaitSeconds: 1 });
    expect(audit.threads).toBe(2);
    await audit.analyses;
  });

  it('leave a worker busy with another audit alone: the second audit runs without it, the same', async () => {
    configureAuditWorkers(1);
    const q = t.ctx.sequelize;
    const [worker] = await readyAuditWorkers();
    const first = createAudit(q, 'first', settings, null, null, { parallel: true });
    // The first audit holds the worker from its start until its analyses are stored.
    await vi.waitFor(() => expect(worker!.idle).toBe(false));
    const second = createAudit(q, 'second', settings, null, null, { parallel: true });
    const [a, b] = await Promise.all([first, second]);
    expect([a.threads, b.threads]).toEqual([2, 1]);
    await Promise.all([a.analyses, b.analyses]);
    expect((await stored(b.id)).parts).toEqual((await stored(a.id)).parts);
    expect(a.dataHash).toBe(b.dataHash);
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
