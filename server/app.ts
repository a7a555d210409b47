import express, { type Express } from 'express';
import fs from 'node:fs';
import path from 'node:path';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Db } from '../db/client';
import { type Auth, createAuth, sameOriginOnly, SESSION_ABSOLUTE_LIFETIME_MS, sessionMiddleware } from './auth';
import { apiNotFound, errorHandler } from './errors';
import { httpLogSerializers } from './logger';
import { healthRoutes } from './routes/health';
import { createMetrics } from './observability/metrics';
import { requestIdFor } from './requestIds';
import { securityHeaders } from './security/headers';
import { createCredentialThrottles, type ThrottleOptions, type ThrottleRules } from './security/throttle';
import { authRoutes } from './routes/auth';
import { customerRoutes } from './routes/customers';
import { jobRoutes } from './routes/jobs';
import { photoRoutes } from './routes/photos';
import { pieceRoutes } from './routes/pieces';
import { draftSaveBody, jobLayoutRoutes, layoutRoutes } from './routes/layouts';
import { exportRoutes } from './routes/exports';
import { localMailer, type Mailer } from './mail/mailer';
import { invitationRoutes, memberRoutes } from './routes/members';
import { outboxRoutes } from './routes/outbox';
import { jobPaymentRoutes, paymentWebhookRoutes } from './routes/payments';
import type { PaymentsProvider } from './payments/provider';
import { jobProofRoutes, publicProofRoutes } from './routes/proofs';
import { proofPageAssets } from './proofPage/assets';
import { proofPageRoutes } from './proofPage/proofPageRoutes';
import { jobQuoteRoutes } from './routes/quotes';
import { settingsRoutes } from './routes/settings';
import { jobShippingRoutes } from './routes/shipping';
import { shopRoutes } from './routes/shop';
import { traceRoutes, type TracingDeps } from './routes/traces';
import { DEFAULT_STORAGE_DIR, localFolderStorage } from './storage/localFolderStorage';
import type { Storage } from './storage/storage';
import { firstRequests } from '../features/api/firstRequests';
import { webBuild } from './webAssets';
import { inlineCompute, type ComputePool } from './compute/computePool';
import type { PageDrawer } from './pages/pageDrawer';

export interface AppDeps {
  db: Db;
  logger: Logger;
  /** Folder of the exported web build; the API still works when it is missing. */
  webDir?: string;
  /** Draws signed-in pages with their data on a thread (main.ts gives one; its owner closes it); without it the build's pages go as they are. */
  pageDrawer?: PageDrawer | null;
  /** Where photos are kept; defaults to the folder STORAGE_DIR names, outside the web build. */
  storage?: Storage;
  /** Sends the shop's mail; defaults to an in-process SMTP fake so nothing leaves the machine. */
  mailer?: Mailer;
  /**
   * Where people reach the app, e.g. https://frames.example: links in e-mail start with it,
   * and an https address turns on HSTS and Secure cookies. Never taken from a request.
   */
  publicUrl: string;
  /** Limits of the sign-in, sign-up, join and password forms; defaults in security/throttle.ts. */
  throttle?: ThrottleOptions;
  /** A session ends this long after sign-in (default 30 days), beside lucia's sliding expiry. */
  sessionAbsoluteLifetimeMs?: number;
  /** Limits of a proof link (per link and per address); defaults in routes/proofs.ts. */
  proofThrottle?: ThrottleRules;
  /**
   * Threads for cut files, cut sheets, the checks at freeze and large layout documents
   * (main.ts gives one; its owner closes it). Without one the same tasks run in-process.
   */
  compute?: ComputePool;
  /** The tracing queue and image threads; without them the tracing routes answer 503. */
  tracing?: TracingDeps;
  /** The payment provider's SDK, webhook secret and currency; without it online payments answer 503. */
  payments?: PaymentsProvider;
  /** The currency of manual payments when online ones are off (default usd). */
  paymentCurrency?: string;
  /** Limits of the provider's webhook (per address and in all); defaults in routes/payments.ts. */
  paymentWebhookThrottle?: ThrottleRules;
  /** Bearer token for GET /api/metrics (METRICS_TOKEN); without it that route answers 404. */
  metricsToken?: string;
  /** Set while the process shuts down: /api/ready answers 503 so a load balancer stops sending work. */
  draining?: () => boolean;
}

/** Builds the whole HTTP app (API and web build) without listening, so tests can make their own. */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  const https = new URL(deps.publicUrl).protocol === 'https:';
  const storage = deps.storage ?? localFolderStorage(process.env.STORAGE_DIR || DEFAULT_STORAGE_DIR);
  const metrics = createMetrics({ token: deps.metricsToken, queueDepth: deps.tracing?.queue.depth });
  app.use(securityHeaders(https, storage.downloadOrigins));
  app.use(
    pinoHttp({
      logger: deps.logger,
      serializers: httpLogSerializers,
      genReqId: requestIdFor,
      // Lines logged through req.log carry only the request's id, not the whole request again.
      quietReqLogger: true,
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
    }),
  );
  app.use(metrics.timeRequests(app));
  // While shutting down, every answer closes its connection so keep-alive clients reconnect elsewhere.
  app.use((_req, res, next) => {
    if (deps.draining?.()) res.setHeader('Connection', 'close');
    next();
  });

  const auth = createAuth(deps.db, https);
  const throttles = createCredentialThrottles(deps.db.$client, deps.throttle);
  const mailer = deps.mailer ?? localMailer(deps.db);
  const compute = deps.compute ?? inlineCompute();
  app.locals.compute = compute;
  const api = express.Router();
  // Before sessions: a monitor's probe needs no cookie, and liveness must not wait on the database.
  api.use(healthRoutes(deps.db, deps.draining));
  api.get('/metrics', metrics.endpoint);
  const payments = { db: deps.db, mailer, logger: deps.logger, publicUrl: deps.publicUrl, provider: deps.payments, currency: deps.payments?.currency ?? deps.paymentCurrency ?? 'usd' };
  // Before the JSON parser and sessions: the provider signs the exact bytes it sends, and has no cookie.
  api.use('/payments', paymentWebhookRoutes({ ...payments, rules: deps.paymentWebhookThrottle, keyPrefix: deps.throttle?.keyPrefix }));
  // A draft save's body stays text for the route, which reads it in one pass (off the event loop when large).
  api.put('/layouts/:id/draft', draftSaveBody);
  api.use(express.json({ limit: '5mb' }));
  api.use(sameOriginOnly);
  api.use(sessionMiddleware(auth, deps.sessionAbsoluteLifetimeMs ?? SESSION_ABSOLUTE_LIFETIME_MS));
  api.use('/auth', authRoutes(deps.db, auth, throttles));
  api.use('/shop', shopRoutes(deps.db));
  api.use('/customers', customerRoutes(deps.db));
  api.use('/jobs/:jobId/layouts', jobLayoutRoutes(deps.db, compute));
  api.use('/jobs/:jobId/pieces', pieceRoutes(deps.db, storage));
  api.use('/jobs/:jobId/proofs', jobProofRoutes(deps.db, mailer, deps.publicUrl, storage, compute));
  api.use('/jobs/:jobId/quotes', jobQuoteRoutes(deps.db));
  api.use('/jobs/:jobId/payments', jobPaymentRoutes(payments));
  api.use('/jobs/:jobId', jobShippingRoutes(deps.db, storage, mailer, deps.publicUrl));
  api.use('/jobs', jobRoutes(deps.db));
  api.use('/proofs', publicProofRoutes(deps.db, storage, deps.db.$client, deps.proofThrottle, deps.throttle?.keyPrefix, { mailer, publicUrl: deps.publicUrl }, compute));
  api.use(traceRoutes(deps.db, storage, deps.tracing));
  api.use(photoRoutes(deps.db, storage, deps.tracing ? heicConverter(deps.tracing) : undefined));
  api.use('/layouts', layoutRoutes(deps.db, compute));
  api.use('/layouts', exportRoutes(deps.db, compute));
  api.use('/members', memberRoutes(deps.db, mailer, deps.publicUrl));
  api.use('/invitations', invitationRoutes(deps.db, auth, throttles.joinInvitation));
  api.use('/outbox', outboxRoutes(deps.db));
  api.use('/settings', settingsRoutes(deps.db));
  api.use(apiNotFound);
  app.use('/api', api);

  // The customer's proof page is HTML made here, with its own small files: it never loads the app.
  const pageAssets = proofPageAssets();
  app.use(pageAssets.router);
  app.use(
    '/proof',
    proofPageRoutes({
      db: deps.db, storage, pool: deps.db.$client, assets: pageAssets, rules: deps.proofThrottle, keyPrefix: deps.throttle?.keyPrefix,
      decisionMail: { mailer, publicUrl: deps.publicUrl }, compute, logger: deps.logger,
    }),
  );

  if (deps.webDir && fs.existsSync(path.join(deps.webDir, 'index.html'))) serveWeb(app, deps.webDir, auth, deps.pageDrawer);
  app.use(errorHandler(deps.logger));
  return app;
}

/** HEIC to JPEG on the image threads; an undecodable HEIC comes back as null and is refused as before. */
function heicConverter(tracing: TracingDeps) {
  return async (bytes: Buffer) => {
    const out = await tracing.pool.heicToJpeg(new Uint8Array(bytes)).catch(() => null);
    return out?.ok && out.kind === 'heicToJpeg' ? Buffer.from(out.jpeg) : null;
  };
}

/** Static files of the export (pre-compressed, hashed ones cached a year), and each route's pre-rendered page. */
function serveWeb(app: Express, webDir: string, auth: Auth, drawer: PageDrawer | null | undefined) {
  // A visitor with a session cookie gets the page's first API reads preloaded; one
  // without would only be sent to sign in, so nothing is fetched for them.
  const build = webBuild(webDir, {
    preloadsFor: (req) => (auth.readSessionCookie(req.headers.cookie ?? '') ? firstRequests(req.path, new Date()) : []),
    drawPage: drawer ? async (req, file, encoding) => (auth.readSessionCookie(req.headers.cookie ?? '') ? drawer.draw(req, file, encoding) : null) : undefined,
  });
  if (drawer) app.get(drawer.afterPaintPath, (_req, res) => drawer.sendAfterPaint(res));
  app.use(build.assets);
  // Not a '/{*splat}' route: that would decode the path as a parameter first, and a malformed
  // escape would fail there instead of reaching the not-found page.
  app.use((req, res, next) => (req.method === 'GET' || req.method === 'HEAD' ? build.sendPage(req, res).catch(next) : next()));
}
