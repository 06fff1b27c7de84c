import type { ImportRecord } from '@veracast/shared-types';
import type { ImportModel } from '../../db/models';

export const presentImport = (r: ImportModel, user: string | null): ImportRecord => ({
  id: r.id,
  kind: r.kind,
  fileName: r.fileName,
  fileHash: r.fileHash,
  user,
  status: r.status,
  rows: r.rows,
  created: r.created,
  updated: r.updated,
  unchanged: r.unchanged,
  skipped: r.skipped,
  errorCount: r.errorCount,
  validOnly: Boolean(r.validOnly),
  createdAt: new Date(r.createdAt).toISOString(),
});
