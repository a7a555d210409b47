import { Router } from 'express';
import { pieceInput, piecePatch } from '../../features/pieces/schema';
import type { Db } from '../../db/client';
import { currentMember, requireMember } from '../auth';
import { parseOr400 } from '../errors';
import { createPiece, deletePiece, getPiece, listPieces, updatePiece, type PieceScope } from '../services/pieces';
import type { Storage } from '../storage/storage';
import { idParam } from './params';

/** A job's pieces; mounted at /jobs/:jobId/pieces. Every staff role may manage them. */
export function pieceRoutes(db: Db, storage: Storage): Router {
  const router = Router({ mergeParams: true });
  const staff = requireMember('owner', 'designer', 'front_desk');

  const scopeOf = (params: Record<string, unknown>, shopId: string): PieceScope => ({
    shopId,
    jobId: idParam(params.jobId, 'Job'),
  });

  router.get('/', staff, async (req, res) => {
    const scope = scopeOf(req.params, currentMember(res.locals).shopId);
    res.json({ pieces: await listPieces(db, scope) });
  });

  router.get('/:pieceId', staff, async (req, res) => {
    const scope = scopeOf(req.params, currentMember(res.locals).shopId);
    res.json({ piece: await getPiece(db, scope, idParam(req.params.pieceId, 'Piece')) });
  });

  router.post('/', staff, async (req, res) => {
    const member = currentMember(res.locals);
    const scope = scopeOf(req.params, member.shopId);
    const input = parseOr400(pieceInput, req.body);
    res.status(201).json({ piece: await createPiece(db, scope, member.id, input) });
  });

  router.patch('/:pieceId', staff, async (req, res) => {
    const scope = scopeOf(req.params, currentMember(res.locals).shopId);
    const pieceId = idParam(req.params.pieceId, 'Piece');
    const changes = parseOr400(piecePatch, req.body);
    res.json({ piece: await updatePiece(db, scope, pieceId, changes) });
  });

  router.delete('/:pieceId', staff, async (req, res) => {
    const member = currentMember(res.locals);
    const scope = scopeOf(req.params, member.shopId);
    await deletePiece(db, storage, scope, idParam(req.params.pieceId, 'Piece'), member.id);
    res.status(204).end();
  });

  return router;
}
