import { Router, type Response } from 'express';
import { z } from 'zod';
import { cutFileQuery, cutReleaseInput, cutSheetQuery } from '../../features/exports/schema';
import type { Db } from '../../db/client';
import type { ComputePool } from '../compute/computePool';
import { currentMember, requireMember } from '../auth';
import { HttpError, parseOr400 } from '../errors';
import { approvedVersionOf, cutApprovalOf, releaseForCutting } from '../services/cutApproval';
import { cutSheetPage, exportCutFile, type ExportedFile } from '../services/exports';
import { createFrozenFileCache, type FrozenFileCache } from '../services/frozenFileCache';
import { getVersion } from '../services/layouts';
import { idParam } from './params';

// Cut files drive a blade: only the people who design layouts make them.
const designers = requireMember('owner', 'designer');
const versionNumber = z.coerce.number().int().min(1).max(100_000);

function versionParam(value: unknown): number {
  const parsed = versionNumber.safeParse(value);
  if (!parsed.success) throw new HttpError(404, 'not_found', 'Version was not found');
  return parsed.data;
}

function send(res: Response, file: ExportedFile, disposition: 'attachment' | 'inline') {
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', `${disposition}; filename="${file.filename}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.send(file.body);
}

/** Cut files and the printable cut sheet of a frozen version: /api/layouts/:id/versions/:number/... */
export function exportRoutes(db: Db, compute: ComputePool, files: FrozenFileCache = createFrozenFileCache()): Router {
  const router = Router();

  router.get('/:id/versions/:number/export', designers, async (req, res) => {
    const id = idParam(req.params.id, 'Layout');
    const number = versionParam(req.params.number);
    const query = parseOr400(cutFileQuery, req.query);
    const member = currentMember(res.locals);
    send(res, await exportCutFile(db, compute, files, member.shopId, member.id, id, number, query), 'attachment');
  });

  router.get('/:id/versions/:number/cut-sheet', designers, async (req, res) => {
    const id = idParam(req.params.id, 'Layout');
    const number = versionParam(req.params.number);
    const query = parseOr400(cutSheetQuery, req.query);
    const member = currentMember(res.locals);
    const file = await cutSheetPage(db, compute, files, member.shopId, member.id, id, number, query.profile);
    // The page is the shop's own text, escaped; it needs no scripts and loads nothing.
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'; img-src data:");
    send(res, file, 'inline');
  });

  router.get('/:id/versions/:number/approval', designers, async (req, res) => {
    const id = idParam(req.params.id, 'Layout');
    const number = versionParam(req.params.number);
    const shopId = currentMember(res.locals).shopId;
    await getVersion(db, shopId, id, number);
    const [approval, approvedVersion] = await Promise.all([cutApprovalOf(db, shopId, id, number), approvedVersionOf(db, shopId, id)]);
    res.json({ approval, approvedVersion: approvedVersion === number ? null : approvedVersion });
  });

  // Cutting without the customer's approval is the owner's call, with a reason that is logged and printed.
  router.post('/:id/versions/:number/release', requireMember('owner'), async (req, res) => {
    const id = idParam(req.params.id, 'Layout');
    const number = versionParam(req.params.number);
    const input = parseOr400(cutReleaseInput, req.body);
    const member = currentMember(res.locals);
    res.status(201).json({ approval: await releaseForCutting(db, member.shopId, member.id, id, number, input.reason), approvedVersion: null });
  });

  return router;
}
