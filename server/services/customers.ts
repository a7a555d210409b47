import { and, asc, count, desc, eq, ilike, isNull, or } from 'drizzle-orm';
import type { CustomerListQuery } from '../../features/customers/schema';
import type { z } from 'zod';
import type { customerInput, customerUpdate } from '../../features/customers/schema';
import type { Db } from '../../db/client';
import { customers, jobs, type Customer } from '../../db/schema';
import { HttpError, notFound } from '../errors';

type CustomerValues = z.output<typeof customerInput>;

export function customerView({ shopId: _shopId, ...row }: Customer) {
  return { ...row, createdAt: row.createdAt.toISOString(), archivedAt: row.archivedAt?.toISOString() ?? null };
}

/** One page of the shop's customers matching `q`, by name or newest first, and how many match (first page only unless asked). */
export async function listCustomers(db: Db, shopId: string, query: Partial<CustomerListQuery> = {}) {
  const { q, includeArchived = false, order = 'name', limit = 50, offset = 0 } = query;
  const term = q?.trim() ? `%${q.trim().replace(/[%_\\]/g, (c) => `\\${c}`)}%` : undefined;
  const where = and(
    eq(customers.shopId, shopId),
    includeArchived ? undefined : isNull(customers.archivedAt),
    term ? or(ilike(customers.name, term), ilike(customers.email, term)) : undefined,
  );
  const counted = query.count === 'exact' || (query.count === undefined && offset === 0);
  const [rows, total] = await Promise.all([
    db
      .select()
      .from(customers)
      .where(where)
      .orderBy(...(order === 'recent' ? [desc(customers.createdAt), asc(customers.name)] : [asc(customers.name)]), asc(customers.id))
      .limit(limit)
      .offset(offset),
    counted ? db.select({ n: count() }).from(customers).where(where) : null,
  ]);
  return { customers: rows.map(customerView), total: total ? (total[0]?.n ?? 0) : null };
}

async function findCustomer(db: Db, shopId: string, id: string) {
  const row = await db.query.customers.findFirst({ where: and(eq(customers.shopId, shopId), eq(customers.id, id)) });
  if (!row) throw notFound('Customer');
  return row;
}

export async function getCustomer(db: Db, shopId: string, id: string) {
  return customerView(await findCustomer(db, shopId, id));
}

export async function createCustomer(db: Db, shopId: string, values: CustomerValues) {
  const [row] = await db.insert(customers).values({ ...values, shopId }).returning();
  return customerView(row!);
}

export async function updateCustomer(db: Db, shopId: string, id: string, update: z.output<typeof customerUpdate>) {
  await findCustomer(db, shopId, id);
  const { archived, ...fields } = update;
  const archivedAt = archived === undefined ? {} : { archivedAt: archived ? new Date() : null };
  const [row] = await db
    .update(customers)
    .set({ ...fields, ...archivedAt })
    .where(and(eq(customers.shopId, shopId), eq(customers.id, id)))
    .returning();
  return customerView(row!);
}

/** Deletes a customer who has no jobs; one with jobs is refused, since their history must stay. */
export async function deleteCustomer(db: Db, shopId: string, id: string) {
  await findCustomer(db, shopId, id);
  const [used] = await db.select({ n: count() }).from(jobs).where(eq(jobs.customerId, id));
  if ((used?.n ?? 0) > 0) {
    throw new HttpError(
      409,
      'customer_has_jobs',
      `This customer has ${used!.n} job${used!.n === 1 ? '' : 's'}, so they cannot be deleted. Archive them instead to hide them from lists.`,
    );
  }
  await db.delete(customers).where(and(eq(customers.shopId, shopId), eq(customers.id, id)));
}
