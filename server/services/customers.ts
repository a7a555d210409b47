import { and, asc, eq, ilike, or } from 'drizzle-orm';
import type { z } from 'zod';
import type { customerInput } from '../../features/customers/schema';
import type { Db } from '../../db/client';
import { customers, type Customer } from '../../db/schema';
import { notFound } from '../errors';

type CustomerValues = z.output<typeof customerInput>;

export function customerView(row: Customer) {
  return { ...row, createdAt: row.createdAt.toISOString(), shopId: undefined };
}

export async function listCustomers(db: Db, shopId: string, search?: string) {
  const term = search?.trim();
  const rows = await db
    .select()
    .from(customers)
    .where(
      and(
        eq(customers.shopId, shopId),
        term ? or(ilike(customers.name, `%${term}%`), ilike(customers.email, `%${term}%`)) : undefined,
      ),
    )
    .orderBy(asc(customers.name));
  return rows.map(customerView);
}

export async function getCustomer(db: Db, shopId: string, id: string) {
  const row = await db.query.customers.findFirst({ where: and(eq(customers.shopId, shopId), eq(customers.id, id)) });
  if (!row) throw notFound('Customer');
  return customerView(row);
}

export async function createCustomer(db: Db, shopId: string, values: CustomerValues) {
  const [row] = await db.insert(customers).values({ ...values, shopId }).returning();
  return customerView(row!);
}
