import express, { Router, type ErrorRequestHandler, type Request, type RequestHandler, type Response } from 'express';
import zlib from 'node:zlib';
import type pg from 'pg';
import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import { proofDecisionInput } from '../../features/proofs/schema';
import { arrivalCommentInput } from '../../features/shipping/schema';
import type { ComputePool } from '../compute/computePool';
import { isDatabaseUnavailable, DB_RETRY_AFTER_S } from '../databaseErrors';
import { HttpError, parseOr400 } from '../errors';
import { receiveOptionalPhoto, receivePhoto } from '../routes/photos';
import { changesPhotoOf, proofLinkLimit, proofPageHeaders, type DecisionMail } from '../routes/proofs';
import { addArrivalPhoto, saveArrivalComment } from '../services/arrival';
import { mailProofDecision } from '../services/proofDecisionMail';
import { decideProof, openRow, viewProof } from '../services/proofs';
import type { ThrottleRules } from '../security/throttle';
import type { Storage } from '../storage/storage';
import type { FormProblem } from './answerSection';
import type { ArrivalDone } from './arrivalSection';
import type { ProofPageAssets } from './assets';
import { closedPage, messagePage, openProofPage, type PageExtras } from './page';

export interface ProofPageDeps {
  db: Db;
  storage: Storage;
  pool: pg.Pool;
  assets: ProofPageAssets;
  rules?: ThrottleRules;
  keyPrefix?: string;
  decisionMail?: DecisionMail;
  compute?: ComputePool;
  logger: Logger;
}

/**
 * Only this origin's files: the stylesheet, the zoom script, the font and the
 * photos served through the link. No inline script or style at all.
 */
const PAGE_CSP = "default-src 'none'; script-src 'self'; style-src 'self'; img-src 'self' data:; font-src 'self'; form-action 'self'; base-uri 'none'; frame-ancestors 'none'";

/** The form a request posts and what was typed in it, kept so a refused answer comes back filled in. */
interface Posted {
  form: FormProblem['form'];
  values: FormProblem['values'];
}

const tokenOf = (req: Request) => String(req.params.token ?? '');
const urlencoded = express.urlencoded({ extended: false, limit: '32kb', parameterLimit: 10 });
const textOf = (value: unknown) => (typeof value === 'string' ? value : '');

/** Brotli at a middle quality: a page of path data shrinks several times over in a few milliseconds. */
const BROTLI_PAGE = { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 5 } };

function sendPage(req: Request, res: Response, status: number, page: string) {
  const body = Buffer.from(page, 'utf8');
  res.status(status).type('html').vary('Accept-Encoding');
  const encoding = body.length > 1024 ? req.acceptsEncodings('br', 'gzip') : false;
  if (encoding === 'br' || encoding === 'gzip') {
    res.setHeader('Content-Encoding', encoding);
    res.send(encoding === 'br' ? zlib.brotliCompressSync(body, BROTLI_PAGE) : zlib.gzipSync(body));
    return;
  }
  res.send(body);
}

const see = (res: Response, token: string, query = '', fragment = 'answer') => res.redirect(303, `/proof/${encodeURIComponent(token)}${query}#${fragment}`);

/**
 * The customer's proof page, rendered on the server: GET shows it, the forms post
 * back to it and are answered with a redirect to it (post, redirect, get). The
 * same services, schemas, upload rules and attempt limits as /api/proofs/:token.
 * A cross-site form cannot post here without the link's secret, which is the
 * whole of the page's authority; `no-referrer` makes browsers send `Origin: null`,
 * so the API's origin check would refuse the page's own forms.
 */
export function proofPageRoutes(deps: ProofPageDeps): Router {
  const { db, storage, assets, compute } = deps;
  const router = Router();
  const limit = proofLinkLimit(deps.pool, deps.rules, deps.keyPrefix);
  const headers: RequestHandler = (req, res, next) => {
    // Kept for the error pages, which run outside the route and so without its params.
    res.locals.proofToken = tokenOf(req);
    res.setHeader('Content-Security-Policy', PAGE_CSP);
    proofPageHeaders(req, res, next);
  };

  router.get('/:token', headers, limit, async (req, res) => {
    const done = req.query.done === 'note' || req.query.done === 'photo' ? (req.query.done as ArrivalDone) : null;
    sendPage(req, res, 200, openProofPage(assets, tokenOf(req), await viewProof(db, tokenOf(req), compute), { arrivalDone: done }));
  });

  router.post('/:token', headers, limit, async (req, res) => {
    const token = tokenOf(req);
    let file: Express.Multer.File | null = null;
    if (req.is('multipart/form-data')) {
      // The link is checked before the body is read: nobody makes the server buffer a photo for a closed link.
      await openRow(db, token);
      res.locals.posted = { form: 'changes', values: {} } satisfies Posted;
      file = await receiveOptionalPhoto(req, res);
    } else {
      await new Promise<void>((resolve, reject) => urlencoded(req, res, (err?: unknown) => (err ? reject(err) : resolve())));
    }
    const body = (req.body ?? {}) as Record<string, unknown>;
    const form = body.decision === 'changes' ? 'changes' : 'approve';
    res.locals.posted = { form, values: { name: textOf(body.name), comment: textOf(body.comment) } } satisfies Posted;
    const input = parseOr400(proofDecisionInput, body);
    if (file && input.decision !== 'changes') throw new HttpError(400, 'invalid_input', 'A photo goes only with a request for changes', { photo: 'A photo goes only with a request for changes' });
    const { decided } = await decideProof(db, token, input, await changesPhotoOf(file, storage), compute);
    // The customer does not wait on the shop's mail server; a failure is logged and kept in the outbox.
    if (deps.decisionMail) void mailProofDecision(db, deps.decisionMail.mailer, deps.decisionMail.publicUrl, decided, req.log);
    see(res, token);
  });

  router.post('/:token/arrival', headers, limit, urlencoded, async (req, res) => {
    const token = tokenOf(req);
    const body = (req.body ?? {}) as Record<string, unknown>;
    res.locals.posted = { form: 'note', values: { comment: textOf(body.comment) } } satisfies Posted;
    const input = parseOr400(arrivalCommentInput, { comment: body.comment });
    await saveArrivalComment(db, token, input.comment);
    see(res, token, '?done=note', 'arrival-note');
  });

  router.post('/:token/arrival/photos', headers, limit, async (req, res) => {
    const token = tokenOf(req);
    // The link (and that the arrival page is open) is checked before the body is read.
    await viewProof(db, token);
    res.locals.posted = { form: 'photo', values: {} } satisfies Posted;
    const file = await receivePhoto(req, res);
    await addArrivalPhoto(db, storage, token, file.buffer);
    see(res, token, '?done=photo', 'arrival-photo');
  });

  router.use(pageErrors(deps));
  return router;
}

/** The fields each form shows a message beside; anything else is said above the form. */
const FORM_FIELDS: Record<FormProblem['form'], readonly string[]> = { approve: ['name'], changes: ['comment', 'photo'], note: ['comment'], photo: ['photo'] };

/** A refusal as the form's problem: beside its fields when the form has them (an upload's problem beside the photo), else above the form. */
function problemOf(err: HttpError, posted: Posted): FormProblem {
  const shown = FORM_FIELDS[posted.form];
  const fields = Object.fromEntries(Object.entries(err.fields ?? (shown.includes('photo') ? { photo: err.message } : {})).filter(([name]) => shown.includes(name)));
  const unshown = Object.entries(err.fields ?? {}).find(([name]) => !shown.includes(name))?.[1];
  const message = Object.keys(fields).length === 0 ? (unshown ?? err.message) : unshown;
  return { form: posted.form, fields, values: posted.values, ...(message ? { message } : {}) };
}

/** Every refusal as a page in plain words with the status the API would give; the closed link's page is one for all. */
function pageErrors(deps: ProofPageDeps): ErrorRequestHandler {
  return async (err, req, res, _next) => {
    const { assets } = deps;
    try {
      if (err instanceof HttpError && err.code === 'proof_closed') return sendPage(req, res, 404, closedPage(assets));
      if (err instanceof HttpError && err.retryAfterS !== undefined) {
        res.setHeader('Retry-After', String(err.retryAfterS));
        return sendPage(req, res, err.status, messagePage(assets, 'Too many attempts', `${err.message} Your link still works.`));
      }
      if (err?.type === 'entity.too.large' || err?.type === 'parameters.too.many') return sendPage(req, res, 413, messagePage(assets, 'That was too much to send', 'The form sent more than it needs. Go back and try again.'));
      if (err instanceof HttpError && err.status < 500) {
        const posted = res.locals.posted as Posted | undefined;
        const extras: PageExtras = posted && err.status !== 409 ? { problem: problemOf(err, posted) } : { notice: err.message };
        const token = String(res.locals.proofToken ?? '');
        return sendPage(req, res, err.status, openProofPage(assets, token, await viewProof(deps.db, token, deps.compute), extras));
      }
      throw err;
    } catch (failure) {
      if (failure instanceof HttpError && failure.code === 'proof_closed') return sendPage(req, res, 404, closedPage(assets));
      if (isDatabaseUnavailable(failure)) {
        res.setHeader('Retry-After', String(DB_RETRY_AFTER_S));
        return sendPage(req, res, 503, messagePage(assets, 'The page is resting', 'The shop’s system is not answering right now. Try again in a few seconds; your link still works.'));
      }
      (req.log ?? deps.logger).error({ err: failure }, 'the proof page failed');
      sendPage(req, res, 500, messagePage(assets, 'Something went wrong', 'Something went wrong on our side and it was logged. Try again in a minute; your link still works.'));
    }
  };
}
