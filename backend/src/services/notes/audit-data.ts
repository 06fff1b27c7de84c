import { QueryTypes, type Sequelize } from 'sequelize';
import type { AuditHeadline, AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { loadAuditPolls } from '../../commands/audits/create-audit';
import { hashSchemeOf, loadAuditInputs } from '../../commands/audits/inputs';
import { loadStoredScorecards, loadStoredSharedErrors } from '../../commands/audits/parts';
import { ensureAnalyses } from '../../commands/audits/analyses';
import { loadElections } from '../../queries/archive';

/** The scorecard fields a block shows (a subset of the stored scorecard item). */
export interface StoredScorecard {
  pollster: string; polls: number; contests: number; meanAbsMarginError: number; meanSignedError: number;
  meanSignedErrorInterval: [number, number] | null; rmse: number; winnerCalledRate: number | null; coverageRate: number | null;
  excessError: number | null; excessErrorShrunk: number | null; excessErrorShrunkInterval: [number, number] | null;
  excessErrorInterval: [number, number] | null; rank: number | null; rankInterval: [number, number] | null; ranked: boolean; reason: string | null;
}

/** The shared-error fields a block shows (a subset of the stored analysis of one election). */
export interface StoredSharedError {
  electionKey: string; polls: number; contests: number; firms?: number; meanSignedError: number | null; clusteredSe: number | null;
  df: number | null; t: number | null; p: number | null; ciLow: number | null; ciHigh: number | null; icc: number | null;
  shapiroW: number | null; shapiroP: number | null;
  contestsDetail: { contestKey: string; k: number; meanError: number; naiveSe: number | null; adjustedSe: number | null; nEff: number | null }[];
  warnings?: string[];
}

/**
 * Everything a note's blocks may show of one audit, read from what the audit stored when it was
 * computed. Nothing here is recomputed from the archive, so a cited figure never moves.
 */
export interface AuditSnapshot {
  id: number;
  name: string;
  settings: AuditSettings;
  dataHash: string;
  coreVersion: string;
  createdAt: string;
  headline: AuditHeadline;
  scorecards: { items: StoredScorecard[]; field: Record<string, unknown> | null } | null;
  sharedError: Record<string, StoredSharedError | undefined>;
  elections: { key: string; name: string; date: string; fictional: boolean }[];
  /** The audit's per-poll rows (stored JSON); loaded only for views that need them. */
  polls: AuditPollDto[] | null;
  /** The hash of the archive as it is now; null when not checked. */
  currentHash: string | null;
}

interface AuditRow {
  id: number; name: string; settings: string; data_hash: string; hash_scheme: number; core_version: string; summary: string; created_at: Date;
}

/** Loads the audits named by `ids`; a missing id is simply absent from the map. */
export async function loadAuditSnapshots(
  sequelize: Sequelize,
  ids: readonly number[],
  options: { withPolls?: ReadonlySet<number>; checkCurrent?: boolean } = {},
): Promise<Map<number, AuditSnapshot>> {
  const out = new Map<number, AuditSnapshot>();
  if (!ids.length) return out;
  const rows = await sequelize.query<AuditRow>(
    'SELECT id, name, settings, data_hash, hash_scheme, core_version, summary, created_at FROM audits WHERE id IN (:ids)',
    { replacements: { ids: [...new Set(ids)] }, type: QueryTypes.SELECT },
  );
  for (const row of rows) {
    const settings = JSON.parse(row.settings) as AuditSettings;
    const elections = await loadElections(sequelize, { keys: settings.electionKeys });
    await ensureAnalyses(sequelize, row.id);
    const scorecards = await loadStoredScorecards(sequelize, row.id);
    out.set(row.id, {
      id: row.id,
      name: row.name,
      settings,
      dataHash: row.data_hash,
      coreVersion: row.core_version,
      createdAt: new Date(row.created_at).toISOString(),
      headline: (JSON.parse(row.summary) as { headline: AuditHeadline }).headline,
      scorecards: scorecards ? (JSON.parse(scorecards) as AuditSnapshot['scorecards']) : null,
      sharedError: await loadStoredSharedErrors<StoredSharedError>(sequelize, row.id),
      elections: elections.map((e) => ({ key: e.key, name: e.name, date: e.date, fictional: e.fictional })),
      polls: options.withPolls?.has(row.id) ? await loadAuditPolls(sequelize, row.id) : null,
      currentHash: options.checkCurrent ? (await loadAuditInputs(sequelize, settings.electionKeys, hashSchemeOf(row.hash_scheme))).dataHash : null,
    });
  }
  return out;
}
