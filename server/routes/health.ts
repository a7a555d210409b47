import { sql } from 'drizzle-orm';
import { Router } from 'express';
import type { Db } from '../../db/client';
import { DB_RETRY_AFTER_S } from '../databaseErrors';

/** Milliseconds /api/ready waits for its query; a monitor should hear "not ready" quickly. */
export const READY_TIMEOUT_MS = 2000;

function withTimeout<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${ms} ms`)), ms);
  });
  return Promise.race([work, late]).finally(() => clearTimeout(timer));
}

/**
 * /api/health: the process is alive and serving (never touches the database), for a
 * restart policy. /api/ready: a query answers, for a load balancer deciding where to send traffic.
 */
export function healthRoutes(db: Db, draining: () => boolean = () => false): Router {
  const router = Router();
  router.get('/health', (_req, res) => {
    res.json({ ok: true });
  });
  router.get('/ready', async (_req, res) => {
    if (draining()) {
      // Shutting down: finish what is in flight, take nothing new.
      res.setHeader('Connection', 'close');
      res.status(503).json({ error: { code: 'shutting_down', message: 'This process is shutting down' } });
      return;
    }
    try {
      await withTimeout(db.execute(sql`select 1`), READY_TIMEOUT_MS);
      res.json({ ok: true, database: 'up' });
    } catch {
      res.setHeader('Retry-After', String(DB_RETRY_AFTER_S));
      res.status(503).json({ error: { code: 'db_unavailable', message: 'The database is not answering' } });
    }
  });
  return router;
}
