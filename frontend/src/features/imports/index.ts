export { importKeys } from './api/keys';
export { importErrorsCsvUrl, importsQueryOptions, listImports, useImports } from './api/list-imports';
export { getImport, importIdSchema, importQueryOptions, useImportRecord, type ImportRecordDetail } from './api/get-import';
export { importUrl, readImportAnswer, sendImport, sendImportInputSchema, useSendImport, type SendImportInput, type UploadProgress } from './api/send-import';
export * from './mapping';
export { FileProblem, UPLOAD_LIMIT_BYTES, UPLOAD_LIMIT_MB, checkSize, parseCsvText, readCsvFile, type ParsedFile } from './parse-file';
export { ImportWizard, type ImportWizardProps } from './components/ImportWizard';
export { ImportsTable } from './components/ImportsTable';
export { ImportRecordView } from './components/ImportRecordView';
