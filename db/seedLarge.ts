import { eq, sql } from 'drizzle-orm';
import { jobStatuses } from '../features/jobs/schema';
import type { Db } from './client';
import { customers, jobs, members } from './schema';

/**
 * Fills one shop with a busy shop's worth of invented data (10 000 jobs for
 * 2 000 customers by default) to see the lists stay fast at that size.
 * Names come from short invented word lists, deterministically, so two runs
 * make the same shop. Rows go in batches; the whole seed is a few seconds.
 */

const FIRST = ['Ansel', 'Brisa', 'Corwin', 'Dalia', 'Emeric', 'Fenna', 'Gideon', 'Halla', 'Ivo', 'Juno', 'Kestrel', 'Liora', 'Marek', 'Nell', 'Orrin', 'Pilar', 'Quill', 'Rosalind', 'Soren', 'Tamsin'];
const LAST = ['Ashgrove', 'Brackley', 'Copperfold', 'Dunmere', 'Elderway', 'Fallowby', 'Greywick', 'Hollins', 'Ironvale', 'Juniper', 'Kettleby', 'Larkspur', 'Mossbank', 'Northcote', 'Oakhurst', 'Pennywhistle', 'Quarrington', 'Redfern', 'Stillwater', 'Thornbury'];
const TEAMS = ['Harbor Gulls', 'Ridge Foxes', 'Lantern Owls', 'Millbrook Otters', 'Cinder Hawks', 'Bramble Stags', 'Tidewater Herons', 'Quarry Badgers'];
const THINGS = ['jersey shadowbox', 'signed ball case', 'medal display', 'diploma', 'puzzle', 'wedding invitation', 'botanical print', 'race bib and medal', 'ticket and programme collage', 'family photo'];

const pick = <T>(list: readonly T[], n: number): T => list[n % list.length]!;

function customerRow(shopId: string, i: number) {
  const first = pick(FIRST, i);
  const last = pick(LAST, Math.floor(i / FIRST.length) + i);
  return {
    shopId,
    name: `${first} ${last}${i >= FIRST.length * LAST.length ? ` ${Math.floor(i / (FIRST.length * LAST.length)) + 1}` : ''}`,
    email: `${first}.${last}.${i}@customers.example`.toLowerCase(),
    phone: `555-01${String(i % 100).padStart(2, '0')}`,
    createdAt: new Date(Date.UTC(2025, 0, 1) + i * 3_600_000),
  };
}

function jobRow(shopId: string, customerId: string, i: number) {
  const thing = pick(THINGS, i * 7);
  const team = pick(TEAMS, i * 3);
  const due = i % 9 === 0 ? null : new Date(Date.UTC(2026, 0, 1) + ((i * 37) % 540) * 86_400_000).toISOString().slice(0, 10);
  return {
    shopId,
    customerId,
    title: thing === 'jersey shadowbox' || thing === 'signed ball case' ? `${team} ${thing} #${(i % 99) + 1}` : `${thing[0]!.toUpperCase()}${thing.slice(1)} ${i + 1}`,
    dueDate: due,
    notes: i % 4 === 0 ? `Customer asked for a ${pick(['walnut', 'black', 'silver', 'natural oak'], i)} moulding and UV glazing.` : null,
    status: pick(jobStatuses, i * 5),
    createdAt: new Date(Date.UTC(2025, 0, 1) + i * 1_800_000),
    updatedAt: new Date(Date.UTC(2025, 0, 1) + i * 1_800_000),
  };
}

async function inBatches<T>(rows: readonly T[], size: number, insert: (batch: T[]) => Promise<unknown>) {
  for (let i = 0; i < rows.length; i += size) await insert(rows.slice(i, i + size));
}

export interface LargeSeedOptions {
  readonly jobs?: number;
  readonly customers?: number;
}

/** Adds the customers and jobs to the shop of the member with `memberEmail`. */
export async function seedLargeShop(db: Db, memberEmail: string, options: LargeSeedOptions = {}) {
  const jobCount = options.jobs ?? 10_000;
  const customerCount = options.customers ?? 2_000;
  const member = await db.query.members.findFirst({ where: eq(members.email, memberEmail), columns: { shopId: true } });
  if (!member) throw new Error(`no member signs in as ${memberEmail}`);
  const shopId = member.shopId;
  const customerIds: string[] = [];
  await inBatches(Array.from({ length: customerCount }, (_, i) => customerRow(shopId, i)), 1000, async (batch) => {
    const rows = await db.insert(customers).values(batch).returning({ id: customers.id });
    customerIds.push(...rows.map((r) => r.id));
  });
  const jobRows = Array.from({ length: jobCount }, (_, i) => jobRow(shopId, customerIds[(i * 7919) % customerIds.length]!, i));
  await inBatches(jobRows, 1000, (batch) => db.insert(jobs).values(batch));
  // Fresh statistics, so the planner sees the new size at once.
  await db.execute(sql`analyze customers; analyze jobs`);
  return { shopId, jobs: jobCount, customers: customerCount };
}
