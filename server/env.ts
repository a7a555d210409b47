import { z } from 'zod';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  DATABASE_URL: z.string().url('DATABASE_URL must be a postgres:// URL'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(1).max(65535).default(8080),
  WEB_DIR: z.string().default('dist'),
  /** Folder for uploaded photos; keep it outside WEB_DIR so files are only served through the API's checks. */
  STORAGE_DIR: z.string().min(1).default('.data/storage'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Set to "0" to skip seeding the demo shop into an empty database. */
  SEED_DEMO: z.enum(['0', '1']).default('1'),
});

export type Env = z.infer<typeof envSchema>;

/** Reads and checks the environment once at start-up; fails loudly with every problem named. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`The environment is not valid:\n${lines.join('\n')}`);
  }
  return parsed.data;
}
