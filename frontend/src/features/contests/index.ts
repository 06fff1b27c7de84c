export { contestKeys } from './api/keys';
export { contestKeyParamSchema, contestQueryOptions, getContest, useContest, type ContestDetail } from './api/get-contest';
export {
  contestPollsQueryOptions,
  listContestPolls,
  undecidedTreatmentSchema,
  useContestPolls,
  type ContestPoll,
} from './api/list-contest-polls';
export { createContest, createContestInputSchema, useCreateContest } from './api/create-contest';
export { saveResult, saveResultInputSchema, useSaveResult } from './api/save-result';
export { savePoll, savePollInputSchema, useSavePoll } from './api/save-poll';
export { sourceDocumentUrl, uploadSourceDocument, useUploadSourceDocument } from './api/upload-source-document';
export { certifiedMargin, fieldworkMidpoint, marginPoints, pollMargin, type MarginPoint } from './margins';
export { ChangeHistory } from './components/ChangeHistory';
export { ContestFacts } from './components/ContestFacts';
export { ContestForm } from './components/ContestForm';
export { ContestPollsTable } from './components/ContestPollsTable';
export { DisclosureChecklist } from './components/DisclosureChecklist';
export { MarginChart } from './components/MarginChart';
export { PollForm } from './components/PollForm';
export { ResultForm } from './components/ResultForm';
export { ResultTable } from './components/ResultTable';
export { SourceDocumentPanel } from './components/SourceDocumentPanel';
