import { and, asc, count, desc, eq, gte, ilike, inArray, lte, or, sql, type SQL } from 'drizzle-orm';
import type { z } from 'zod';
import type { jobInput, jobListQuery, jobStatusChange, jobUpdate } from '../../features/jobs/schema';
import type { Db } from '../../db/client';
import type { MemberRole } from '../../features/auth/schema';
import { statusMoveRefusal, type StatusMoveRefusal } from '../../features/jobs/statusRules';
import { customers, jobs } from '../../db/schema';
import { HttpError, notFound } from '../errors';
import { recordActivity } from './activity';
import { closeOpenProofs } from './proofs';

type JobValues = z.output<typeof jobInput>;
type JobFilters = z.output<typeof jobListQuery>;

const jobColumns = {
  id: jobs.id,
  title: jobs.title,
  customerId: jobs.customerId,
  customerName: customers.name,
  dueDate: jobs.dueDate,
  notes: jobs.notes,
  frame: jobs.frame,
  status: jobs.status,
  statusChangedAt: jobs.statusChangedAt,
  createdAt: jobs.createdAt,
  updatedAt: jobs.updatedAt,
};

type JobRow = { createdAt: Date; updatedAt: Date; statusChangedAt: Date } & Record<string, unknown>;
const jobView = <T extends JobRow>(row: T) => ({
  ...row,
  statusChangedAt: row.statusChangedAt.toISOString(),
  createdAt: row.createdAt.toISOString(),
  updatedAt: row.updatedAt.toISOString(),
});

function filtersWhere(shopId: string, f: JobFilters): SQL | undefined {
  const term = f.q ? `%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%` : undefined;
  return and(
    eq(jobs.shopId, shopId),
    f.status?.length ? inArray(jobs.status, f.status) : undefined,
    f.customerId ? eq(jobs.customerId, f.customerId) : undefined,
    f.dueFrom ? gte(jobs.dueDate, f.dueFrom) : undefined,
    f.dueTo ? lte(jobs.dueDate, f.dueTo) : undefined,
    term ? textMatch(shopId, term) : undefined,
  );
}

/**
 * "Contains" on the title, the notes or the customer's name, as the union of three id
 * lists, one per trigram index. Written as one OR, Postgres filters every job of the shop
 * row by row instead (measured at 10 000 jobs: 16-20 ms against 2-4 ms through the index).
 */
function textMatch(shopId: string, term: string): SQL | undefined {
  return sql`${jobs.id} in (
    select titled.id from jobs as titled where titled.shop_id = ${shopId} and titled.title ilike ${term}
    union select noted.id from jobs as noted where noted.shop_id = ${shopId} and noted.notes ilike ${term}
    union select theirs.id from jobs as theirs join customers as named on named.id = theirs.customer_id
      where named.shop_id = ${shopId} and named.name ilike ${term})`;
}

function sortOrder(f: JobFilters): SQL[] {
  const dir = f.order === 'asc' ? asc : desc;
  // Undated jobs sort after dated ones whichever way dates run.
  const byKey: Record<JobFilters['sort'], SQL[]> = {
    due: [asc(sql`${jobs.dueDate} is null`), dir(jobs.dueDate)],
    created: [dir(jobs.createdAt)],
    updated: [dir(jobs.updatedAt)],
    title: [dir(sql`lower(${jobs.title})`)],
    status: [dir(jobs.status)],
  };
  return [...byKey[f.sort], desc(jobs.createdAt), asc(jobs.id)];
}

export async function listJobs(db: Db, shopId: string, f: JobFilters) {
  const where = filtersWhere(shopId, f);
  const from = () => db.select(jobColumns).from(jobs).innerJoin(customers, eq(customers.id, jobs.customerId));
  // Counting every match costs a scan at a busy shop's size: only when asked, or for the first page.
  const counted = f.count === 'exact' || (f.count === undefined && f.offset === 0);
  const [rows, total] = await Promise.all([
    from().where(where).orderBy(...sortOrder(f)).limit(f.limit).offset(f.offset),
    // Every job has a customer (a required key), so the count needs no join: Postgres counts from the shop's index alone.
    counted ? db.select({ n: count() }).from(jobs).where(where) : null,
  ]);
  return { jobs: rows.map(jobView), total: total ? (total[0]?.n ?? 0) : null };
}

export async function getJob(db: Db, shopId: string, id: string) {
  const [row] = await db
    .select(jobColumns)
    .from(jobs)
    .innerJoin(customers, eq(customers.id, jobs.customerId))
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, id)));
  if (!row) throw notFound('Job');
  return jobView(row);
}

async function assertShopCustomer(db: Db, shopId: string, customerId: string) {
  const owner = await db.query.customers.findFirst({
    where: and(eq(customers.shopId, shopId), eq(customers.id, customerId)),
    columns: { id: true },
  });
  if (!owner) throw new HttpError(400, 'invalid_input', "Choose one of the shop's customers", { customerId: 'No such customer in this shop' });
}

export async function createJob(db: Db, shopId: string, memberId: string, values: JobValues) {
  await assertShopCustomer(db, shopId, values.customerId);
  const id = await db.transaction(async (tx) => {
    const [row] = await tx.insert(jobs).values({ ...values, shopId }).returning({ id: jobs.id });
    await recordActivity(tx, { shopId, jobId: row!.id, memberId, kind: 'job_created', detail: { title: values.title } });
    return row!.id;
  });
  return getJob(db, shopId, id);
}

export async function updateJob(db: Db, shopId: string, memberId: string, id: string, values: z.output<typeof jobUpdate>) {
  await getJob(db, shopId, id);
  if (values.customerId) await assertShopCustomer(db, shopId, values.customerId);
  await db.transaction(async (tx) => {
    await tx.update(jobs).set({ ...values, updatedAt: new Date() }).where(and(eq(jobs.shopId, shopId), eq(jobs.id, id)));
    await recordActivity(tx, { shopId, jobId: id, memberId, kind: 'job_updated', detail: { fields: Object.keys(values) } });
  });
  return getJob(db, shopId, id);
}

/**
 * Moves a job by hand, following the shop's allowed moves (features/jobs/statusRules.ts), and logs who
 * moved it from where. An owner's approval without a proof is logged as an override with its reason.
 * Cancelling closes the job's open proof links so a customer cannot approve a cancelled job.
 */
export async function changeJobStatus(db: Db, shopId: string, member: { id: string; role: MemberRole }, id: string, change: z.output<typeof jobStatusChange>) {
  await db.transaction(async (tx) => {
    const [current] = await tx
      .select({ status: jobs.status })
      .from(jobs)
      .where(and(eq(jobs.shopId, shopId), eq(jobs.id, id)))
      .for('update');
    if (!current) throw notFound('Job');
    const refusal = statusMoveRefusal(current.status, change.status, member.role, change.note);
    if (refusal) throw statusRefusalError(refusal);
    const now = new Date();
    await tx.update(jobs).set({ status: change.status, statusChangedAt: now, updatedAt: now }).where(eq(jobs.id, id));
    const override = change.status === 'approved';
    await recordActivity(tx, {
      shopId,
      jobId: id,
      memberId: member.id,
      kind: 'status_changed',
      detail: { from: current.status, to: change.status, ...(change.note ? { note: change.note } : {}), ...(override ? { override: true } : {}) },
    });
    if (change.status === 'cancelled') await closeOpenProofs(tx, shopId, id, now);
  });
  return getJob(db, shopId, id);
}

function statusRefusalError(refusal: StatusMoveRefusal): HttpError {
  switch (refusal.kind) {
    case 'same':
      return new HttpError(409, 'same_status', refusal.message, { status: 'Choose a different status' });
    case 'reason_needed':
      return new HttpError(400, 'invalid_input', refusal.message, { note: 'Give the reason for the log' });
    default:
      return new HttpError(409, 'status_move_refused', refusal.message, { status: refusal.message });
  }
}
