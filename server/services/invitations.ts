import { and, desc, eq, isNull, ne } from 'drizzle-orm';
import { createHash, randomBytes } from 'node:crypto';
import type { Db } from '../../db/client';
import { invitations, members, shops, type Invitation } from '../../db/schema';
import type { AcceptInvitationInput, InvitationPreview, InvitationSummary, InviteInput } from '../../features/members/schema';
import { hashPassword } from '../auth';
import { HttpError, notFound } from '../errors';
import { invitationMail } from '../mail/invitationMail';
import type { Mailer } from '../mail/mailer';

const VALID_FOR_MS = 7 * 24 * 60 * 60 * 1000;

/** 32 random bytes in the link; only the SHA-256 of it is stored, so a database copy opens no invitation. */
function newSecret() {
  const secret = randomBytes(32).toString('base64url');
  return { secret, hash: hashSecret(secret) };
}

export const hashSecret = (secret: string) => createHash('sha256').update(secret).digest('hex');

const emailTaken = () =>
  new HttpError(409, 'email_taken', 'This e-mail already has a Matwright account; one account per e-mail for now', {
    email: 'This e-mail already has an account',
  });

/** The pool or an open transaction. */
type Reader = Pick<Db, 'query'>;

async function refuseExistingAccount(db: Reader, email: string) {
  const taken = await db.query.members.findFirst({ where: eq(members.email, email), columns: { id: true } });
  if (taken) throw emailTaken();
}

/** Postgres' unique_violation, whether Drizzle wrapped the driver's error or not. */
function isUniqueViolation(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } };
  return e?.code === '23505' || e?.cause?.code === '23505';
}

export interface InviteFacts extends InviteInput {
  shopId: string;
  invitedBy: { id: string; name: string };
  /** Where the app is reached, e.g. https://frames.example; the link is <origin>/join/<secret>. */
  origin: string;
}

/**
 * Creates an invitation and e-mails its link. When the mail cannot be sent the
 * invitation is dropped again (nobody could use it) and the 502 is passed on.
 * A new invitation replaces any earlier one still waiting for the same address.
 */
export async function inviteMember(db: Db, mailer: Mailer, facts: InviteFacts): Promise<InvitationSummary> {
  await refuseExistingAccount(db, facts.email);
  const shop = await db.query.shops.findFirst({ where: eq(shops.id, facts.shopId), columns: { name: true } });
  const { secret, hash } = newSecret();
  const expiresAt = new Date(Date.now() + VALID_FOR_MS);
  const [row] = await db
    .insert(invitations)
    .values({ shopId: facts.shopId, email: facts.email, role: facts.role, tokenHash: hash, invitedBy: facts.invitedBy.id, expiresAt })
    .returning();
  const link = `${facts.origin.replace(/\/+$/, '')}/join/${secret}`;
  const mail = invitationMail({ shopName: shop?.name ?? 'a shop', inviterName: facts.invitedBy.name, role: facts.role, link, expiresAt });
  try {
    await mailer.send({ shopId: facts.shopId, to: facts.email, purpose: 'invitation', ...mail });
  } catch (err) {
    await db.delete(invitations).where(eq(invitations.id, row!.id));
    throw err;
  }
  await db
    .update(invitations)
    .set({ revokedAt: new Date() })
    .where(and(eq(invitations.shopId, facts.shopId), eq(invitations.email, facts.email), ne(invitations.id, row!.id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
  return summarise(row!, facts.invitedBy.name);
}

function summarise(row: Invitation, invitedByName: string | null): InvitationSummary {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    state: row.expiresAt.getTime() > Date.now() ? 'waiting' : 'expired',
    expiresAt: row.expiresAt.toISOString(),
    invitedByName,
  };
}

/** Invitations neither used nor withdrawn, newest first; expired ones stay listed so they can be sent again. */
export async function listInvitations(db: Db, shopId: string): Promise<InvitationSummary[]> {
  const rows = await db
    .select({ invitation: invitations, invitedByName: members.name })
    .from(invitations)
    .leftJoin(members, eq(members.id, invitations.invitedBy))
    .where(and(eq(invitations.shopId, shopId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
    .orderBy(desc(invitations.createdAt));
  return rows.map((r) => summarise(r.invitation, r.invitedByName));
}

/** Withdraws an invitation so its link stops working; withdrawing twice is harmless. */
export async function revokeInvitation(db: Db, shopId: string, id: string): Promise<void> {
  const row = await db.query.invitations.findFirst({ where: and(eq(invitations.id, id), eq(invitations.shopId, shopId)) });
  if (!row) throw notFound('Invitation');
  if (row.acceptedAt) throw new HttpError(409, 'invitation_used', 'This invitation was already used; remove the member instead');
  if (!row.revokedAt) await db.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, id));
}

/** The invitation behind a link, or the reason it no longer works. */
function usable(row: Invitation | undefined, now = new Date()): Invitation {
  if (!row) throw new HttpError(404, 'invitation_not_found', 'This invitation link is not valid; ask the shop owner for a new one');
  if (row.acceptedAt) throw new HttpError(410, 'invitation_used', 'This invitation was already used; sign in instead');
  if (row.revokedAt) throw new HttpError(410, 'invitation_revoked', 'This invitation was withdrawn; ask the shop owner for a new one');
  if (row.expiresAt <= now) throw new HttpError(410, 'invitation_expired', 'This invitation has expired; ask the shop owner to send a new one');
  return row;
}

export async function previewInvitation(db: Db, secret: string): Promise<InvitationPreview> {
  const rows = await db
    .select({ invitation: invitations, shopName: shops.name })
    .from(invitations)
    .innerJoin(shops, eq(shops.id, invitations.shopId))
    .where(eq(invitations.tokenHash, hashSecret(secret)));
  const row = usable(rows[0]?.invitation);
  return { shopName: rows[0]!.shopName, role: row.role, email: row.email, expiresAt: row.expiresAt.toISOString() };
}

/**
 * Turns an invitation into a member of its shop with its role, in one
 * transaction that locks the invitation row, so a link works exactly once.
 */
export async function acceptInvitation(db: Db, secret: string, input: AcceptInvitationInput, newId: () => string): Promise<string> {
  const passwordHash = await hashPassword(input.password);
  const id = newId();
  try {
    await db.transaction(async (tx) => {
      const [locked] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hashSecret(secret))).for('update');
      const row = usable(locked);
      await refuseExistingAccount(tx, row.email);
      await tx.insert(members).values({ id, shopId: row.shopId, email: row.email, name: input.name, role: row.role, passwordHash });
      await tx.update(invitations).set({ acceptedAt: new Date() }).where(eq(invitations.id, row.id));
    });
  } catch (err) {
    // Another shop's invitation for the same address was accepted a moment earlier.
    if (isUniqueViolation(err)) throw emailTaken();
    throw err;
  }
  return id;
}
