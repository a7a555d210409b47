import { and, eq, ne } from 'drizzle-orm';
import type { SignUpInput } from '../../features/auth/schema';
import type { Db } from '../../db/client';
import { members, sessions, shops } from '../../db/schema';
import { hashPassword, verifyPassword } from '../auth';
import { HttpError } from '../errors';

// Verifying against a real hash when the e-mail is unknown keeps the answer
// time the same, so sign-in does not reveal which addresses have accounts.
let decoyHash: Promise<string> | undefined;
const decoy = () => (decoyHash ??= hashPassword('matwright-decoy-password'));

/** Creates a shop and its first owner in one transaction; returns the new member's id. */
export async function createShopWithOwner(db: Db, input: SignUpInput, newId: () => string): Promise<string> {
  const taken = await db.query.members.findFirst({ where: eq(members.email, input.email), columns: { id: true } });
  if (taken) {
    throw new HttpError(409, 'email_taken', 'An account with this e-mail already exists; sign in instead', {
      email: 'This e-mail already has an account',
    });
  }
  const passwordHash = await hashPassword(input.password);
  const id = newId();
  await db.transaction(async (tx) => {
    const [shop] = await tx.insert(shops).values({ name: input.shopName }).returning({ id: shops.id });
    await tx.insert(members).values({ id, shopId: shop!.id, email: input.email, name: input.name, role: 'owner', passwordHash });
  });
  return id;
}

/** Returns the member id when the e-mail and password match, or throws one 401 for either mistake. */
export async function checkPassword(db: Db, email: string, password: string): Promise<string> {
  const member = await db.query.members.findFirst({ where: eq(members.email, email) });
  const ok = member ? await verifyPassword(member.passwordHash, password) : (await verifyPassword(await decoy(), password), false);
  if (!member || !ok) throw new HttpError(401, 'wrong_credentials', 'That e-mail and password do not match an account');
  return member.id;
}

export async function shopOf(db: Db, shopId: string) {
  const shop = await db.query.shops.findFirst({ where: eq(shops.id, shopId) });
  if (!shop) throw new Error(`member refers to missing shop ${shopId}`);
  return shop;
}

/**
 * Replaces a member's password after checking the current one, and ends every
 * other session of theirs, so a browser left signed in elsewhere loses access.
 */
export async function changePassword(db: Db, memberId: string, keepSessionId: string, current: string, next: string): Promise<void> {
  const member = await db.query.members.findFirst({ where: eq(members.id, memberId), columns: { passwordHash: true } });
  if (!member || !(await verifyPassword(member.passwordHash, current))) {
    throw new HttpError(400, 'wrong_password', 'The current password is not right', { currentPassword: 'This is not your current password' });
  }
  const passwordHash = await hashPassword(next);
  await db.transaction(async (tx) => {
    await tx.update(members).set({ passwordHash }).where(eq(members.id, memberId));
    await tx.delete(sessions).where(and(eq(sessions.userId, memberId), ne(sessions.id, keepSessionId)));
  });
}
