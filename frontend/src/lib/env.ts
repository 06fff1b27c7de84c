import { API_PREFIX } from '@veracast/shared-types';
import { z } from 'zod';

const envSchema = z.object({
  VITE_API_BASE: z
    .string()
    .regex(/^(\/|https?:\/\/)/, 'VITE_API_BASE must be a path starting with / or an http(s) URL')
    .default(API_PREFIX),
});

function readEnv() {
  const parsed = envSchema.safeParse(import.meta.env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Invalid frontend environment:\n${problems.join('\n')}`);
  }
  return { apiBase: parsed.data.VITE_API_BASE.replace(/\/$/, '') };
}

/** The one validated view of the build-time environment. */
export const env = readEnv();
