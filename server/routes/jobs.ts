import { Router } from 'express';
import { jobInput, jobListQuery, jobStatusChange, jobUpdate } from '../../features/jobs/schema';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { parseOr400 } from '../errors';
import { listActivity } from '../services/activity';
import { changeJobStatus, createJob, getJob, listJobs, updateJob } from '../services/jobs';
import { idParam } from './params';

export function jobRoutes(db: Db): Router {
  const router = Router();
  const staff = requireMember('owner', 'designer', 'front_desk');

  router.get('/', staff, async (req, res) => {
    const filters = parseOr400(jobListQuery, req.query);
    res.json(await listJobs(db, currentMember(res.locals).shopId, filters));
  });

  router.get('/:id', staff, async (req, res) => {
    const id = idParam(req.params.id, 'Job');
    res.json({ job: await getJob(db, currentMember(res.locals).shopId, id) });
  });

  router.post('/', staff, async (req, res) => {
    const input = parseOr400(jobInput, req.body);
    const member = currentMember(res.locals);
    res.status(201).json({ job: await createJob(db, member.shopId, member.id, input) });
  });

  router.patch('/:id', staff, async (req, res) => {
    const id = idParam(req.params.id, 'Job');
    const input = parseOr400(jobUpdate, req.body);
    const member = currentMember(res.locals);
    res.json({ job: await updateJob(db, member.shopId, member.id, id, input) });
  });

  router.post('/:id/status', staff, async (req, res) => {
    const id = idParam(req.params.id, 'Job');
    const input = parseOr400(jobStatusChange, req.body);
    const member = currentMember(res.locals);
    res.json({ job: await changeJobStatus(db, member.shopId, member, id, input) });
  });

  router.get('/:id/activity', staff, async (req, res) => {
    const id = idParam(req.params.id, 'Job');
    const shopId = currentMember(res.locals).shopId;
    await getJob(db, shopId, id);
    res.json({ activity: await listActivity(db, shopId, id) });
  });

  return router;
}
