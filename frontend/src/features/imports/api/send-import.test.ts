import { describe, expect, it } from 'vitest';
import { isApiError } from '../../../lib/api-client';
import { importFormData, importUrl, readImportAnswer } from './send-import';

const summary = { importId: 7, status: 'failed', rows: 6, created: 0, updated: 0, unchanged: 0, skipped: 2, errors: [{ row: 5, column: 'sample_size', code: 'not_positive_integer', message: 'bad' }] };

describe('importUrl', () => {
  it('puts the switches in the query string', () => {
    expect(importUrl({ kind: 'polls', dryRun: true, validOnly: false, layout: 'wide' })).toBe('/api/v1/imports/polls?dryRun=true&layout=wide');
    expect(importUrl({ kind: 'results', dryRun: false, validOnly: true, layout: 'wide' })).toBe('/api/v1/imports/results?validOnly=true');
  });
});

describe('importFormData', () => {
  it('sends the maps as JSON text fields and the file last', () => {
    const data = importFormData({
      kind: 'polls',
      file: new Blob(['a,b\n']),
      fileName: 'p.csv',
      dryRun: true,
      validOnly: false,
      columnMap: { sample_size: 'N' },
      optionMap: {},
      pollsterMap: { 'Harbour Light': 3 },
    });
    expect([...data.keys()]).toEqual(['columnMap', 'pollsterMap', 'file']);
    expect(JSON.parse(String(data.get('pollsterMap')))).toEqual({ 'Harbour Light': 3 });
    expect(data.get('file')).toBeInstanceOf(Blob);
    expect(data.get('optionMap')).toBeNull();
  });
});

describe('readImportAnswer', () => {
  it('returns the summary of a file with row errors (422) instead of throwing', () => {
    const answer = readImportAnswer(422, JSON.stringify({ ...summary, error: { code: 'import_invalid', message: '1 row error(s)' } }));
    expect(answer.status).toBe('failed');
    expect(answer.errors[0]?.row).toBe(5);
  });

  it('throws the server error of a file-level problem', () => {
    const body = { error: { code: 'missing_columns', message: 'The file lacks the column share', details: { errors: [] } } };
    try {
      readImportAnswer(422, JSON.stringify(body));
      expect.unreachable();
    } catch (error) {
      expect(isApiError(error) && error.code).toBe('missing_columns');
    }
  });

  it('explains a 413 even without a JSON body', () => {
    expect(() => readImportAnswer(413, '<html>too large</html>')).toThrow(/50 MB upload limit/);
  });
});
