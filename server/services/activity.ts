import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { activity, members } from '../../db/schema';

type ActivityKind = (typeof activity.kind.enumValues)[number];

/** Anything with Drizzle's insert and select: the pool or an open transaction. */
type Writer = Pick<Db, 'insert'>;

export interface ActivityEntry {
  shopId: string;
  jobId: string;
  memberId: string | null;
  kind: ActivityKind;
  detail?: Record<string, unknown>;
}

/** Adds one line to a job's activity log; pass the transaction that made the change. */
export async function recordActivity(db: Writer, entry: ActivityEntry): Promise<void> {
  await db.insert(activity).values({ ...entry, detail: entry.detail ?? {} });
}

export async function listActivity(db: Db, shopId: string, jobId: string) {
  const rows = await db
    .select({ id: activity.id, kind: activity.kind, detail: activity.detail, at: activity.at, memberName: members.name })
    .from(activity)
    .leftJoin(members, eq(members.id, activity.memberId))
    .where(and(eq(activity.shopId, shopId), eq(activity.jobId, jobId)))
    .orderBy(desc(activity.at));
  return rows.map((r) => ({ ...r, at: r.at.toISOString(), detail: r.detail as Record<string, unknown> }));
}
