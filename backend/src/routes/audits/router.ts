import { Router, type Request } from 'express';
import { QueryTypes } from 'sequelize';
import { auditCreateSchema, PARTISAN_SPONSOR_TYPES, type AuditDto, type AuditPollDto, type AuditSettings } from '@veracast/shared-types';
import { currentUser, requireRole } from '../../http/auth';
import { notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { sendCsv, sendList, wantsCsv } from '../../http/csv';
import { idParam } from '../../http/params';
import { createAudit, loadAuditPolls } from '../../commands/audits/create-audit';
import { hashSchemeOf, loadAuditInputs } from '../../commands/audits/inputs';
import { loadStoredScorecards, loadStoredSharedErrors } from '../../commands/audits/parts';
import { scorecardsFor, seedOf, usedPolls } from '../../commands/audits/compute';
import { ensureAnalyses } from '../../commands/audits/analyses';
import { mergeUsed } from '../../commands/audits/slice';
import { auditBreakdowns, auditHistory } from '../../commands/audits/breakdowns';
import { loadContests, loadElections, orientationOf } from '../../queries/archive';
import { auditPollsQuerySchema, scorecardQuerySchema, sharedErrorQuerySchema } from './schema';
import type { AppContext } from '../../http/context';

interface AuditRow {
  id: number; name: string; settings: string; data_hash: string; hash_scheme: number; core_version: string; poll_count: number; summary: string;
  rerun_of_id: number | null; created_at: Date; created_by: string | null;
}

/** The audit row without its large stored results (those are read apart: see commands/audits/parts). */
const AUDIT_SELECT = 'SELECT a.id, a.name, a.settings, a.data_hash, a.hash_scheme, a.core_version, a.poll_count, a.summary, a.rerun_of_id, a.created_at, u.email AS created_by FROM audits a LEFT JOIN users u ON u.id = a.created_by_id';

export const AUDIT_POLL_COLUMNS = [
  'pollKey', 'contestKey', 'electionKey', 'pollster', 'fieldworkEnd', 'sampleSize', 'population', 'mode', 'refA', 'refB', 'marginError', 'absMarginError', 'lean',
  'mosteller3', 'mosteller5', 'mtkA', 'mtkSe', 'mtkP', 'aeB', 'aeBw', 'winnerCalled', 'shareCovered', 'marginCovered', 'daysOut', 'undecidedShare', 'inWindow', 'isFinal', 'error',
] as const;

export function auditsRouter(ctx: AppContext) {
  const router = Router();
  const s = ctx.sequelize;

  /**
   * The audit is answered as soon as it is committed; its analyses are stored right after (readers
   * wait for them). A failure there is logged; a reader then computes them from the stored rows.
   */
  function logAnalyses(created: Awaited<ReturnType<typeof createAudit>>) {
    void created.analyses.then((outcome) => {
      if (!outcome.ok) ctx.logger.error({ err: outcome.error, auditId: created.id }, 'storing the analyses of an audit failed');
    });
  }

  async function findAudit(req: Request): Promise<AuditRow> {
    const rows = await s.query<AuditRow>(
      `${AUDIT_SELECT} WHERE a.id = :id`,
      { replacements: { id: idParam(req.params.id) }, type: QueryTypes.SELECT },
    );
    if (!rows[0]) throw notFound('Audit');
    return rows[0];
  }

  async function present(row: AuditRow, checkCurrent: boolean): Promise<AuditDto> {
    const settings = JSON.parse(row.settings) as AuditSettings;
    // Checking currency reads every input row anyway: take the elections and contests from that read.
    const current = checkCurrent ? await loadAuditInputs(s, settings.electionKeys, hashSchemeOf(row.hash_scheme)) : null;
    const elections = current?.elections ?? (await loadElections(s, { keys: settings.electionKeys }));
    const contests = current?.contests ?? (await loadContests(s, { electionIds: elections.map((e) => e.id) }));
    const currentHash = current?.dataHash ?? null;
    return {
      id: row.id, name: row.name, settings, dataHash: row.data_hash, coreVersion: row.core_version, pollCount: row.poll_count,
      createdAt: new Date(row.created_at).toISOString(), createdBy: row.created_by, rerunOf: row.rerun_of_id,
      outOfDate: currentHash !== null && currentHash !== row.data_hash, currentHash,
      elections: elections.map((e) => { const o = orientationOf(e, contests); return { key: e.key, name: e.name, date: e.date, blocA: o.blocA, blocB: o.blocB, fictional: e.fictional }; }),
      headline: (JSON.parse(row.summary) as { headline: AuditDto['headline'] }).headline,
      fictional: elections.some((e) => e.fictional),
    };
  }

  router.post('/', requireRole('analyst'), async (req, res) => {
    const body = parse(auditCreateSchema, req.body);
    const { name, ...settings } = body;
    const created = await createAudit(s, name, { name, ...settings }, currentUser(req).id);
    logAnalyses(created);
    res.status(201).json(await present(await findAuditById(created.id), false));
  });

  async function findAuditById(id: number) {
    const rows = await s.query<AuditRow>(`${AUDIT_SELECT} WHERE a.id = :id`, { replacements: { id }, type: QueryTypes.SELECT });
    return rows[0]!;
  }

  router.get('/', requireRole('viewer'), async (req, res) => {
    const rows = await s.query<AuditRow>('SELECT a.id, a.name, a.settings, a.data_hash, a.hash_scheme, a.core_version, a.poll_count, a.summary, a.rerun_of_id, a.created_at, u.email AS created_by FROM audits a LEFT JOIN users u ON u.id = a.created_by_id ORDER BY a.id DESC LIMIT 500', { type: QueryTypes.SELECT });
    const items = rows.map((r) => ({
      id: r.id, name: r.name, settings: JSON.parse(r.settings) as AuditSettings, dataHash: r.data_hash, coreVersion: r.core_version, pollCount: r.poll_count,
      createdAt: new Date(r.created_at).toISOString(), createdBy: r.created_by, rerunOf: r.rerun_of_id,
    }));
    // In CSV the settings object becomes its JSON text (neutraliseCell does that for objects).
    sendList(req, res, items, { filename: 'audits' });
  });

  router.get('/:id', requireRole('viewer'), async (req, res) => {
    res.json(await present(await findAudit(req), true));
  });

  router.post('/:id/rerun', requireRole('analyst'), async (req, res) => {
    const row = await findAudit(req);
    const settings = JSON.parse(row.settings) as AuditSettings;
    const name = /\(re-run/.test(row.name) ? row.name : `${row.name} (re-run)`;
    const created = await createAudit(s, name, settings, currentUser(req).id, row.id);
    logAnalyses(created);
    res.status(201).json(await present(await findAuditById(created.id), false));
  });

  router.get('/:id/polls', requireRole('viewer'), async (req, res) => {
    const q = parse(auditPollsQuerySchema, req.query, 'query');
    const row = await findAudit(req);
    const settings = JSON.parse(row.settings) as AuditSettings;
    let items = await loadAuditPolls(s, row.id, q.election);
    if (q.pollster) items = items.filter((i) => i.pollsterId === q.pollster);
    if (q.inWindow !== undefined) items = items.filter((i) => i.inWindow === q.inWindow);
    if (q.isFinal !== undefined) items = items.filter((i) => i.isFinal === q.isFinal);
    if (q.used) items = usedPolls(items, settings);
    sendList(req, res, items, { filename: `audit-${row.id}-polls`, columns: AUDIT_POLL_COLUMNS });
  });

  router.get('/:id/scorecards', requireRole('viewer'), async (req, res) => {
    const q = parse(scorecardQuerySchema, req.query, 'query');
    const row = await findAudit(req);
    const settings = JSON.parse(row.settings) as AuditSettings;
    const filtered = q.elections || q.kind || q.modes || q.populations || q.sponsorTypes || q.minPolls;
    let result: ReturnType<typeof scorecardsFor>;
    if (!filtered) await ensureAnalyses(s, row.id);
    const stored = filtered ? null : await loadStoredScorecards(s, row.id);
    if (stored) result = JSON.parse(stored) as ReturnType<typeof scorecardsFor>;
    else {
      let items: AuditPollDto[] = await loadAuditPolls(s, row.id);
      if (q.elections) items = items.filter((i) => q.elections!.includes(i.electionKey));
      if (q.kind) {
        const kinds = new Map((await s.query<{ key: string; kind: string }>('SELECT `key`, kind FROM contests', { type: QueryTypes.SELECT })).map((c) => [c.key, c.kind]));
        items = items.filter((i) => kinds.get(i.contestKey) === q.kind);
      }
      if (q.modes) items = items.filter((i) => q.modes!.includes(i.mode));
      if (q.populations) items = items.filter((i) => q.populations!.includes(i.population));
      if (q.sponsorTypes) items = items.filter((i) => q.sponsorTypes!.includes(i.sponsorType ?? 'none'));
      // In the audit's poll order, as the stored scorecards were made (the bootstrap draws depend on it).
      result = scorecardsFor(mergeUsed([{ used: items }]), { ...settings, minPolls: q.minPolls ?? settings.minPolls }, seedOf(row.data_hash));
    }
    if (wantsCsv(req)) {
      const rows = result.items.map((i) => ({ ...i, excessErrorInterval: i.excessErrorInterval?.join(' to '), rankInterval: i.rankInterval?.join(' to ') }));
      return sendCsv(res, rows, `audit-${row.id}-scorecards`);
    }
    res.json({ ...result, total: result.items.length, filtered: Boolean(filtered) });
  });

  router.get('/:id/shared-error', requireRole('viewer'), async (req, res) => {
    const q = parse(sharedErrorQuerySchema, req.query, 'query');
    const row = await findAudit(req);
    await ensureAnalyses(s, row.id);
    const stored = await loadStoredSharedErrors<{ contestsDetail: object[]; pairs: object[] }>(s, row.id, [q.election]);
    const analysis = stored[q.election];
    if (!analysis) throw notFound(`Election ${q.election} in this audit`);
    if (wantsCsv(req)) return sendCsv(res, q.part === 'pairs' ? analysis.pairs : analysis.contestsDetail, `audit-${row.id}-${q.election}-${q.part ?? 'contests'}`);
    res.json(analysis);
  });

  router.get('/:id/breakdowns', requireRole('viewer'), async (req, res) => {
    const row = await findAudit(req);
    const settings = JSON.parse(row.settings) as AuditSettings;
    res.json(auditBreakdowns(await loadAuditPolls(s, row.id), settings, [...PARTISAN_SPONSOR_TYPES]));
  });

  router.get('/:id/history', requireRole('viewer'), async (req, res) => {
    const row = await findAudit(req);
    const settings = JSON.parse(row.settings) as AuditSettings;
    const elections = await loadElections(s, { keys: settings.electionKeys });
    res.json(auditHistory(await loadAuditPolls(s, row.id), settings, elections));
  });

  return router;
}
