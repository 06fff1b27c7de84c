import { z } from 'zod';

export const POPULATIONS = ['lv', 'rv', 'a'] as const;
export const MODES = ['phone', 'ivr', 'online', 'text', 'mixed', 'face', 'mail'] as const;
export const RESULT_STATUSES = ['provisional', 'certified'] as const;
export const CONTEST_KINDS = ['candidate', 'referendum'] as const;
export const SPONSOR_TYPES = ['media', 'academic', 'party', 'campaign', 'advocacy', 'self', 'unknown'] as const;
/** Sponsor types counted as partisan in breakdowns. */
export const PARTISAN_SPONSOR_TYPES = ['party', 'campaign'] as const;
export const RESERVED_OPTION_KEYS = ['undecided', 'other'] as const;

export type Population = (typeof POPULATIONS)[number];
export type Mode = (typeof MODES)[number];
export type ResultStatus = (typeof RESULT_STATUSES)[number];
export type ContestKind = (typeof CONTEST_KINDS)[number];
export type SponsorType = (typeof SPONSOR_TYPES)[number];

export const POPULATION_LABELS: Record<Population, string> = { lv: 'Likely voters', rv: 'Registered voters', a: 'Adults' };
export const SPONSOR_TYPE_LABELS: Record<SponsorType, string> = {
  media: 'Media', academic: 'Academic', party: 'Party', campaign: 'Campaign', advocacy: 'Advocacy', self: 'Self-published', unknown: 'Unknown',
};

export const keySchema = z
  .string()
  .trim()
  .min(1, 'is required')
  .max(100, 'must be at most 100 characters')
  .regex(/^[a-z0-9][a-z0-9._-]*$/, 'must use lower-case letters, digits, dot, dash or underscore');
export const isoDateSchema = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date as YYYY-MM-DD')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'is not a real calendar date');

/** The columns of the results CSV (SPEC §3), in order. */
export const RESULT_COLUMNS = [
  'election_key', 'election_date', 'election_name', 'jurisdiction', 'contest_key', 'contest_name',
  'option_key', 'option_name', 'bloc', 'votes', 'status', 'certified_on', 'source_url',
] as const;
/** Optional extra result columns Veracast understands. */
export const RESULT_EXTRA_COLUMNS = ['contest_kind', 'certifying_body', 'valid_votes', 'rejected_ballots', 'electorate'] as const;
/** The columns of the long poll CSV (SPEC §3), in order. */
export const POLL_COLUMNS = [
  'poll_key', 'pollster', 'sponsor', 'contest_key', 'fieldwork_start', 'fieldwork_end', 'published_on',
  'sample_size', 'population', 'mode', 'moe', 'option_key', 'share',
] as const;
/** Optional extra poll columns Veracast understands (disclosure items and grouping). */
export const POLL_EXTRA_COLUMNS = ['sponsor_type', 'study_key', 'is_headline', 'tracking', 'source_url', 'question_wording', 'weighting_statement', 'tables_url'] as const;
/** Columns of the wide poll layout before the option columns. */
export const POLL_WIDE_FIXED_COLUMNS = POLL_COLUMNS.filter((c) => c !== 'option_key' && c !== 'share');

export interface ImportRowError {
  /** Row number as a spreadsheet shows it: the header is row 1, the first data row is row 2; 0 for file-level problems. */
  row: number;
  column: string;
  code: string;
  message: string;
}

export interface ImportSummary {
  importId: number;
  /** `failed`: the file had errors and nothing was written (HTTP 422). */
  status: 'committed' | 'dry_run' | 'failed';
  rows: number;
  created: number;
  updated: number;
  unchanged: number;
  skipped: number;
  errors: ImportRowError[];
  /** Pollster names that match no firm or alias: created as new firms unless mapped. */
  newPollsters?: string[];
  validOnly?: boolean;
}

export interface ImportRecord {
  id: number;
  kind: 'results' | 'polls';
  fileName: string;
  fileHash: string;
  user: string | null;
  status: 'committed' | 'dry_run' | 'failed';
  rows: number;
  created: number;
  updated: number;
  unchanged: number;
  skipped: number;
  errorCount: number;
  validOnly: boolean;
  createdAt: string;
}

export const electionInputSchema = z.object({
  key: keySchema,
  name: z.string().trim().min(1, 'name is required').max(200),
  date: isoDateSchema,
  jurisdiction: z.string().trim().min(1, 'jurisdiction is required').max(120),
  blackoutStart: isoDateSchema.nullable().optional(),
  blackoutEnd: isoDateSchema.nullable().optional(),
});
export type ElectionInput = z.infer<typeof electionInputSchema>;

export const orientationSchema = z.object({
  blocA: z.string().trim().min(1, 'blocA is required').max(60),
  blocB: z.string().trim().min(1, 'blocB is required').max(60),
}).refine((v) => v.blocA !== v.blocB, { message: 'blocA and blocB must differ', path: ['blocB'] });

export const optionInputSchema = z.object({
  key: keySchema,
  name: z.string().trim().min(1, 'name is required').max(200),
  bloc: z.string().trim().max(60).nullable().optional(),
});
export const contestInputSchema = z.object({
  key: keySchema,
  electionKey: keySchema,
  name: z.string().trim().min(1, 'name is required').max(200),
  kind: z.enum(CONTEST_KINDS),
  electorate: z.number().int().nonnegative().nullable().optional(),
  rejectedBallots: z.number().int().nonnegative().nullable().optional(),
  options: z.array(optionInputSchema).min(2, 'a contest needs at least two options'),
});
export type ContestInput = z.infer<typeof contestInputSchema>;

export const resultInputSchema = z.object({
  status: z.enum(RESULT_STATUSES),
  certifiedOn: isoDateSchema.nullable().optional(),
  certifyingBody: z.string().trim().max(200).nullable().optional(),
  sourceUrl: z.string().trim().url('sourceUrl must be a URL').max(500).nullable().optional(),
  votes: z.record(z.string(), z.number().int('votes must be whole numbers').nonnegative('votes cannot be negative')),
  reason: z.string().trim().max(1000).optional(),
}).superRefine((v, ctx) => {
  if (v.status === 'certified') {
    if (!v.certifiedOn) ctx.addIssue({ code: 'custom', path: ['certifiedOn'], message: 'a certified result needs its certification date' });
    if (!v.sourceUrl) ctx.addIssue({ code: 'custom', path: ['sourceUrl'], message: 'a certified result needs a source' });
  }
});
export type ResultInput = z.infer<typeof resultInputSchema>;

export const pollsterInputSchema = z.object({
  name: z.string().trim().min(1, 'name is required').max(200),
  aliases: z.array(z.string().trim().min(1).max(200)).default([]),
  notes: z.string().trim().max(2000).nullable().optional(),
});
export type PollsterInput = z.infer<typeof pollsterInputSchema>;

export const pollInputSchema = z.object({
  key: keySchema,
  pollsterId: z.number().int().positive('pollsterId is required'),
  sponsor: z.string().trim().max(200).nullable().optional(),
  sponsorType: z.enum(SPONSOR_TYPES).nullable().optional(),
  contestKey: keySchema,
  fieldworkStart: isoDateSchema,
  fieldworkEnd: isoDateSchema,
  publishedOn: isoDateSchema,
  sampleSize: z.number().int('sampleSize must be a whole number').positive('sampleSize must be positive'),
  population: z.enum(POPULATIONS),
  mode: z.enum(MODES),
  moe: z.number().positive().max(50).nullable().optional(),
  studyKey: z.string().trim().max(100).nullable().optional(),
  isHeadline: z.boolean().default(true),
  tracking: z.boolean().default(false),
  sourceUrl: z.string().trim().url().max(500).nullable().optional(),
  questionWording: z.boolean().default(false),
  weightingStatement: z.boolean().default(false),
  tablesUrl: z.string().trim().url().max(500).nullable().optional(),
  shares: z.record(z.string(), z.number().min(0, 'shares are 0–100').max(100, 'shares are 0–100')),
}).superRefine((v, ctx) => {
  if (v.fieldworkEnd < v.fieldworkStart) ctx.addIssue({ code: 'custom', path: ['fieldworkEnd'], message: 'fieldwork end is before its start' });
  const sum = Object.values(v.shares).reduce((a, b) => a + b, 0);
  if (sum > 100.5) ctx.addIssue({ code: 'custom', path: ['shares'], message: `shares sum to ${sum.toFixed(1)}, past 100.5` });
});
export type PollInput = z.infer<typeof pollInputSchema>;

export interface OptionDto { key: string; name: string; bloc: string | null; votes: number | null; share: number | null }
export interface ContestDto {
  key: string; name: string; kind: ContestKind; electionKey: string; electionName: string; electionDate: string;
  fictional: boolean; status: ResultStatus | null; certifiedOn: string | null; certifyingBody: string | null; sourceUrl: string | null;
  validVotes: number | null; rejectedBallots: number | null; electorate: number | null; turnout: number | null;
  options: OptionDto[]; pollCount: number; refA: string | null; refB: string | null;
}
export interface ElectionDto {
  key: string; name: string; date: string; jurisdiction: string; fictional: boolean;
  blocA: string | null; blocB: string | null; orientationSource: 'set' | 'default' | 'none';
  blackoutStart: string | null; blackoutEnd: string | null;
  contestCount: number; certifiedCount: number; pollCount: number;
}
export interface PollDto {
  key: string; pollsterId: number; pollster: string; sponsor: string | null; sponsorType: SponsorType | null;
  contestKey: string; electionKey: string; fieldworkStart: string; fieldworkEnd: string; publishedOn: string;
  sampleSize: number; population: Population; mode: Mode; moe: number | null; studyKey: string | null; isHeadline: boolean;
  tracking: boolean; sourceUrl: string | null; tablesUrl: string | null; questionWording: boolean; weightingStatement: boolean;
  shares: Record<string, number>; disclosure: DisclosureDto; fictional: boolean;
}
export interface DisclosureDto { items: Record<DisclosureItem, boolean>; completeness: number }
export const DISCLOSURE_ITEMS = ['sponsor', 'firm', 'fieldworkDates', 'population', 'sampleSize', 'mode', 'statedMoe', 'weightingStatement', 'questionWording', 'tablesLink'] as const;
export type DisclosureItem = (typeof DISCLOSURE_ITEMS)[number];
export const DISCLOSURE_LABELS: Record<DisclosureItem, string> = {
  sponsor: 'Sponsor named', firm: 'Polling firm named', fieldworkDates: 'Fieldwork dates', population: 'Population',
  sampleSize: 'Sample size', mode: 'Mode', statedMoe: 'Stated margin of error', weightingStatement: 'Weighting statement',
  questionWording: 'Question wording', tablesLink: 'Full tables link',
};
export interface PollsterDto {
  id: number; name: string; aliases: string[]; pollCount: number; contestCount: number; electionCount: number;
  modes: string[]; sponsors: { name: string; type: SponsorType }[]; disclosure: number | null; notes: string | null;
}
export interface ChangeLogEntryDto {
  id: number; entity: string; entityKey: string; action: string; user: string | null; reason: string | null;
  before: unknown; after: unknown; createdAt: string;
}
export interface QualityIssueDto {
  code: 'possible_duplicate' | 'overlapping_tracking' | 'study_without_headline' | 'shares_off_100' | 'result_provisional' | 'contest_without_result' | 'published_in_blackout';
  severity: 'warning' | 'info';
  electionKey: string | null; contestKey: string | null; pollKeys: string[]; message: string;
}

export const UNDECIDED_TREATMENTS = ['raw', 'proportional', 'two_party'] as const;
export type UndecidedTreatment = (typeof UNDECIDED_TREATMENTS)[number];

export const auditCreateSchema = z.object({
  name: z.string().trim().min(1, 'name is required').max(200, 'name must be at most 200 characters'),
  electionKeys: z.array(keySchema).min(1, 'choose at least one election').max(200),
  windowDays: z.number().int('windowDays must be a whole number').min(0, 'windowDays must be 0 or more').max(3650).default(21),
  finalOnly: z.boolean().default(true),
  undecided: z.enum(UNDECIDED_TREATMENTS).default('raw'),
  minPolls: z.number().int('minPolls must be a whole number').min(1, 'minPolls must be at least 1').max(1000).default(5),
  designEffect: z.number().min(1, 'designEffect must be at least 1').max(10, 'designEffect must be at most 10').default(1),
});
export type AuditCreate = z.input<typeof auditCreateSchema>;
export type AuditSettings = z.output<typeof auditCreateSchema>;

/** One poll of an audit (SPEC §7 shape plus the inputs it came from). */
export interface AuditPollDto {
  pollKey: string; contestKey: string; electionKey: string; pollsterId: number; pollster: string;
  refA: string | null; refB: string | null; refBasis: 'blocs' | 'top_two' | null;
  marginError: number | null; absMarginError: number | null; lean: 'A' | 'B' | 'none' | null;
  mosteller3: number | null; mosteller5: number | null; mtkA: number | null; mtkSe: number | null; mtkP: number | null;
  aeB: number | null; aeBw: number | null; winnerCalled: boolean | null; shareCovered: boolean | null; marginCovered: boolean | null;
  daysOut: number | null; daysOutEnd: number | null; undecidedShare: number | null; twoPartyShareError: number | null;
  inWindow: boolean; isFinal: boolean; fieldworkEnd: string; sampleSize: number; population: Population; mode: Mode;
  sponsorType: SponsorType | null; disclosure: number; nEff: number | null; pollA: number | null; pollB: number | null;
  resultA: number | null; resultB: number | null; notes: string[]; error: string | null;
  /** The rest of the per-poll metrics (METHODS §1–5), for a poll's own page. */
  detail?: AuditPollDetail | null;
}

export interface AuditPollDetail {
  treatment: UndecidedTreatment; winner: string; runnerUp: string;
  shareErrors: Record<string, number>; mosteller3Set: string[];
  mtkZ: number | null; mtkLower: number | null; mtkUpper: number | null;
  aePrime: Record<string, number> | null; aeSe: Record<string, number> | null; aeChi2: number | null; aeG2: number | null;
  aeDf: number | null; aeChi2P: number | null; aeG2P: number | null; aeMerges: string[];
  shareInterval: [number, number] | null; marginInterval: [number, number] | null;
  nEffBasis: 'stated_moe' | 'design_effect'; nDesign: number;
}

export interface AuditHeadline {
  pollsUsed: number; pollsTotal: number; meanAbsMarginError: number | null; meanSignedError: number | null;
  meanSignedErrorInterval: [number, number] | null; signedDirection: string | null;
  marginCoverage: number | null; shareCoverage: number | null; winnerCalledRate: number | null; calls: number; noCalls: number;
  notComputable: number;
}

export interface AuditDto {
  id: number; name: string; settings: AuditSettings; dataHash: string; coreVersion: string; pollCount: number;
  createdAt: string; createdBy: string | null; rerunOf: number | null; outOfDate: boolean; currentHash: string | null;
  elections: { key: string; name: string; date: string; blocA: string | null; blocB: string | null; fictional: boolean }[];
  headline: AuditHeadline; fictional: boolean;
}
