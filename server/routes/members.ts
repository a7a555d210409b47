import { Router } from 'express';
import { generateIdFromEntropySize } from 'lucia';
import { acceptInvitationInput, inviteInput, roleChangeInput } from '../../features/members/schema';
import { currentMember, requireMember, startSession, type Auth } from '../auth';
import type { Db } from '../../db/client';
import { HttpError, parseOr400 } from '../errors';
import type { Mailer } from '../mail/mailer';
import { acceptInvitation, inviteMember, listInvitations, previewInvitation, revokeInvitation } from '../services/invitations';
import { changeRole, listTeam, removeMember } from '../services/members';
import { requireStrongPassword } from '../security/passwordPolicy';
import type { Throttle } from '../security/throttle';
import { clientAddress } from './auth';
import { idParam } from './params';

/** Member ids are lucia's lower-case base32; anything else cannot name a member. */
function memberIdParam(value: unknown): string {
  if (typeof value !== 'string' || !/^[a-z0-9]{1,64}$/.test(value)) throw new HttpError(404, 'not_found', 'Member was not found');
  return value;
}

/** The secret in a join link: 32 bytes in base64url. */
function secretParam(value: unknown): string {
  if (typeof value !== 'string' || !/^[A-Za-z0-9_-]{43}$/.test(value)) {
    throw new HttpError(404, 'invitation_not_found', 'This invitation link is not valid; ask the shop owner for a new one');
  }
  return value;
}

/**
 * Everyone on the team may see who is on it; only owners change it. Links in
 * invitations start with `publicUrl`, never with a request's Host header, which
 * anyone can set.
 */
export function memberRoutes(db: Db, mailer: Mailer, publicUrl: string): Router {
  const router = Router();
  const owner = requireMember('owner');

  router.get('/', requireMember(), async (_req, res) => {
    res.json({ members: await listTeam(db, currentMember(res.locals).shopId) });
  });

  router.get('/invitations', owner, async (_req, res) => {
    res.json({ invitations: await listInvitations(db, currentMember(res.locals).shopId) });
  });

  router.post('/invitations', owner, async (req, res) => {
    const input = parseOr400(inviteInput, req.body);
    const me = currentMember(res.locals);
    const invitation = await inviteMember(db, mailer, { ...input, shopId: me.shopId, invitedBy: { id: me.id, name: me.name }, origin: publicUrl });
    res.status(201).json({ invitation });
  });

  router.delete('/invitations/:id', owner, async (req, res) => {
    await revokeInvitation(db, currentMember(res.locals).shopId, idParam(req.params.id, 'Invitation'));
    res.json({ ok: true });
  });

  router.patch('/:id', owner, async (req, res) => {
    const id = memberIdParam(req.params.id);
    const input = parseOr400(roleChangeInput, req.body);
    res.json({ member: await changeRole(db, currentMember(res.locals).shopId, id, input.role) });
  });

  router.delete('/:id', owner, async (req, res) => {
    await removeMember(db, currentMember(res.locals).shopId, memberIdParam(req.params.id));
    res.json({ ok: true });
  });

  return router;
}

/** The join link's API: public, since the person invited has no account yet. */
export function invitationRoutes(db: Db, auth: Auth, throttle: Throttle): Router {
  const router = Router();

  router.get('/:secret', async (req, res) => {
    res.json({ invitation: await previewInvitation(db, secretParam(req.params.secret)) });
  });

  router.post('/:secret/accept', async (req, res) => {
    const secret = secretParam(req.params.secret);
    const input = parseOr400(acceptInvitationInput, req.body);
    await throttle.attempt(secret, clientAddress(req));
    const invitation = await previewInvitation(db, secret);
    requireStrongPassword(input.password, { email: invitation.email, name: input.name, shopName: invitation.shopName });
    const memberId = await acceptInvitation(db, secret, input, () => generateIdFromEntropySize(10));
    // Whoever was signed in on this browser before is signed out, not left half-active.
    if (res.locals.session) await auth.invalidateSession(res.locals.session.id);
    res.append('Set-Cookie', await startSession(auth, memberId)).status(201).json({ ok: true });
  });

  return router;
}
