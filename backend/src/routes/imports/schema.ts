import { z } from 'zod';

const flag = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1').optional();
const jsonRecord = <T extends z.ZodType>(value: T, name: string) =>
  z
    .string()
    .optional()
    .transform((s, ctx) => {
      if (!s) return undefined;
      try {
        return JSON.parse(s) as unknown;
      } catch {
        ctx.addIssue({ code: 'custom', message: `${name} must be JSON` });
        return z.NEVER;
      }
    })
    .pipe(z.record(z.string(), value).optional());

export const importQuerySchema = z.object({
  dryRun: flag,
  validOnly: flag,
  layout: z.enum(['long', 'wide']).optional(),
});

export const importBodySchema = z.object({
  columnMap: jsonRecord(z.string(), 'columnMap'),
  optionMap: jsonRecord(z.string(), 'optionMap'),
  pollsterMap: jsonRecord(z.number().int().positive(), 'pollsterMap'),
  reason: z.string().trim().max(1000).optional(),
});
