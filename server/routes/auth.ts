import { Router } from 'express';
import { generateIdFromEntropySize } from 'lucia';
import { signInInput, signUpInput } from '../../features/auth/schema';
import { currentMember, requireMember, type Auth } from '../auth';
import type { Db } from '../../db/client';
import { parseOr400 } from '../errors';
import { checkPassword, createShopWithOwner, shopOf } from '../services/accounts';

export function authRoutes(db: Db, auth: Auth): Router {
  const router = Router();

  const startSession = async (memberId: string) => {
    const session = await auth.createSession(memberId, {});
    return auth.createSessionCookie(session.id).serialize();
  };

  router.post('/sign-up', async (req, res) => {
    const input = parseOr400(signUpInput, req.body);
    const memberId = await createShopWithOwner(db, input, () => generateIdFromEntropySize(10));
    res.append('Set-Cookie', await startSession(memberId)).status(201).json({ ok: true });
  });

  router.post('/sign-in', async (req, res) => {
    const input = parseOr400(signInInput, req.body);
    const memberId = await checkPassword(db, input.email, input.password);
    res.append('Set-Cookie', await startSession(memberId)).json({ ok: true });
  });

  router.post('/sign-out', async (_req, res) => {
    if (res.locals.session) await auth.invalidateSession(res.locals.session.id);
    res.append('Set-Cookie', auth.createBlankSessionCookie().serialize()).json({ ok: true });
  });

  router.get('/me', requireMember(), async (_req, res) => {
    const user = currentMember(res.locals);
    const shop = await shopOf(db, user.shopId);
    res.json({
      member: { id: user.id, name: user.name, email: user.email, role: user.role },
      shop: { id: shop.id, name: shop.name },
    });
  });

  return router;
}
