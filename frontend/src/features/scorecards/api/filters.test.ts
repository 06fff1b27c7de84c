import { describe, expect, it } from 'vitest';
import { hasScorecardFilters, normalizeScorecardFilters, scorecardFiltersFromSearch, scorecardFiltersToSearch } from './filters';

describe('scorecard filters', () => {
  it('reads lists given with commas or repeated, keeping only valid values', () => {
    const params = new URLSearchParams('modes=phone,fax&modes=online&populations=lv&sponsorTypes=none,party&kind=referendum&minPolls=3&elections=b,a');
    expect(scorecardFiltersFromSearch(params)).toEqual({
      elections: ['a', 'b'],
      modes: ['online', 'phone'],
      populations: ['lv'],
      sponsorTypes: ['none', 'party'],
      kind: 'referendum',
      minPolls: 3,
    });
  });

  it('drops an invalid race type and minimum rather than failing', () => {
    expect(scorecardFiltersFromSearch(new URLSearchParams('kind=mayor&minPolls=0'))).toEqual({});
    expect(scorecardFiltersFromSearch(new URLSearchParams('minPolls=2.5'))).toEqual({});
    expect(scorecardFiltersFromSearch(new URLSearchParams(''))).toEqual({});
  });

  it('writes one spelling per set of filters, so equal filters make equal links and query keys', () => {
    const a = scorecardFiltersToSearch({ modes: ['phone', 'online', 'phone'], elections: [] });
    const b = scorecardFiltersToSearch({ modes: ['online', 'phone'] });
    expect(a).toEqual(b);
    expect(a.modes).toBe('online,phone');
    expect(a.elections).toBeUndefined();
    expect(normalizeScorecardFilters({ modes: [], minPolls: 5 })).toEqual({ minPolls: 5 });
  });

  it('round-trips through the search string', () => {
    const filters = { modes: ['phone' as const], kind: 'candidate' as const, minPolls: 4 };
    const search = new URLSearchParams();
    for (const [k, v] of Object.entries(scorecardFiltersToSearch(filters))) if (v) search.set(k, v);
    expect(scorecardFiltersFromSearch(search)).toEqual(filters);
    expect(hasScorecardFilters(filters)).toBe(true);
    expect(hasScorecardFilters({})).toBe(false);
  });
});
