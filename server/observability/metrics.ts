import type { Express, NextFunction, Request, RequestHandler, Response } from 'express';
import { timingSafeEqual } from 'node:crypto';
import { collectDefaultMetrics, Gauge, Histogram, Registry } from 'prom-client';
import { HttpError } from '../errors';
import { jobDuration } from './jobMetrics';
import { routeLabeller } from './routeTemplates';

export interface MetricsOptions {
  /** Bearer token a scraper must send; without one the endpoint does not exist (404). */
  token?: string;
  /** Jobs waiting in the queue right now, read from Postgres on each scrape. */
  queueDepth?: () => Promise<number>;
}

export interface AppMetrics {
  registry: Registry;
  /** Times every request by method, route template and status. */
  timeRequests(app: Express): RequestHandler;
  /** GET /api/metrics in Prometheus' text format, behind the token. */
  endpoint: RequestHandler;
}

/** Whether an Authorization header carries exactly `Bearer <token>`, compared in constant time. */
export function bearerMatches(header: string | undefined, token: string): boolean {
  const a = Buffer.from(/^Bearer (.+)$/.exec(header ?? '')?.[1] ?? '');
  const b = Buffer.from(token);
  return a.length === b.length && timingSafeEqual(a, b);
}

function queueDepthGauge(registry: Registry, queueDepth: MetricsOptions['queueDepth']) {
  new Gauge({
    name: 'matwright_queue_depth',
    help: 'Background jobs waiting to be taken (tracing queue)',
    registers: [registry],
    async collect() {
      if (!queueDepth) return;
      this.set(await queueDepth().catch(() => Number.NaN));
    },
  });
}

/** A registry of this app: request durations, queue depth, job durations and Node's own process figures. */
export function createMetrics(options: MetricsOptions): AppMetrics {
  const registry = new Registry();
  collectDefaultMetrics({ register: registry });
  registry.registerMetric(jobDuration);
  queueDepthGauge(registry, options.queueDepth);
  const requestDuration = new Histogram({
    name: 'matwright_http_request_duration_seconds',
    help: 'Time from a request arriving to its response finishing, by method, route template and status',
    labelNames: ['method', 'route', 'status'] as const,
    buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
    registers: [registry],
  });

  return {
    registry,
    timeRequests(app) {
      const label = routeLabeller(app);
      return (req: Request, res: Response, next: NextFunction) => {
        const stop = requestDuration.startTimer();
        // originalUrl: a nested router leaves req.url shortened when its handler answers without calling next().
        const path = req.originalUrl.split('?')[0] ?? '/';
        res.on('finish', () => stop({ method: req.method, route: label(req.method, path), status: String(res.statusCode) }));
        next();
      };
    },
    async endpoint(req, res) {
      if (!options.token) throw new HttpError(404, 'no_such_route', `There is no API route ${req.method} ${req.path}`);
      if (!bearerMatches(req.get('authorization'), options.token)) {
        res.setHeader('WWW-Authenticate', 'Bearer realm="metrics"');
        throw new HttpError(401, 'metrics_token', 'Send the metrics token as "Authorization: Bearer <token>"');
      }
      res.set({ 'Content-Type': registry.contentType, 'Cache-Control': 'no-store' });
      res.send(await registry.metrics());
    },
  };
}
