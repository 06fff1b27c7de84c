import type { NoteDetail } from '@veracast/shared-types';
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import { blockText } from './BlockInserter';
import { NoteView } from './NoteView';

const note = (over: Partial<NoteDetail> = {}): NoteDetail => ({
  id: 4, slug: 'a-note', title: 'A note', state: 'in_review', author: { id: 2, name: 'Ana Author' }, electionKey: null, versionCount: 2,
  currentVersion: 2, publishedVersion: null, publishedAt: null, createdAt: '2026-12-01T00:00:00Z', updatedAt: '2026-12-01T00:00:00Z',
  current: { number: 2, title: 'A note', isCorrection: false, correctionNotice: null, createdBy: 'Ana Author', createdAt: '2026-12-01T00:00:00Z', auditIds: [1], dataHashes: { 1: 'abc' }, markdown: '# A note', html: '<h2>Server heading</h2>' },
  reviews: [], audits: [{ id: 1, name: 'Audit', dataHash: 'abc', exists: true, outOfDate: true }],
  can: { edit: false, submit: false, review: true, correct: false }, publicPath: null, ...over,
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('NoteView', () => {
  it('offers approval to a reviewer and warns about an out-of-date audit', async () => {
    const requests = stubApi({ 'POST /notes/4/return': () => jsonResponse(200, note({ state: 'draft' })) });
    renderWithClient(<NoteView note={note()} />);
    expect(screen.getByRole('heading', { name: 'Server heading' })).toBeTruthy();
    expect(screen.getByText('Out of date: audit #1')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Return to author' }));
    expect(await screen.findByText('comments are required when a note is returned')).toBeTruthy();
    expect(requests).toEqual([]);
    fireEvent.change(screen.getByLabelText('Review comments'), { target: { value: 'Add the sources.' } });
    fireEvent.click(screen.getByRole('button', { name: 'Return to author' }));
    await waitFor(() => expect(requests).toEqual([{ method: 'POST', path: '/notes/4/return', body: { comments: 'Add the sources.' } }]));
  });

  it('hides the review controls from the author', () => {
    renderWithClient(<NoteView note={note({ can: { edit: false, submit: false, review: false, correct: false } })} />);
    expect(screen.queryByRole('button', { name: 'Approve and publish' })).toBeNull();
    expect(screen.getByText('This note waits for a reviewer other than its author.')).toBeTruthy();
  });
});

describe('blockText', () => {
  it('writes the fenced block syntax the server reads', () => {
    expect(blockText('headline', { audit: 3, metric: 'meanSignedError' })).toBe('\n```veracast\naudit: 3\nview: headline\nmetric: meanSignedError\n```\n');
    expect(blockText('methods', {})).toBe('\n```veracast\nview: methods\n```\n');
    expect(blockText('breakdown', { audit: 2, by: 'mode', metric: 'x' })).toBe('\n```veracast\naudit: 2\nview: breakdown\nby: mode\n```\n');
  });
});
