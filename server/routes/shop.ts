import { eq } from 'drizzle-orm';
import { Router } from 'express';
import { shopRenameInput } from '../../features/auth/schema';
import { currentMember, requireMember } from '../auth';
import type { Db } from '../../db/client';
import { shops } from '../../db/schema';
import { parseOr400 } from '../errors';

export function shopRoutes(db: Db): Router {
  const router = Router();

  router.patch('/', requireMember('owner'), async (req, res) => {
    const input = parseOr400(shopRenameInput, req.body);
    const shopId = currentMember(res.locals).shopId;
    const [shop] = await db.update(shops).set({ name: input.name }).where(eq(shops.id, shopId)).returning();
    res.json({ shop: { id: shop!.id, name: shop!.name } });
  });

  return router;
}
