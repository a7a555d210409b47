import { z } from 'zod';

const httpUrl = z
  .string()
  .url('PUBLIC_URL must be a URL like https://frames.example')
  .refine((v) => /^https?:$/.test(new URL(v).protocol), 'PUBLIC_URL must start with http:// or https://')
  .transform((v) => v.replace(/\/+$/, ''));

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    DATABASE_URL: z.string().url('DATABASE_URL must be a postgres:// URL'),
    HOST: z.string().default('127.0.0.1'),
    PORT: z.coerce.number().int().min(1).max(65535).default(8080),
    WEB_DIR: z.string().default('dist'),
    /** The bundle that draws signed-in pages with their data (npm run build:web); without it the browser draws them. */
    PAGES_BUNDLE: z.string().default('dist-pages/render.cjs'),
    /** Folder for uploaded photos; keep it outside WEB_DIR so files are only served through the API's checks. */
    STORAGE_DIR: z.string().min(1).default('.data/storage'),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    /** Set to "0" to skip seeding the demo shop into an empty database; production never seeds it. */
    SEED_DEMO: z.enum(['0', '1']).default('1'),
    /**
     * Where people reach the app, e.g. https://frames.example: links in e-mail start with it, and
     * an https address turns on HSTS and Secure cookies. Required in production; never read from a request.
     */
    PUBLIC_URL: httpUrl.optional(),
    /** Milliseconds to wait for a Postgres connection, and for one statement, before answering 503. */
    DB_CONNECT_TIMEOUT_MS: z.coerce.number().int().min(100).max(60_000).default(2000),
    DB_STATEMENT_TIMEOUT_MS: z.coerce.number().int().min(100).max(600_000).default(5000),
    /** Bearer token for GET /api/metrics (Prometheus); without it the endpoint answers 404. */
    METRICS_TOKEN: z.string().min(16, 'METRICS_TOKEN must be at least 16 characters').optional(),
    /** After SIGTERM, how long /api/ready answers 503 before the listener closes, so a load balancer notices. */
    SHUTDOWN_DRAIN_MS: z.coerce.number().int().min(0).max(60_000).default(0),
    /** After SIGTERM, how long requests in flight (web) or a running job (worker) may take before being cut off. */
    SHUTDOWN_TIMEOUT_MS: z.coerce.number().int().min(100).max(600_000).default(10_000),
    /** Port of a worker's own metrics endpoint (GET /metrics with the same token); no endpoint when unset. */
    WORKER_METRICS_PORT: z.coerce.number().int().min(1).max(65535).optional(),
    /** Raises every per-address attempt limit to at least this (a shop whose staff share one address). */
    AUTH_LIMIT_PER_ADDRESS: z.coerce.number().int().min(1).max(1_000_000).optional(),
  })
  .refine((e) => e.NODE_ENV !== 'production' || e.PUBLIC_URL !== undefined, {
    path: ['PUBLIC_URL'],
    message: 'PUBLIC_URL is required in production (the address people use, e.g. https://frames.example)',
  });

export type Env = z.infer<typeof envSchema> & { publicUrl: string };

/** Reads and checks the environment once at start-up; fails loudly with every problem named. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`The environment is not valid:\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  // Outside production the app is reached where it listens.
  return { ...env, publicUrl: env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}` };
}
