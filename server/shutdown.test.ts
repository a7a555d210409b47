import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import { describe, expect, it } from 'vitest';
import { shutDown } from './shutdown';

const logger = pino({ level: 'silent' });

/** A server whose /slow answer takes `ms`; records each answer once its last byte is handed to the socket. */
async function slowServer(ms: number, events: string[] = []) {
  const finished: string[] = [];
  const server = http.createServer((req, res) => {
    setTimeout(() => {
      res.end('done', () => events.push('answered'));
      finished.push(req.url ?? '');
    }, req.url === '/slow' ? ms : 0);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { server, finished, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

describe('graceful shutdown', () => {
  it('finishes a request in flight, refuses new connections, then closes resources and exits 0', async () => {
    const events: string[] = [];
    const { server, url, finished } = await slowServer(600, events);
    const inFlight = fetch(`${url}/slow`).then(async (r) => [r.status, await r.text()]);
    await new Promise((r) => setTimeout(r, 100));
    let draining = false;
    const stopping = shutDown(server, {
      logger,
      startDraining: () => (draining = true),
      drainDelayMs: 0,
      timeoutMs: 5000,
      closeResources: async () => void events.push('resources closed'),
      exit: (code) => void events.push(`exit ${code}`),
    }, 'test');
    await new Promise((r) => setTimeout(r, 50));
    expect(draining).toBe(true);
    await expect(fetch(`${url}/fast`)).rejects.toThrow();
    expect(await inFlight).toEqual([200, 'done']);
    expect(await stopping).toBe(true);
    expect(finished).toEqual(['/slow']);
    expect(events).toEqual(['answered', 'resources closed', 'exit 0']);
  });

  it('cuts off a request still running at the time limit and exits anyway', async () => {
    const { server, url } = await slowServer(60_000);
    const inFlight = fetch(`${url}/slow`).then(() => 'answered', () => 'cut off');
    await new Promise((r) => setTimeout(r, 100));
    const started = Date.now();
    const exits: number[] = [];
    const clean = await shutDown(server, { logger, startDraining: () => {}, drainDelayMs: 0, timeoutMs: 300, closeResources: async () => {}, exit: (c) => void exits.push(c) }, 'test');
    expect(clean).toBe(false);
    expect(Date.now() - started).toBeLessThan(3000);
    expect(await inFlight).toBe('cut off');
    expect(exits).toEqual([0]);
  });
});
