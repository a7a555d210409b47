import { Router } from 'express';
import type { Db } from '../../db/client';
import { quoteBuildInput, quoteEditInput } from '../../features/quotes/schema';
import { currentMember, requireMember } from '../auth';
import { parseOr400 } from '../errors';
import { buildQuote, editQuote, listQuotes } from '../services/quotes';
import { idParam } from './params';

const staff = requireMember('owner', 'designer', 'front_desk');
const designers = requireMember('owner', 'designer');

/** The versions of a job's quote: /api/jobs/:jobId/quotes */
export function jobQuoteRoutes(db: Db): Router {
  const router = Router({ mergeParams: true });
  const jobIdOf = (params: unknown) => idParam((params as { jobId?: string }).jobId, 'Job');

  router.get('/', staff, async (req, res) => {
    res.json({ quotes: await listQuotes(db, currentMember(res.locals).shopId, jobIdOf(req.params)) });
  });

  router.post('/', designers, async (req, res) => {
    const jobId = jobIdOf(req.params);
    const member = currentMember(res.locals);
    const input = parseOr400(quoteBuildInput, req.body);
    res.status(201).json({ quote: await buildQuote(db, member.shopId, member.id, jobId, input) });
  });

  router.patch('/:quoteId', designers, async (req, res) => {
    const jobId = jobIdOf(req.params);
    const quoteId = idParam((req.params as { quoteId?: string }).quoteId, 'Quote');
    const input = parseOr400(quoteEditInput, req.body);
    res.json({ quote: await editQuote(db, currentMember(res.locals).shopId, jobId, quoteId, input) });
  });

  return router;
}
