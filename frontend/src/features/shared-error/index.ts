export { sharedErrorKeys } from './api/keys';
export { auditListQueryOptions, listAudits, useAuditList, type AuditListItem } from './api/list-audits';
export { auditIdSchema, auditQueryOptions, getAudit, useAudit } from './api/get-audit';
export {
  electionKeySchema,
  getSharedError,
  sharedErrorInputSchema,
  sharedErrorQueryOptions,
  useSharedError,
  type SharedErrorInput,
} from './api/get-shared-error';
export { listUsedAuditPolls, usedAuditPollsQueryOptions, useUsedAuditPolls } from './api/list-audit-polls';
export { auditHistoryQueryOptions, getAuditHistory, useAuditHistory } from './api/get-audit-history';
export { AuditHistoryReport } from './components/AuditHistoryReport';
export { SharedErrorChooser, type SharedErrorChooserProps } from './components/SharedErrorChooser';
export { SharedErrorReport, type SharedErrorReportProps } from './components/SharedErrorReport';
export { sharedMissVerdict, describeDirection, firmTypicalErrors, type Blocs, type SharedMissVerdict } from './lib/verdict';
export type * from './types';
