import { describe, expect, it } from 'vitest';
import { actionLabel, changesOf } from './history';

describe('changesOf', () => {
  it('lists only what changed, votes option by option with their names', () => {
    const changes = changesOf(
      {
        before: { status: 'certified', certifiedOn: '2022-05-29', sourceUrl: 'https://a.example', votes: { oak: 100, lantern: 90 } },
        after: { status: 'certified', certifiedOn: '2022-05-30', sourceUrl: 'https://a.example', votes: { oak: 100, lantern: 95 } },
      },
      new Map([['lantern', 'Lantern Party']]),
    );
    expect(changes).toEqual([
      { field: 'Certified on', before: '2022-05-29', after: '2022-05-30' },
      { field: 'Votes: Lantern Party', before: '90', after: '95' },
    ]);
  });

  it('shows a first certification as values set from nothing', () => {
    const changes = changesOf({ before: null, after: { status: 'certified', votes: { oak: 1200 } } });
    expect(changes).toContainEqual({ field: 'Status', before: '—', after: 'certified' });
    expect(changes).toContainEqual({ field: 'Votes: oak', before: '—', after: '1,200' });
  });

  it('names the actions in words', () => {
    expect(actionLabel('change_certified')).toBe('Changed a certified result');
    expect(actionLabel('some_new_action')).toBe('some new action');
  });
});
