import { Router } from 'express';
import { z } from 'zod';
import { customerInput } from '../../features/customers/schema';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { parseOr400 } from '../errors';
import { createCustomer, getCustomer, listCustomers } from '../services/customers';
import { idParam } from './params';

const listQuery = z.object({ q: z.string().max(200).optional() });

export function customerRoutes(db: Db): Router {
  const router = Router();
  const staff = requireMember('owner', 'designer', 'front_desk');

  router.get('/', staff, async (req, res) => {
    const { q } = parseOr400(listQuery, req.query);
    res.json({ customers: await listCustomers(db, currentMember(res.locals).shopId, q) });
  });

  router.get('/:id', staff, async (req, res) => {
    const id = idParam(req.params.id, 'Customer');
    res.json({ customer: await getCustomer(db, currentMember(res.locals).shopId, id) });
  });

  router.post('/', staff, async (req, res) => {
    const input = parseOr400(customerInput, req.body);
    res.status(201).json({ customer: await createCustomer(db, currentMember(res.locals).shopId, input) });
  });

  return router;
}
