import { and, asc, eq, ne, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { members, sessions, shops } from '../../db/schema';
import type { MemberRole } from '../../features/auth/schema';
import type { TeamMember } from '../../features/members/schema';
import { HttpError, notFound } from '../errors';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export async function listTeam(db: Db, shopId: string): Promise<TeamMember[]> {
  const rows = await db
    .select({ id: members.id, name: members.name, email: members.email, role: members.role, createdAt: members.createdAt })
    .from(members)
    .where(eq(members.shopId, shopId))
    .orderBy(asc(members.createdAt), asc(members.name));
  return rows.map(({ createdAt, ...r }) => ({ ...r, joinedAt: createdAt.toISOString() }));
}

/**
 * Locks the shop row, so two owners demoting or removing each other at the
 * same moment are handled one after the other and cannot both succeed.
 */
async function lockedMember(tx: Tx, shopId: string, memberId: string) {
  await tx.select({ id: shops.id }).from(shops).where(eq(shops.id, shopId)).for('update');
  const [member] = await tx.select().from(members).where(and(eq(members.id, memberId), eq(members.shopId, shopId)));
  if (!member) throw notFound('Member');
  return member;
}

async function refuseLastOwner(tx: Tx, shopId: string, memberId: string, doing: string) {
  const [other] = await tx
    .select({ count: sql<number>`count(*)::int` })
    .from(members)
    .where(and(eq(members.shopId, shopId), eq(members.role, 'owner'), ne(members.id, memberId)));
  if ((other?.count ?? 0) === 0) {
    throw new HttpError(409, 'last_owner', `A shop needs at least one owner; make someone else an owner before you ${doing}`);
  }
}

export async function changeRole(db: Db, shopId: string, memberId: string, role: MemberRole): Promise<TeamMember> {
  return db.transaction(async (tx) => {
    const member = await lockedMember(tx, shopId, memberId);
    if (member.role === 'owner' && role !== 'owner') await refuseLastOwner(tx, shopId, memberId, 'change this role');
    const [row] = await tx.update(members).set({ role }).where(eq(members.id, memberId)).returning();
    return { id: row!.id, name: row!.name, email: row!.email, role: row!.role, joinedAt: row!.createdAt.toISOString() };
  });
}

/** Removes a member and ends every session they have; their past work stays, without their name. */
export async function removeMember(db: Db, shopId: string, memberId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const member = await lockedMember(tx, shopId, memberId);
    if (member.role === 'owner') await refuseLastOwner(tx, shopId, memberId, 'remove this owner');
    await tx.delete(sessions).where(eq(sessions.userId, memberId));
    await tx.delete(members).where(eq(members.id, memberId));
  });
}
