import http from 'node:http';
import type { AddressInfo } from 'node:net';

/**
 * A small round-robin load balancer for the restart benchmark, behaving like
 * the usual ones (nginx's `proxy_next_upstream error`, a cloud balancer's
 * health checks): it polls each backend's /api/ready, sends work only to
 * backends that answered ready, and when a connection is refused (the request
 * never reached a process) tries the next backend. A request that reached a
 * process and then failed is NOT retried: it is counted as failed.
 */
export interface Backend {
  name: string;
  port: number;
  up: boolean;
}

export interface BalancerStats {
  forwarded: number;
  refusedThenRetried: number;
}

const HEALTH_INTERVAL_MS = 150;

function forward(backend: Backend, req: http.IncomingMessage, body: Buffer): Promise<http.IncomingMessage> {
  return new Promise((resolve, reject) => {
    const upstream = http.request(
      // No keep-alive towards the backends: a fresh connection per request never races a closing idle socket.
      { host: '127.0.0.1', port: backend.port, method: req.method, path: req.url, headers: { ...req.headers, connection: 'close' }, agent: false },
      resolve,
    );
    upstream.on('error', reject);
    upstream.end(body);
  });
}

function pollHealth(backends: Backend[]): NodeJS.Timeout {
  return setInterval(() => {
    for (const b of backends) {
      const probe = http.get({ host: '127.0.0.1', port: b.port, path: '/api/ready', agent: false, timeout: 1000 }, (res) => {
        b.up = res.statusCode === 200;
        res.resume();
      });
      probe.on('error', () => (b.up = false));
      probe.on('timeout', () => probe.destroy());
    }
  }, HEALTH_INTERVAL_MS);
}

export async function startLoadBalancer(backends: Backend[]): Promise<{ url: string; stats: BalancerStats; close(): Promise<void> }> {
  const stats: BalancerStats = { forwarded: 0, refusedThenRetried: 0 };
  let next = 0;
  const pick = (avoid: Set<Backend>) => {
    for (let i = 0; i < backends.length; i++) {
      const b = backends[(next + i) % backends.length]!;
      if (b.up && !avoid.has(b)) {
        next = (next + i + 1) % backends.length;
        return b;
      }
    }
    return backends.find((b) => !avoid.has(b)) ?? null;
  };
  const server = http.createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const chunk of req) chunks.push(chunk as Buffer);
    const body = Buffer.concat(chunks);
    const tried = new Set<Backend>();
    for (let attempt = 0; attempt < 6; attempt++) {
      const backend = pick(tried) ?? pick(new Set());
      if (!backend) break;
      try {
        const answer = await forward(backend, req, body);
        stats.forwarded += 1;
        res.writeHead(answer.statusCode ?? 502, answer.headers);
        answer.pipe(res);
        return;
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== 'ECONNREFUSED') break;
        backend.up = false;
        tried.add(backend);
        stats.refusedThenRetried += 1;
        if (tried.size >= backends.length) {
          tried.clear();
          await new Promise((r) => setTimeout(r, 100));
        }
      }
    }
    res.writeHead(502, { 'Content-Type': 'application/json' }).end('{"error":{"code":"bad_gateway","message":"no backend answered"}}');
  });
  const timer = pollHealth(backends);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    stats,
    close: async () => {
      clearInterval(timer);
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
    },
  };
}
