import { inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import { members } from '../db/schema';
import { demoShop } from '../db/seed';
import { verifyPassword } from './auth';

const demoEmails = (): string[] => demoShop.members.map((m) => m.email);

/** The demo sign-ins, printed while the demo accounts still exist. */
export async function demoBanner(db: Db): Promise<string> {
  const present = await db.select({ email: members.email }).from(members).where(inArray(members.email, demoEmails()));
  if (present.length === 0) return '';
  const rows = demoShop.members.filter((m) => present.some((p) => p.email === m.email));
  return rows.map((m) => `  demo ${m.role.replace('_', ' ')}: ${m.email} / ${demoShop.password}\n`).join('');
}

/**
 * The e-mail of every account still opened by the published demo password. A
 * production start refuses to serve while there is one (a database seeded for a
 * trial and then put online): anyone who read the README could sign in.
 */
export async function accountsWithDemoPassword(db: Db): Promise<string[]> {
  const rows = await db.select({ email: members.email, hash: members.passwordHash }).from(members).where(inArray(members.email, demoEmails()));
  const open: string[] = [];
  for (const row of rows) if (await verifyPassword(row.hash, demoShop.password)) open.push(row.email);
  return open;
}
