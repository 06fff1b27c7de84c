import { z } from 'zod';

/** Life of a methodology note (SPEC §6). */
export const NOTE_STATES = ['draft', 'in_review', 'published'] as const;
export type NoteState = (typeof NOTE_STATES)[number];
export const NOTE_STATE_LABELS: Record<NoteState, string> = { draft: 'Draft', in_review: 'In review', published: 'Published' };

export const NOTE_REVIEW_DECISIONS = ['approved', 'returned'] as const;
export type NoteReviewDecision = (typeof NOTE_REVIEW_DECISIONS)[number];

/** Views a live block can show (fenced block with info string `veracast`). */
export const NOTE_BLOCK_VIEWS = ['headline', 'polls', 'scorecard', 'breakdown', 'shared-error', 'methods'] as const;
export type NoteBlockView = (typeof NOTE_BLOCK_VIEWS)[number];

export const NOTE_MARKDOWN_MAX = 200_000;
const markdown = z.string({ message: 'markdown is required' }).max(NOTE_MARKDOWN_MAX, `markdown must be at most ${NOTE_MARKDOWN_MAX} characters`);
const title = z.string({ message: 'title is required' }).trim().min(1, 'title is required').max(200, 'title must be at most 200 characters');
const electionKey = z
  .string()
  .trim()
  .max(100, 'electionKey must be at most 100 characters')
  .regex(/^[a-z0-9][a-z0-9_-]*$/, 'electionKey must be a key of lowercase letters, digits, - and _')
  .nullable()
  .optional();

export const noteCreateSchema = z.object({ title, markdown: markdown.default(''), electionKey });
export type NoteCreate = z.input<typeof noteCreateSchema>;

export const noteUpdateSchema = z.object({ title, markdown, electionKey });
export type NoteUpdate = z.input<typeof noteUpdateSchema>;

export const notePreviewSchema = z.object({ markdown });
export type NotePreviewRequest = z.input<typeof notePreviewSchema>;

export const noteReturnSchema = z.object({
  comments: z.string({ message: 'comments are required' }).trim().min(1, 'comments are required when a note is returned').max(20_000, 'comments must be at most 20000 characters'),
});
export const notePublishSchema = z.object({
  comments: z.string().trim().max(20_000, 'comments must be at most 20000 characters').optional(),
});
export const noteCorrectionSchema = z.object({
  markdown,
  notice: z.string({ message: 'notice is required' }).trim().min(1, 'notice is required: say what was corrected and why').max(2000, 'notice must be at most 2000 characters'),
  title: title.optional(),
});
export type NoteCorrection = z.input<typeof noteCorrectionSchema>;

export const noteListQuerySchema = z.object({
  state: z.enum(NOTE_STATES, { message: `state must be one of ${NOTE_STATES.join(', ')}` }).optional(),
  author: z.coerce.number({ message: 'author must be a user id' }).int('author must be a user id').positive('author must be a user id').optional(),
  election: z.string().max(100, 'election must be at most 100 characters').optional(),
  format: z.enum(['json', 'csv']).optional(),
});

/** An audit a note cites, with whether its data changed since it was computed. */
export interface NoteAuditRef {
  id: number;
  name: string | null;
  dataHash: string | null;
  /** null when the audit no longer exists or was not checked. */
  outOfDate: boolean | null;
  exists: boolean;
}

export interface NoteSummary {
  id: number;
  slug: string;
  title: string;
  state: NoteState;
  author: { id: number; name: string };
  electionKey: string | null;
  versionCount: number;
  currentVersion: number | null;
  publishedVersion: number | null;
  publishedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface NoteVersionSummary {
  number: number;
  title: string;
  isCorrection: boolean;
  correctionNotice: string | null;
  createdBy: string | null;
  createdAt: string;
  auditIds: number[];
  dataHashes: Record<string, string>;
}

export interface NoteVersionDto extends NoteVersionSummary {
  markdown: string;
  html: string;
}

export interface NoteReviewDto {
  id: number;
  versionNumber: number | null;
  reviewer: string | null;
  decision: NoteReviewDecision;
  comments: string | null;
  createdAt: string;
}

export interface NoteDetail extends NoteSummary {
  current: NoteVersionDto | null;
  reviews: NoteReviewDto[];
  audits: NoteAuditRef[];
  /** What the signed-in user may do with this note now. */
  can: { edit: boolean; submit: boolean; review: boolean; correct: boolean };
  publicPath: string | null;
}

export interface NotePreview {
  html: string;
  audits: NoteAuditRef[];
  /** Blocks that could not be rendered, with the reason (also shown in the HTML). */
  problems: string[];
}

export interface PublicNoteCorrection {
  version: number;
  date: string;
  notice: string;
}

export interface PublicNoteAudit {
  id: number;
  name: string;
  dataHash: string;
  coreVersion: string;
  createdAt: string;
}

export interface PublicNoteSummary {
  slug: string;
  title: string;
  publishedAt: string;
  updatedAt: string;
  corrected: boolean;
}

export interface PublicNote extends PublicNoteSummary {
  version: number;
  html: string;
  audits: PublicNoteAudit[];
  corrections: PublicNoteCorrection[];
  cautions: string[];
  fictional: boolean;
  pdfPath: string;
}
