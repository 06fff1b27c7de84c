import { z } from 'zod';
import { MODES, POPULATIONS, SPONSOR_TYPES } from '@veracast/shared-types';

/** A list given as `a,b` or as repeated parameters. */
const list = <T extends z.ZodType>(item: T) =>
  z.preprocess(
    (v) => (v === undefined ? undefined : (Array.isArray(v) ? v : String(v).split(',')).map((s) => String(s).trim()).filter(Boolean)),
    z.array(item).optional(),
  );
const flag = z.enum(['true', 'false']).transform((v) => v === 'true').optional();

export const auditPollsQuerySchema = z.object({
  format: z.enum(['json', 'csv']).optional(),
  election: z.string().max(100).optional(),
  pollster: z.coerce.number().int().positive().optional(),
  inWindow: flag,
  isFinal: flag,
  used: flag,
});

export const scorecardQuerySchema = z.object({
  format: z.enum(['json', 'csv']).optional(),
  elections: list(z.string().max(100)),
  kind: z.enum(['candidate', 'referendum']).optional(),
  modes: list(z.enum(MODES)),
  populations: list(z.enum(POPULATIONS)),
  sponsorTypes: list(z.enum([...SPONSOR_TYPES, 'none'])),
  minPolls: z.coerce.number().int().min(1).max(1000).optional(),
});

export const sharedErrorQuerySchema = z.object({
  election: z.string({ message: 'election is required' }).min(1, 'election is required').max(100),
  format: z.enum(['json', 'csv']).optional(),
  part: z.enum(['contests', 'pairs']).optional(),
});
