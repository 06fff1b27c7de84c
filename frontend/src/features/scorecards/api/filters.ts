import { CONTEST_KINDS, MODES, POPULATIONS, SPONSOR_TYPES } from '@veracast/shared-types';
import { z } from 'zod';

/** Sponsor types a filter may name; `none` is a poll without a sponsor type. */
export const SPONSOR_FILTER_VALUES = [...SPONSOR_TYPES, 'none'] as const;

/** The filters `GET /audits/:id/scorecards` understands. Absent or empty means "all". */
export const scorecardFiltersSchema = z.object({
  elections: z.array(z.string().trim().min(1).max(100)).optional(),
  kind: z.enum(CONTEST_KINDS).optional(),
  modes: z.array(z.enum(MODES)).optional(),
  populations: z.array(z.enum(POPULATIONS)).optional(),
  sponsorTypes: z.array(z.enum(SPONSOR_FILTER_VALUES)).optional(),
  minPolls: z.number().int().min(1).max(1000).optional(),
});
export type ScorecardFilters = z.infer<typeof scorecardFiltersSchema>;

const LIST_KEYS = ['elections', 'modes', 'populations', 'sponsorTypes'] as const;

function sortedUnique<T extends string>(values: readonly T[] | undefined): T[] | undefined {
  if (!values || values.length === 0) return undefined;
  return [...new Set(values)].sort();
}

/**
 * One spelling per set of filters: lists sorted without repeats, empty lists and absent values
 * dropped, so that equal filters make equal query keys and equal links.
 */
export function normalizeScorecardFilters(filters: ScorecardFilters): ScorecardFilters {
  const parsed = scorecardFiltersSchema.parse(filters);
  const out: ScorecardFilters = {};
  for (const key of LIST_KEYS) {
    const list = sortedUnique<string>(parsed[key]);
    if (list) (out as Record<string, unknown>)[key] = list;
  }
  if (parsed.kind) out.kind = parsed.kind;
  if (parsed.minPolls !== undefined) out.minPolls = parsed.minPolls;
  return out;
}

function listParam(params: URLSearchParams, key: string): string[] {
  return params
    .getAll(key)
    .flatMap((value) => value.split(','))
    .map((value) => value.trim())
    .filter(Boolean);
}

/**
 * Reads filters from a page's search parameters, keeping every valid value and silently dropping
 * the rest (a hand-edited link shows what it can rather than an error).
 */
export function scorecardFiltersFromSearch(params: URLSearchParams): ScorecardFilters {
  const shape = scorecardFiltersSchema.shape;
  const keep = <T,>(schema: z.ZodType<T>, values: string[]): T[] =>
    values.flatMap((value) => {
      const result = schema.safeParse(value);
      return result.success ? [result.data] : [];
    });
  const minPolls = shape.minPolls.safeParse(Number(params.get('minPolls') ?? Number.NaN));
  const kind = shape.kind.safeParse(params.get('kind') ?? undefined);
  return normalizeScorecardFilters({
    elections: keep(z.string().trim().min(1).max(100), listParam(params, 'elections')),
    modes: keep(z.enum(MODES), listParam(params, 'modes')),
    populations: keep(z.enum(POPULATIONS), listParam(params, 'populations')),
    sponsorTypes: keep(z.enum(SPONSOR_FILTER_VALUES), listParam(params, 'sponsorTypes')),
    kind: kind.success ? kind.data : undefined,
    minPolls: minPolls.success ? minPolls.data : undefined,
  });
}

/** Filters as query parameters (`modes=phone,online`), for the API and for links. */
export function scorecardFiltersToSearch(filters: ScorecardFilters): Record<string, string | undefined> {
  const f = normalizeScorecardFilters(filters);
  return {
    elections: f.elections?.join(','),
    kind: f.kind,
    modes: f.modes?.join(','),
    populations: f.populations?.join(','),
    sponsorTypes: f.sponsorTypes?.join(','),
    minPolls: f.minPolls === undefined ? undefined : String(f.minPolls),
  };
}

export function hasScorecardFilters(filters: ScorecardFilters): boolean {
  return Object.values(scorecardFiltersToSearch(filters)).some((value) => value !== undefined);
}
