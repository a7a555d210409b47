import { sql } from 'drizzle-orm';
import { generateIdFromEntropySize } from 'lucia';
import { hashPassword } from '../server/auth';
import type { Db } from './client';
import { customers, jobs, members, shops } from './schema';

/** Every name below is invented: the shop, its people, the teams and the players. */
export const demoShop = {
  name: 'Tallowmere Frame Works',
  password: 'demo-frames-2026',
  members: [
    { email: 'owner@tallowmere.example', name: 'Ines Varga', role: 'owner' },
    { email: 'designer@tallowmere.example', name: 'Otto Brannigan', role: 'designer' },
    { email: 'desk@tallowmere.example', name: 'Lupe Castellane', role: 'front_desk' },
  ],
} as const;

const demoCustomers = [
  { name: 'Marguerite Oduya', email: 'marguerite@oduya.example', phone: '555-0141', address: '18 Quillon Row, Port Wendle' },
  { name: 'Teodor Halvorsen-Pike', email: 'teo.hp@example.net', phone: '555-0177', address: '4 Brackwater Lane, Ashby Flats' },
  { name: 'Carrow Valley Ironclads Booster Club', email: 'boosters@ironclads.example', phone: '555-0102', address: '900 Stadium Way, Carrow Valley' },
];

const demoJobs = [
  { title: 'Port Wendle Gulls home jersey #14 with two patches and a plaque', customer: 0, status: 'designing', dueDays: 12 },
  { title: 'Ironclads championship jersey #7, team photo and ticket stubs', customer: 2, status: 'taken_in', dueDays: 21 },
  { title: 'Ashby Flats Comets signed away jersey #22', customer: 1, status: 'awaiting_approval', dueDays: 6 },
] as const;

function isoDateIn(days: number, from = new Date()): string {
  const d = new Date(from.getTime() + days * 86_400_000);
  return d.toISOString().slice(0, 10);
}

/** Fills an empty database with the invented demo shop; returns its sign-in, or null when data exists. */
export async function seedDemoShop(db: Db): Promise<{ email: string; password: string } | null> {
  const [{ count }] = (await db.execute<{ count: number }>(sql`select count(*)::int as count from shops`)).rows as [{ count: number }];
  if (count > 0) return null;
  const passwordHash = await hashPassword(demoShop.password);
  await db.transaction(async (tx) => {
    const [shop] = await tx.insert(shops).values({ name: demoShop.name }).returning({ id: shops.id });
    const shopId = shop!.id;
    await tx.insert(members).values(
      demoShop.members.map((m) => ({ ...m, id: generateIdFromEntropySize(10), shopId, passwordHash })),
    );
    const rows = await tx
      .insert(customers)
      .values(demoCustomers.map((c) => ({ ...c, shopId })))
      .returning({ id: customers.id });
    await tx.insert(jobs).values(
      demoJobs.map((j) => ({
        shopId,
        customerId: rows[j.customer]!.id,
        title: j.title,
        status: j.status,
        dueDate: isoDateIn(j.dueDays),
      })),
    );
  });
  return { email: demoShop.members[0].email, password: demoShop.password };
}
