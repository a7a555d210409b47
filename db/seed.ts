import { sql } from 'drizzle-orm';
import { generateIdFromEntropySize } from 'lucia';
import { parseLayout } from '../geometry';
import type { Db } from './client';
import { demoJerseyLayout } from './demoLayout';
import { demoCustomers, demoJobs, demoPieces, demoShop } from './demoShop';
import { draftColumns } from '../server/services/draftOutlines';
import { activity, customers, jobs, layouts, members, pieces, shops } from './schema';

export { demoShop } from './demoShop';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** A past moment, so the demo's activity log reads in the order the work happened. */
const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000);

function isoDateIn(days: number, from = new Date()): string {
  return new Date(from.getTime() + days * 86_400_000).toISOString().slice(0, 10);
}

async function seedPiecesAndLayout(tx: Tx, shopId: string, jobId: string, designerId: string) {
  const rows = await tx
    .insert(pieces)
    .values(Object.values(demoPieces).map((p) => ({ ...p, shopId, jobId })))
    .returning({ id: pieces.id });
  const [jersey, patchA, patchB, photo, plaque] = rows.map((r) => r.id) as [string, string, string, string, string];
  const parsed = parseLayout(demoJerseyLayout({ jersey, patchA, patchB, photo, plaque }));
  if (!parsed.ok) throw new Error(`the demo layout is not valid: ${JSON.stringify(parsed.issues)}`);
  const [layout] = await tx
    .insert(layouts)
    .values({ shopId, jobId, name: 'Jersey, two patches, photo and plaque', ...draftColumns(parsed.layout), updatedBy: designerId })
    .returning({ id: layouts.id });
  await tx.insert(activity).values({
    shopId,
    jobId,
    memberId: designerId,
    kind: 'layout_created',
    detail: { name: 'Jersey, two patches, photo and plaque', layoutId: layout!.id },
    at: daysAgo(1),
  });
}

/**
 * Fills an empty database with the invented demo shop; returns its sign-in, or
 * null when data exists. The caller brings the password hasher (auth's concern).
 */
export async function seedDemoShop(db: Db, hashPassword: (password: string) => Promise<string>): Promise<{ email: string; password: string } | null> {
  const [{ count }] = (await db.execute<{ count: number }>(sql`select count(*)::int as count from shops`)).rows as [{ count: number }];
  if (count > 0) return null;
  const passwordHash = await hashPassword(demoShop.password);
  await db.transaction(async (tx) => {
    const [shop] = await tx.insert(shops).values({ name: demoShop.name }).returning({ id: shops.id });
    const shopId = shop!.id;
    const people = demoShop.members.map((m) => ({ ...m, id: generateIdFromEntropySize(10), shopId, passwordHash }));
    await tx.insert(members).values(people);
    const designerId = people[1]!.id;
    const customerRows = await tx.insert(customers).values(demoCustomers.map((c) => ({ ...c, shopId }))).returning({ id: customers.id });
    const jobRows = await tx
      .insert(jobs)
      .values(
        demoJobs.map((j) => ({
          shopId,
          customerId: customerRows[j.customer]!.id,
          title: j.title,
          status: j.status,
          notes: j.notes ?? null,
          dueDate: j.dueDays === null ? null : isoDateIn(j.dueDays),
        })),
      )
      .returning({ id: jobs.id, status: jobs.status });
    await tx.insert(activity).values(
      jobRows.flatMap((j) => [
        { shopId, jobId: j.id, memberId: people[2]!.id, kind: 'job_created' as const, detail: {}, at: daysAgo(5) },
        ...(j.status === 'taken_in'
          ? []
          : [{ shopId, jobId: j.id, memberId: designerId, kind: 'status_changed' as const, detail: { from: 'taken_in', to: j.status }, at: daysAgo(3) }]),
      ]),
    );
    await seedPiecesAndLayout(tx, shopId, jobRows[0]!.id, designerId);
  });
  return { email: demoShop.members[0].email, password: demoShop.password };
}
