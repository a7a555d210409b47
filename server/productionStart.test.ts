import { spawn } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { eq, inArray } from 'drizzle-orm';
import { generateIdFromEntropySize } from 'lucia';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { connectDatabase } from '../db/client';
import { members, shops } from '../db/schema';
import { demoShop } from '../db/seed';
import { hashPassword } from './auth';
import { loadEnv } from './env';

const root = path.resolve(import.meta.dirname, '..');
const database = connectDatabase(inject('databaseUrl'));
afterAll(() => database.close());

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const server = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/** Starts server/main.ts in production; resolves with its exit code, or 'serving' once /api/health answers. */
async function startProduction(extraEnv: Record<string, string> = {}): Promise<{ outcome: number | 'serving'; stderr: string }> {
  const port = await freePort();
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'pipe'],
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PUBLIC_URL: 'https://frames.example',
      DATABASE_URL: inject('databaseUrl'),
      PORT: String(port),
      SEED_DEMO: '1',
      LOG_LEVEL: 'warn',
      WEB_DIR: path.join(root, 'no-web-build-here'),
      ...extraEnv,
    },
  });
  let stderr = '';
  child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
  const exited = new Promise<number>((resolve) => child.on('exit', (code) => resolve(code ?? -1)));
  for (let i = 0; i < 150; i++) {
    const done = await Promise.race([exited, new Promise<null>((r) => setTimeout(() => r(null), 200))]);
    if (done !== null) return { outcome: done, stderr };
    if (await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.ok, () => false)) {
      child.kill('SIGTERM');
      await exited;
      return { outcome: 'serving', stderr };
    }
  }
  child.kill('SIGKILL');
  throw new Error('the production server neither started nor exited within 30 s');
}

describe('production start', () => {
  it('PUBLIC_URL is required when NODE_ENV=production, and optional elsewhere', () => {
    const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db' };
    expect(() => loadEnv({ ...base, NODE_ENV: 'production' })).toThrow(/PUBLIC_URL is required in production/);
    expect(loadEnv({ ...base, NODE_ENV: 'production', PUBLIC_URL: 'https://frames.example/' }).publicUrl).toBe('https://frames.example');
    expect(loadEnv({ ...base, NODE_ENV: 'development', PORT: '8123' }).publicUrl).toBe('http://127.0.0.1:8123');
    expect(() => loadEnv({ ...base, PUBLIC_URL: 'ftp://frames.example' })).toThrow(/http/);
  });

  it('refuses to start while a demo account opens with the published demo password; starts without seeding once it is gone', async () => {
    const demoEmail = demoShop.members[0].email;
    const [shop] = await database.db.insert(shops).values({ name: 'Copied trial database' }).returning({ id: shops.id });
    await database.db.insert(members).values({
      id: generateIdFromEntropySize(10),
      shopId: shop!.id,
      email: demoEmail,
      name: 'Trial owner',
      role: 'owner',
      passwordHash: await hashPassword(demoShop.password),
    });
    try {
      const refused = await startProduction();
      expect(refused.outcome).toBe(1);
      expect(refused.stderr).toContain('published demo password');
      expect(refused.stderr).toContain(demoEmail);
    } finally {
      await database.db.delete(shops).where(eq(shops.id, shop!.id));
    }

    const started = await startProduction();
    expect(started.outcome).toBe('serving');
  }, 90_000);

  it('an empty database is not given the demo shop in production, even with SEED_DEMO=1', async () => {
    const name = `matwright_prod_${Date.now()}`;
    const url = new URL(inject('databaseUrl'));
    const admin = new pg.Client({ connectionString: url.toString() });
    await admin.connect();
    await admin.query(`CREATE DATABASE "${name}"`);
    url.pathname = `/${name}`;
    const empty = connectDatabase(url.toString());
    try {
      expect((await startProduction({ DATABASE_URL: url.toString(), SEED_DEMO: '1' })).outcome).toBe('serving');
      // The start migrated the database (so the tables exist) and left it without a shop.
      expect(await empty.db.$count(shops)).toBe(0);
      expect(await empty.db.$count(members, inArray(members.email, demoShop.members.map((m) => m.email)))).toBe(0);
    } finally {
      await empty.close();
      await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await admin.end();
    }
  }, 90_000);
});
