import { z } from 'zod';
import { DEFAULT_STORAGE_DIR, localFolderStorage } from './localFolderStorage';
import type { Storage } from './storage';

const storageEnv = z.discriminatedUnion('STORAGE', [
  z.object({ STORAGE: z.literal('local'), STORAGE_DIR: z.string().min(1).default(DEFAULT_STORAGE_DIR) }),
  z.object({
    STORAGE: z.literal('s3'),
    S3_ENDPOINT: z.string().url('S3_ENDPOINT must be a URL like https://s3.example.com').optional(),
    S3_PUBLIC_ENDPOINT: z.string().url('S3_PUBLIC_ENDPOINT must be a URL').optional(),
    S3_BUCKET: z.string().min(3, 'S3_BUCKET names the bucket photos are kept in'),
    S3_REGION: z.string().min(1).default('us-east-1'),
    S3_ACCESS_KEY_ID: z.string().min(1, 'S3_ACCESS_KEY_ID is required with STORAGE=s3'),
    S3_SECRET_ACCESS_KEY: z.string().min(1, 'S3_SECRET_ACCESS_KEY is required with STORAGE=s3'),
  }),
  z.object({
    STORAGE: z.literal('s3-local'),
    /** The fake keeps its objects here, beside the local database. */
    S3_LOCAL_DIR: z.string().min(1).default('.data/s3'),
    S3_LOCAL_PORT: z.coerce.number().int().min(0).max(65535).default(8569),
  }),
]);

export interface StartedStorage {
  storage: Storage;
  /** Stops a local fake this process started; nothing for the others. */
  close(): Promise<void>;
  describe: string;
}

/**
 * The storage the environment names: `STORAGE=local` (the default, a folder on
 * this machine), `s3` (any S3-compatible bucket) or `s3-local` (a fake S3 on
 * loopback started in this process, for trying the S3 path on one machine).
 */
export async function storageFromEnv(source: NodeJS.ProcessEnv = process.env): Promise<StartedStorage> {
  const parsed = storageEnv.safeParse({ ...source, STORAGE: source.STORAGE || 'local' });
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`The storage settings are not valid (STORAGE is local, s3 or s3-local):\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  if (env.STORAGE === 'local') return { storage: localFolderStorage(env.STORAGE_DIR), close: async () => {}, describe: `folder ${env.STORAGE_DIR}` };
  // The S3 SDK and the fake load only when asked for, so a one-machine start stays quick.
  const { s3Storage } = await import('./s3Storage');
  if (env.STORAGE === 's3') {
    const storage = s3Storage({
      endpoint: env.S3_ENDPOINT,
      publicEndpoint: env.S3_PUBLIC_ENDPOINT,
      bucket: env.S3_BUCKET,
      region: env.S3_REGION,
      accessKeyId: env.S3_ACCESS_KEY_ID,
      secretAccessKey: env.S3_SECRET_ACCESS_KEY,
    });
    return { storage, close: async () => {}, describe: `bucket ${env.S3_BUCKET}${env.S3_ENDPOINT ? ` at ${env.S3_ENDPOINT}` : ''}` };
  }
  const { runningS3FakeSettings, startS3Fake } = await import('./s3Fake');
  try {
    const fake = await startS3Fake({ directory: env.S3_LOCAL_DIR, port: env.S3_LOCAL_PORT });
    return { storage: s3Storage(fake.settings), close: () => fake.close(), describe: `local S3 fake at ${fake.settings.endpoint}` };
  } catch (err) {
    // `npm start` already serves the fake on this port: a worker started beside it shares that one.
    if ((err as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw err;
    const settings = runningS3FakeSettings(env.S3_LOCAL_PORT);
    return { storage: s3Storage(settings), close: async () => {}, describe: `local S3 fake at ${settings.endpoint} (started by another process)` };
  }
}
