import { Router, type Request } from 'express';
import { generateIdFromEntropySize } from 'lucia';
import { passwordChangeInput, signInInput, signUpInput } from '../../features/auth/schema';
import { currentMember, requireMember, startSession, type Auth } from '../auth';
import type { Db } from '../../db/client';
import { parseOr400 } from '../errors';
import { requireStrongPassword } from '../security/passwordPolicy';
import type { Throttles } from '../security/throttle';
import { changePassword, checkPassword, createShopWithOwner, shopOf } from '../services/accounts';

/** The client's address as Express sees it (proxies on loopback are trusted for X-Forwarded-For). */
export const clientAddress = (req: Request) => req.ip ?? req.socket.remoteAddress ?? 'unknown';

export function authRoutes(db: Db, auth: Auth, throttles: Throttles): Router {
  const router = Router();

  router.post('/sign-up', async (req, res) => {
    const input = parseOr400(signUpInput, req.body);
    await throttles.signUp.attempt(input.email, clientAddress(req));
    requireStrongPassword(input.password, input);
    const memberId = await createShopWithOwner(db, input, () => generateIdFromEntropySize(10));
    res.append('Set-Cookie', await startSession(auth, memberId)).status(201).json({ ok: true });
  });

  router.post('/sign-in', async (req, res) => {
    const input = parseOr400(signInInput, req.body);
    await throttles.signIn.attempt(input.email, clientAddress(req));
    const memberId = await checkPassword(db, input.email, input.password);
    await throttles.signIn.succeeded(input.email);
    res.append('Set-Cookie', await startSession(auth, memberId)).json({ ok: true });
  });

  router.post('/sign-out', async (_req, res) => {
    if (res.locals.session) await auth.invalidateSession(res.locals.session.id);
    res.append('Set-Cookie', auth.createBlankSessionCookie().serialize()).json({ ok: true });
  });

  // Ends every session of this member, this browser's included: for a lost phone or a shared computer.
  router.post('/sign-out-everywhere', requireMember(), async (_req, res) => {
    await auth.invalidateUserSessions(currentMember(res.locals).id);
    res.append('Set-Cookie', auth.createBlankSessionCookie().serialize()).json({ ok: true });
  });

  router.post('/password', requireMember(), async (req, res) => {
    const input = parseOr400(passwordChangeInput, req.body);
    const me = currentMember(res.locals);
    await throttles.passwordChange.attempt(me.id, clientAddress(req));
    requireStrongPassword(input.newPassword, { email: me.email, name: me.name }, 'newPassword');
    await changePassword(db, me.id, res.locals.session!.id, input.currentPassword, input.newPassword);
    await throttles.passwordChange.succeeded(me.id);
    res.json({ ok: true });
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
