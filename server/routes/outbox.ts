import { Router } from 'express';
import { outboxQuery } from '../../features/outbox/schema';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { parseOr400 } from '../errors';
import { listOutbox, readOutboxMessage } from '../mail/outbox';
import { idParam } from './params';

/** The shop's sent mail; every member may read it. */
export function outboxRoutes(db: Db): Router {
  const router = Router();
  const anyMember = requireMember();

  router.get('/', anyMember, async (req, res) => {
    const page = parseOr400(outboxQuery, req.query);
    res.json(await listOutbox(db, currentMember(res.locals).shopId, page));
  });

  router.get('/:id', anyMember, async (req, res) => {
    const id = idParam(req.params.id, 'Message');
    const me = currentMember(res.locals);
    res.json({ message: await readOutboxMessage(db, me.shopId, id, me.role) });
  });

  return router;
}
