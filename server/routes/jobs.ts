import { Router } from 'express';
import { jobInput } from '../../features/jobs/schema';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { parseOr400 } from '../errors';
import { createJob, getJob, listJobs } from '../services/jobs';
import { idParam } from './params';

export function jobRoutes(db: Db): Router {
  const router = Router();
  const staff = requireMember('owner', 'designer', 'front_desk');

  router.get('/', staff, async (_req, res) => {
    res.json({ jobs: await listJobs(db, currentMember(res.locals).shopId) });
  });

  router.get('/:id', staff, async (req, res) => {
    const id = idParam(req.params.id, 'Job');
    res.json({ job: await getJob(db, currentMember(res.locals).shopId, id) });
  });

  router.post('/', staff, async (req, res) => {
    const input = parseOr400(jobInput, req.body);
    res.status(201).json({ job: await createJob(db, currentMember(res.locals).shopId, input) });
  });

  return router;
}
