import { and, asc, desc, eq, sql } from 'drizzle-orm';
import type { z } from 'zod';
import type { jobInput } from '../../features/jobs/schema';
import type { Db } from '../../db/client';
import { customers, jobs } from '../../db/schema';
import { HttpError, notFound } from '../errors';

type JobValues = z.output<typeof jobInput>;

const jobColumns = {
  id: jobs.id,
  title: jobs.title,
  customerId: jobs.customerId,
  customerName: customers.name,
  dueDate: jobs.dueDate,
  notes: jobs.notes,
  status: jobs.status,
  createdAt: jobs.createdAt,
  updatedAt: jobs.updatedAt,
};

type JobRow = { createdAt: Date; updatedAt: Date } & Record<string, unknown>;
const jobView = <T extends JobRow>(row: T) => ({
  ...row,
  createdAt: row.createdAt.toISOString(),
  updatedAt: row.updatedAt.toISOString(),
});

function selectJobs(db: Db) {
  return db.select(jobColumns).from(jobs).innerJoin(customers, eq(customers.id, jobs.customerId));
}

/** Open work first by due date (undated last), then newest. */
export async function listJobs(db: Db, shopId: string) {
  const rows = await selectJobs(db)
    .where(eq(jobs.shopId, shopId))
    .orderBy(asc(sql`${jobs.dueDate} is null`), asc(jobs.dueDate), desc(jobs.createdAt));
  return rows.map(jobView);
}

export async function getJob(db: Db, shopId: string, id: string) {
  const [row] = await selectJobs(db).where(and(eq(jobs.shopId, shopId), eq(jobs.id, id)));
  if (!row) throw notFound('Job');
  return jobView(row);
}

export async function createJob(db: Db, shopId: string, values: JobValues) {
  const owner = await db.query.customers.findFirst({
    where: and(eq(customers.shopId, shopId), eq(customers.id, values.customerId)),
    columns: { id: true },
  });
  if (!owner) throw new HttpError(400, 'invalid_input', 'Choose one of the shop\'s customers', { customerId: 'No such customer in this shop' });
  const [row] = await db.insert(jobs).values({ ...values, shopId }).returning({ id: jobs.id });
  return getJob(db, shopId, row!.id);
}
