import { z } from 'zod';

const bool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');
const port = z.coerce.number().int().min(0).max(65535);

const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('production'),
  HOST: z.string().default('127.0.0.1'),
  PORT: port.default(8080),
  PUBLIC_URL: z.string().url().optional(),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: port.default(3407),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only').default('veracast'),
  DB_USER: z.string().min(1).default('veracast'),
  DB_PASSWORD: z.string({ message: 'DB_PASSWORD is required' }).min(1, 'DB_PASSWORD is required'),
  JWT_SECRET: z.string({ message: 'JWT_SECRET is required' }).min(32, 'JWT_SECRET must be at least 32 characters'),
  SESSION_HOURS: z.coerce.number().positive().max(24 * 30).default(12),
  COOKIE_SECURE: bool.default(false),
  ADMIN_EMAIL: z.string().email().default('admin@veracast.local'),
  ADMIN_PASSWORD: z.string().min(12, 'ADMIN_PASSWORD must be at least 12 characters').optional(),
  SMTP_URL: z.string().url().optional(),
  SMTP_FAKE_PORT: port.default(2525),
  MAIL_FROM: z.string().default('Veracast <no-reply@veracast.local>'),
  UPLOAD_MAX_MB: z.coerce.number().positive().max(1024).default(50),
  LOAD_DEMO: bool.default(true),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  LOGIN_MAX_FAILURES: z.coerce.number().int().positive().default(9),
  FRONTEND_DIST: z.string().optional(),
  /** Audit worker threads (0 = audits on the main thread only); default one per CPU besides the main one, at most 3. */
  AUDIT_WORKERS: z.coerce.number().int().min(0).max(16).optional(),
});

export type Config = z.infer<typeof schema> & { publicUrl: string };

export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`Invalid configuration:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
  }
}

/**
 * Reads and validates every setting once. Nothing else in the backend reads `process.env`.
 * Empty strings count as unset. Throws a ConfigError listing every bad variable.
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const cleaned = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ''));
  const parsed = schema.safeParse(cleaned);
  if (!parsed.success) {
    throw new ConfigError(parsed.error.issues.map((i) => `${i.path.join('.') || '(root)'}: ${i.message}`));
  }
  const c = parsed.data;
  return { ...c, publicUrl: (c.PUBLIC_URL ?? `http://${c.HOST}:${c.PORT}`).replace(/\/$/, '') };
}
