import { Router } from 'express';
import { customerInput, customerListQuery, customerUpdate } from '../../features/customers/schema';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { parseOr400 } from '../errors';
import { createCustomer, deleteCustomer, getCustomer, listCustomers, updateCustomer } from '../services/customers';
import { idParam } from './params';

export function customerRoutes(db: Db): Router {
  const router = Router();
  const staff = requireMember('owner', 'designer', 'front_desk');

  router.get('/', staff, async (req, res) => {
    const query = parseOr400(customerListQuery, req.query);
    res.json(await listCustomers(db, currentMember(res.locals).shopId, query));
  });

  router.get('/:id', staff, async (req, res) => {
    const id = idParam(req.params.id, 'Customer');
    res.json({ customer: await getCustomer(db, currentMember(res.locals).shopId, id) });
  });

  router.post('/', staff, async (req, res) => {
    const input = parseOr400(customerInput, req.body);
    res.status(201).json({ customer: await createCustomer(db, currentMember(res.locals).shopId, input) });
  });

  router.patch('/:id', staff, async (req, res) => {
    const id = idParam(req.params.id, 'Customer');
    const input = parseOr400(customerUpdate, req.body);
    res.json({ customer: await updateCustomer(db, currentMember(res.locals).shopId, id, input) });
  });

  router.delete('/:id', requireMember('owner', 'front_desk'), async (req, res) => {
    const id = idParam(req.params.id, 'Customer');
    await deleteCustomer(db, currentMember(res.locals).shopId, id);
    res.status(204).end();
  });

  return router;
}
