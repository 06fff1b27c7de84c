import type { ContestDto } from '@veracast/shared-types';
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import { PollForm } from './PollForm';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const contest = {
  key: 'cal-2026-mayor',
  name: 'Mayor',
  options: [
    { key: 'ann', name: 'Ann Aster', bloc: 'A', votes: null, share: null },
    { key: 'bo', name: 'Bo Birch', bloc: 'B', votes: null, share: null },
  ],
} as unknown as ContestDto;

function fill(label: string, value: string) {
  fireEvent.change(screen.getByLabelText(label, { exact: true }), { target: { value } });
}

function fillValidPoll() {
  fill('Poll key', 'cal-p1');
  fill('Pollster', '3');
  fill('Fieldwork start', '2026-04-01');
  fill('Fieldwork end', '2026-04-03');
  fill('Published on', '2026-04-05');
  fill('Sample size', '800');
}

describe('PollForm', () => {
  it('refuses shares that sum past 100.5 with the shared schema rule, and sends nothing', async () => {
    const requests = stubApi({});
    renderWithClient(<PollForm contest={contest} pollsters={[{ id: 3, name: 'Cobalt Research' }]} />);
    fillValidPoll();
    fill('Share for Ann Aster', '60');
    fill('Share for Bo Birch', '41');
    fireEvent.click(screen.getByRole('button', { name: 'Add poll' }));
    // [practice] hand arithmetic: 60 + 41 = 101.0 > 100.5
    expect(await screen.findByText(/shares sum to 101.0, past 100.5/)).toBeTruthy();
    expect(requests).toHaveLength(0);
  });

  it('says which fields are missing', async () => {
    stubApi({});
    renderWithClient(<PollForm contest={contest} pollsters={[{ id: 3, name: 'Cobalt Research' }]} />);
    fireEvent.click(screen.getByRole('button', { name: 'Add poll' }));
    expect(await screen.findByText('pollsterId is required')).toBeTruthy();
    expect(screen.getByText('enter a number')).toBeTruthy();
  });

  it('posts the poll with its shares keyed by option, leaving out empty shares', async () => {
    const requests = stubApi({ 'POST /polls': () => jsonResponse(201, { key: 'cal-p1' }) });
    renderWithClient(<PollForm contest={contest} pollsters={[{ id: 3, name: 'Cobalt Research' }]} />);
    fillValidPoll();
    fill('Share for Ann Aster', '48.5');
    fill('Share for Bo Birch', '41');
    fill('Share for Undecided (don’t know, refused)', '10.5');
    fireEvent.click(screen.getByRole('button', { name: 'Add poll' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    expect(requests[0]?.body).toMatchObject({
      key: 'cal-p1',
      pollsterId: 3,
      contestKey: 'cal-2026-mayor',
      sampleSize: 800,
      moe: null,
      shares: { ann: 48.5, bo: 41, undecided: 10.5 },
    });
  });
});
