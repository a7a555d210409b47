import express, { Router, type Request } from 'express';
import { z } from 'zod';
import { freezeInput, layoutCreateInput } from '../../features/layouts/schema';
import { starterLayout } from '../../features/layouts/starter';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { HttpError, parseOr400 } from '../errors';
import type { ComputePool } from '../compute/computePool';
import { readDraftSave, readDraftSaveText, type DraftSaveRead } from '../compute/draftSave';
import { createLayout, freezeVersion, getLayout, getVersion, listLayouts, saveDraft, type LayoutWork } from '../services/layouts';
import { getShopSettings } from '../services/settings';
import { idParam } from './params';

const staff = requireMember('owner', 'designer', 'front_desk');
// Front desk reads layouts to talk them through with customers but does not change them.
const designers = requireMember('owner', 'designer');
const versionNumber = z.coerce.number().int().min(1).max(100_000);

/** Above this many bytes of JSON a layout is parsed on a compute thread (a 2 000-point garment is about 90 KB). */
const LARGE_LAYOUT_BYTES = 32 * 1024;

/**
 * A draft save's body as text, mounted before the JSON parser: the whole read
 * (JSON, schema, layout) happens in one pass, on a compute thread when large.
 * The same size limit as every other JSON body.
 */
export const draftSaveBody = express.text({ type: 'application/json', limit: '5mb' });

/** The draft save in the request, read on a compute thread when its text is large. */
function readDraft(body: unknown, compute: ComputePool | undefined): Promise<DraftSaveRead> | DraftSaveRead {
  // Not JSON at all (another content type): the schema's 400 names what is missing.
  if (typeof body !== 'string') return readDraftSave(body);
  if (compute && body.length > LARGE_LAYOUT_BYTES) return compute.run({ kind: 'draftSave', text: body });
  return readDraftSaveText(body);
}

function layoutWork(req: Request, compute: ComputePool | undefined): LayoutWork {
  return { compute, large: Number(req.headers['content-length'] ?? 0) > LARGE_LAYOUT_BYTES };
}

/** Layouts of one job: /api/jobs/:jobId/layouts */
export function jobLayoutRoutes(db: Db, compute?: ComputePool): Router {
  const router = Router({ mergeParams: true });

  router.get('/', staff, async (req, res) => {
    const jobId = idParam((req.params as { jobId?: string }).jobId, 'Job');
    res.json({ layouts: await listLayouts(db, currentMember(res.locals).shopId, jobId) });
  });

  router.post('/', designers, async (req, res) => {
    const jobId = idParam((req.params as { jobId?: string }).jobId, 'Job');
    const input = parseOr400(layoutCreateInput, req.body);
    const member = currentMember(res.locals);
    const document = input.document ?? starterLayout(await getShopSettings(db, member.shopId));
    res.status(201).json(await createLayout(db, member.shopId, member.id, jobId, input.name, document, layoutWork(req, compute)));
  });

  return router;
}

/** One layout, its draft and its frozen versions: /api/layouts/:id */
export function layoutRoutes(db: Db, compute?: ComputePool): Router {
  const router = Router();

  router.get('/:id', staff, async (req, res) => {
    res.json(await getLayout(db, currentMember(res.locals).shopId, idParam(req.params.id, 'Layout')));
  });

  router.put('/:id/draft', designers, async (req, res) => {
    const id = idParam(req.params.id, 'Layout');
    const draft = await readDraft(req.body, compute);
    const member = currentMember(res.locals);
    res.json(await saveDraft(db, member.shopId, member.id, id, draft));
  });

  router.post('/:id/versions', designers, async (req, res) => {
    const id = idParam(req.params.id, 'Layout');
    const input = parseOr400(freezeInput, req.body);
    const member = currentMember(res.locals);
    res.status(201).json(await freezeVersion(db, member.shopId, member.id, id, input.baseRevision, input.note, compute));
  });

  router.get('/:id/versions/:number', staff, async (req, res) => {
    const id = idParam(req.params.id, 'Layout');
    const number = versionNumber.safeParse(req.params.number);
    if (!number.success) throw new HttpError(404, 'not_found', 'Version was not found');
    res.json({ version: await getVersion(db, currentMember(res.locals).shopId, id, number.data) });
  });

  return router;
}
