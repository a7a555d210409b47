import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { cutReleases, members, proofs } from '../../db/schema';
import type { CutApproval } from '../../features/exports/schema';
import { HttpError } from '../errors';
import { recordActivity } from './activity';
import { getLayout, getVersion } from './layouts';

type Reader = Pick<Db, 'select'>;

/** Why this frozen version may be cut, or null: an approved proof of exactly this version, else an owner's release. */
export async function cutApprovalOf(db: Reader, shopId: string, layoutId: string, number: number): Promise<CutApproval | null> {
  const [approved] = await db
    .select({ name: proofs.approvedName, at: proofs.decidedAt })
    .from(proofs)
    .where(and(eq(proofs.shopId, shopId), eq(proofs.layoutId, layoutId), eq(proofs.versionNumber, number), eq(proofs.state, 'approved')))
    .orderBy(desc(proofs.decidedAt))
    .limit(1);
  if (approved) return { kind: 'proof', approvedName: approved.name ?? '', approvedAt: (approved.at ?? new Date()).toISOString() };
  const [release] = await db
    .select({ reason: cutReleases.reason, by: members.name, at: cutReleases.releasedAt })
    .from(cutReleases)
    .leftJoin(members, eq(members.id, cutReleases.releasedBy))
    .where(and(eq(cutReleases.shopId, shopId), eq(cutReleases.layoutId, layoutId), eq(cutReleases.versionNumber, number)));
  return release ? { kind: 'release', reason: release.reason, releasedBy: release.by, releasedAt: release.at.toISOString() } : null;
}

/** The newest version of this layout the customer approved on a proof, if any. */
export async function approvedVersionOf(db: Reader, shopId: string, layoutId: string): Promise<number | null> {
  const [row] = await db
    .select({ number: proofs.versionNumber })
    .from(proofs)
    .where(and(eq(proofs.shopId, shopId), eq(proofs.layoutId, layoutId), eq(proofs.state, 'approved')))
    .orderBy(desc(proofs.decidedAt))
    .limit(1);
  return row?.number ?? null;
}

/** The approval a cut file or cut sheet is made under; 409 in plain words when there is none. */
export async function requireCutApproval(db: Reader, shopId: string, layoutId: string, number: number): Promise<CutApproval> {
  const approval = await cutApprovalOf(db, shopId, layoutId, number);
  if (approval) return approval;
  const approvedVersion = await approvedVersionOf(db, shopId, layoutId);
  const where = approvedVersion ? `The customer approved version ${approvedVersion}; cut that one, or` : 'Send a proof and wait for the customer to approve it, or';
  throw new HttpError(
    409,
    'not_approved',
    `Version ${number} has not been approved by the customer, so no cut file is made. ${where} an owner can release this version for cutting with a reason.`,
  );
}

/** An owner releases a version for cutting without the customer's approval; logged and printed on the cut sheet. */
export async function releaseForCutting(db: Db, shopId: string, memberId: string, layoutId: string, number: number, reason: string) {
  const { layout } = await getLayout(db, shopId, layoutId);
  await getVersion(db, shopId, layoutId, number);
  if (await cutApprovalOf(db, shopId, layoutId, number)) {
    throw new HttpError(409, 'already_approved', `Version ${number} can already be cut; nothing was changed`);
  }
  await db.transaction(async (tx) => {
    await tx.insert(cutReleases).values({ shopId, layoutId, versionNumber: number, reason, releasedBy: memberId });
    await recordActivity(tx, { shopId, jobId: layout.jobId, memberId, kind: 'cut_released', detail: { layoutId, number, reason } });
  });
  return cutApprovalOf(db, shopId, layoutId, number);
}
