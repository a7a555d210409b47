import fs from 'node:fs';
import pg from 'pg';

/**
 * The browser run's own database (scripts/e2e-server.mjs writes its address), for set-up that no
 * route offers yet, e.g. a quote the customer has accepted.
 */
export async function withE2eDatabase<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: fs.readFileSync(new URL('../output/database-url', import.meta.url), 'utf8').trim() });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}
