export { auditKeys } from './api/keys';
export { auditsQueryOptions, listAudits, useAudits, type AuditSummary } from './api/list-audits';
export { auditIdSchema, auditQueryOptions, getAudit, useAudit } from './api/get-audit';
export { auditPollsCsvUrl, auditPollsQueryOptions, listAuditPolls, useAuditPolls, type AuditPollFilters } from './api/list-audit-polls';
export { createAudit, createAuditInputSchema, useCreateAudit, type CreateAuditInput } from './api/create-audit';
export { rerunAudit, useRerunAudit } from './api/rerun-audit';
export { electionChoicesQueryOptions, listElectionChoices, useElectionChoices } from './api/list-election-choices';
export {
  METHOD_ANCHORS,
  METHOD_SECTIONS,
  isMethodAnchor,
  methodEntry,
  type MethodAnchor,
  type MethodEntry,
  type MethodSection,
  type MethodSource,
} from './method-catalogue';
export { SETTING_HELP, UNDECIDED_LABELS } from './settings-text';
export { AuditsTable } from './components/AuditsTable';
export { AuditView, type AuditViewProps } from './components/AuditView';
export { CreateAuditForm, type CreateAuditFormProps } from './components/CreateAuditForm';
export { FormulaLink, MetricExplanation } from './components/FormulaLink';
