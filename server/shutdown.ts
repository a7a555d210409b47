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
    const timer = setTimeout(() => resolve(false), ms);
    server.close(() => {
      clearTimeout(timer);
      resolve(true);
    });
    // Idle keep-alive connections would hold close() open; busy ones get "Connection: close" on their answer.
    server.closeIdleConnections();
  });
}

/**
 * A rolling restart's stop: on SIGTERM (or SIGINT) the process stops taking
 * work, lets requests in flight finish within a time limit, then closes what
 * it holds and exits. A second signal exits at once.
 */
export function stopGracefullyOnSignals(server: Server, options: ShutdownOptions): void {
  const exit = options.exit ?? ((code: number) => process.exit(code));
  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return exit(1);
    stopping = true;
    options.logger.info({ signal }, 'shutting down: finishing requests in flight');
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
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}
