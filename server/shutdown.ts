import type { Server } from 'node:http';
import type { Logger } from 'pino';

export interface ShutdownOptions {
  logger: Logger;
  /** Called first: /api/ready starts answering 503 so a load balancer stops sending work here. */
  startDraining(): void;
  /** How long to keep listening after /api/ready turns 503, for a load balancer to notice (0 in development). */
  drainDelayMs: number;
  /** Requests still running after this long are cut off and the process stops anyway. */
  timeoutMs: number;
  /** Closes the queue, image threads, mail, storage and database pool, in that order. */
  closeResources(): Promise<void>;
  exit?(code: number): void;
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Resolves when every connection has ended, or false after `ms`. */
function closeServer(server: Server, ms: number): Promise<boolean> {
  return new Promise((resolve) => {
    // Idle keep-alive connections would hold close() open: close each as soon as its answer is out.
    const sweep = setInterval(() => server.closeIdleConnections(), 50);
    const timer = setTimeout(() => {
      clearInterval(sweep);
      resolve(false);
    }, ms);
    server.close(() => {
      clearTimeout(timer);
      clearInterval(sweep);
      resolve(true);
    });
    server.closeIdleConnections();
  });
}

/**
 * A rolling restart's stop: the process stops taking work, lets requests in
 * flight finish within a time limit, then closes what it holds and exits.
 * Resolves with whether every request finished in time.
 */
export async function shutDown(server: Server, options: ShutdownOptions, reason: string): Promise<boolean> {
  const exit = options.exit ?? ((code: number) => process.exit(code));
  options.logger.info({ reason }, 'shutting down: finishing requests in flight');
  options.startDraining();
  await sleep(options.drainDelayMs);
  const clean = await closeServer(server, options.timeoutMs);
  if (!clean) {
    options.logger.warn({ timeoutMs: options.timeoutMs }, 'requests still running at the time limit were cut off');
    server.closeAllConnections();
  }
  await options.closeResources().catch((err: unknown) => options.logger.error({ err }, 'closing resources failed'));
  options.logger.info('stopped');
  exit(0);
  return clean;
}

/** `shutDown` on SIGTERM or SIGINT; a second signal exits at once. */
export function stopGracefullyOnSignals(server: Server, options: ShutdownOptions): void {
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return (options.exit ?? process.exit)(1);
    stopping = true;
    void shutDown(server, options, signal);
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}
