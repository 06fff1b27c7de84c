import { POLL_COLUMNS, POLL_WIDE_FIXED_COLUMNS } from '@veracast/shared-types';
import { describe, expect, it } from 'vitest';
import {
  autoMatch,
  columnMapPayload,
  defaultOptionKey,
  detectLayout,
  distinctValues,
  knownColumns,
  mappingProblems,
  normalizeHeader,
  optionColumns,
} from './mapping';

const LONG_HEADERS = ['Poll Key', 'Firm', 'sponsor', 'contest_key', 'Fieldwork-Start', 'fieldwork_end', 'published_on', 'N', 'population', 'mode', 'moe', 'option_key', 'share'];

describe('normalizeHeader', () => {
  it('lower-cases and joins words with one underscore', () => {
    expect(normalizeHeader('  Fieldwork - Start ')).toBe('fieldwork_start');
    expect(normalizeHeader('sample.size')).toBe('sample_size');
  });
});

describe('autoMatch', () => {
  it('matches columns by normalised name, then by a common synonym, using each header once', () => {
    const map = autoMatch(knownColumns('polls'), LONG_HEADERS);
    expect(map.poll_key).toBe('Poll Key');
    expect(map.fieldwork_start).toBe('Fieldwork-Start');
    expect(map.pollster).toBe('Firm');
    expect(map.sample_size).toBe('N');
    expect(map.study_key).toBe('');
    expect(new Set(Object.values(map).filter(Boolean)).size).toBe(Object.values(map).filter(Boolean).length);
  });

  it('prefers an exact name over a synonym held by another header', () => {
    // "id" is a synonym of poll_key, but the file also has poll_key itself.
    const map = autoMatch(['poll_key'], ['id', 'poll_key']);
    expect(map.poll_key).toBe('poll_key');
  });

  it('leaves a column empty when nothing matches', () => {
    expect(autoMatch(['sample_size'], ['interviews']).sample_size).toBe('');
  });
});

describe('layouts and option columns', () => {
  it('is long when option_key and share are mapped, wide otherwise', () => {
    expect(detectLayout(autoMatch(knownColumns('polls'), LONG_HEADERS))).toBe('long');
    const wideHeaders = [...POLL_WIDE_FIXED_COLUMNS, 'Oak', 'lantern', 'DK'];
    expect(detectLayout(autoMatch(knownColumns('polls'), wideHeaders))).toBe('wide');
  });

  it('offers the headers not used by a known column as option columns', () => {
    const headers = [...POLL_WIDE_FIXED_COLUMNS, 'tracking', 'Oak', 'lantern', 'DK'];
    const map = autoMatch(knownColumns('polls'), headers);
    expect(optionColumns(headers, map)).toEqual(['Oak', 'lantern', 'DK']);
  });

  it('guesses an option from its key, its name, the reserved keys or the header itself', () => {
    const known = [
      { key: 'oak', name: 'Oakbound Union' },
      { key: 'lantern', name: 'Lantern Party' },
    ];
    expect(defaultOptionKey('Oak', known)).toBe('oak');
    expect(defaultOptionKey('Lantern Party', known)).toBe('lantern');
    expect(defaultOptionKey('DK', known)).toBe('undecided');
    expect(defaultOptionKey('Other', known)).toBe('other');
    expect(defaultOptionKey('notes', known)).toBe('');
    // Without the contest's options the header is the best guess, when it is a valid key.
    expect(defaultOptionKey('verdant', [])).toBe('verdant');
    expect(defaultOptionKey('Vote %', [])).toBe('');
  });
});

describe('mappingProblems', () => {
  it('names every required column that is not mapped', () => {
    const map = autoMatch(POLL_COLUMNS, ['poll_key', 'pollster']);
    const [first] = mappingProblems('polls', 'long', map);
    expect(first).toContain('sponsor');
    expect(first).toContain('share');
    expect(first).not.toContain('poll_key');
  });

  it('refuses one file column chosen for two columns', () => {
    const map = { ...autoMatch(POLL_COLUMNS, [...POLL_COLUMNS]), moe: 'share' };
    expect(mappingProblems('polls', 'long', map).join(' ')).toMatch(/“share” is chosen for moe and share/);
  });

  it('needs at least one option column in the wide layout, each option once', () => {
    const map = autoMatch(POLL_WIDE_FIXED_COLUMNS, [...POLL_WIDE_FIXED_COLUMNS]);
    expect(mappingProblems('polls', 'wide', map, { oak: '' })).toContain('Map at least one file column to an option.');
    expect(mappingProblems('polls', 'wide', map, { oak: 'oak', oak2: 'oak' }).join(' ')).toContain('Two file columns are mapped to the option oak.');
    expect(mappingProblems('polls', 'wide', map, { oak: 'oak' })).toEqual([]);
  });
});

describe('payload and distinct values', () => {
  it('sends only the mapped columns of the chosen layout', () => {
    const map = autoMatch(knownColumns('polls'), LONG_HEADERS);
    const wide = columnMapPayload(map, 'polls', 'wide');
    expect(wide.option_key).toBeUndefined();
    expect(wide.sample_size).toBe('N');
    expect(columnMapPayload(map, 'polls', 'long').option_key).toBe('option_key');
    expect(Object.values(columnMapPayload(map, 'polls', 'long'))).not.toContain('');
  });

  it('lists the distinct values of a column in file order', () => {
    const rows = [['a', 'x'], ['b', 'y'], ['a', 'x'], ['c', '']];
    expect(distinctValues(['k', 'v'], rows, 'k')).toEqual(['a', 'b', 'c']);
    expect(distinctValues(['k', 'v'], rows, 'v')).toEqual(['x', 'y']);
    expect(distinctValues(['k', 'v'], rows, undefined)).toEqual([]);
  });
});
