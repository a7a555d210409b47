import express, { Router, type Request } from 'express';
import { z } from 'zod';
import { freezeInput, layoutCreateInput } from '../../features/layouts/schema';
import { starterLayout } from '../../features/layouts/starter';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { HttpError, parseOr400 } from '../errors';
import type { ComputePool } from '../compute/computePool';
import { readDraftSave, readDraftSaveText, type DraftSaveRead } from '../compute/draftSave';
import { sql } from 'drizzle-orm';
import type { BoardPoint } from '../../geometry';
import { OutlineCache, refsInText } from '../services/draftOutlines';
import { notFound } from '../errors';
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

/**
 * The point lists a draft save keeps by name, from this process's cache or
 * else from the draft being saved (only that layout's, only this shop's).
 * A name found in neither is left out; the read then refuses it.
 */
async function listsNamed(db: Db, cache: OutlineCache, shopId: string, layoutId: string, refs: readonly string[]) {
  const lists = new Map<string, readonly BoardPoint[]>();
  const missing: string[] = [];
  for (const ref of refs) {
    const found = cache.get(shopId, ref);
    if (found) lists.set(ref, found);
    else missing.push(ref);
  }
  if (missing.length === 0) return lists;
  const stored = await db.execute<{ key: string; value: unknown }>(
    sql`SELECT e.key, e.value FROM layouts, jsonb_each(layouts.draft_outlines) e WHERE layouts.shop_id = ${shopId} AND layouts.id = ${layoutId} AND e.key = ANY(${sql.param(missing)}::text[])`,
  );
  for (const { key, value } of stored.rows) {
    const points = cache.admit(shopId, key, value);
    if (points) lists.set(key, points);
  }
  if (lists.size < refs.length) {
    const [layout] = await db.execute(sql`SELECT 1 FROM layouts WHERE shop_id = ${shopId} AND id = ${layoutId}`).then((r) => r.rows);
    if (!layout) throw notFound('Layout');
  }
  return lists;
}

/** The draft save in the request, read on a compute thread when its text is large. */
async function readDraft(body: unknown, compute: ComputePool | undefined, lists: () => Promise<Map<string, readonly BoardPoint[]>>): Promise<DraftSaveRead> {
  // Not JSON at all (another content type): the schema's 400 names what is missing.
  if (typeof body !== 'string') return readDraftSave(body);
  const kept = await lists();
  if (compute && body.length > LARGE_LAYOUT_BYTES) return compute.run({ kind: 'draftSave', text: body, lists: [...kept] });
  return readDraftSaveText(body, kept);
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
  const outlines = new OutlineCache();

  router.get('/:id', staff, async (req, res) => {
    res.json(await getLayout(db, currentMember(res.locals).shopId, idParam(req.params.id, 'Layout')));
  });

  router.put('/:id/draft', designers, async (req, res) => {
    const id = idParam(req.params.id, 'Layout');
    const member = currentMember(res.locals);
    const text = req.body;
    const draft = await readDraft(text, compute, async () => (typeof text === 'string' ? listsNamed(db, outlines, member.shopId, id, refsInText(text)) : new Map()));
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
