import { generateIdFromEntropySize } from 'lucia';
import { pino } from 'pino';
import request from 'supertest';
import { inject } from 'vitest';
import { connectDatabase, type Database } from '../../db/client';
import { eq } from 'drizzle-orm';
import { jobs, members } from '../../db/schema';
import type { MemberRole } from '../../features/auth/schema';
import type { JobStatus } from '../../features/jobs/schema';
import { createApp } from '../app';
import { hashPassword } from '../auth';
import { createMailer, smtpTransport } from '../mail/mailer';
import { startSmtpFake, type SmtpFake } from '../mail/smtpFake';

export interface Harness {
  app: ReturnType<typeof createApp>;
  database: Database;
}

/** Where the test app says it is reached; links in test mail start with it. */
export const TEST_PUBLIC_URL = 'http://matwright.test';

/**
 * Every API test comes from 127.0.0.1, so the per-address attempt limits are
 * raised for them; the throttle tests set their own limits.
 */
export const testThrottle = { minPerAddress: 100_000 };

export function createHarness(): Harness {
  const database = connectDatabase(inject('databaseUrl'));
  const app = createApp({ db: database.db, logger: pino({ level: process.env.TEST_LOG_LEVEL ?? 'silent' }), publicUrl: TEST_PUBLIC_URL, throttle: testThrottle });
  return { app, database };
}

export interface MailHarness extends Harness {
  smtp: SmtpFake;
  close(): Promise<void>;
}

/**
 * A harness whose mail goes to a fresh SMTP fake the test can read. Pass
 * `smtpUrl` to point the mailer somewhere else, e.g. a closed port to see a send fail,
 * and `publicUrl` for the address links in mail should use.
 */
export async function createMailHarness(options: { smtpUrl?: string; publicUrl?: string } = {}): Promise<MailHarness> {
  const smtp = await startSmtpFake();
  const database = connectDatabase(inject('databaseUrl'));
  const transport = smtpTransport(options.smtpUrl ?? smtp.url);
  const mailer = createMailer(database.db, { transport: async () => transport, from: 'Matwright Tests <tests@matwright.example>' });
  const app = createApp({
    db: database.db,
    logger: pino({ level: 'silent' }),
    mailer,
    publicUrl: options.publicUrl ?? TEST_PUBLIC_URL,
    throttle: testThrottle,
  });
  const close = async () => {
    transport.close();
    await Promise.all([smtp.close(), database.close()]);
  };
  return { app, database, smtp, close };
}

let counter = 0;
/** A unique address per call so tests never collide in the shared test database. */
export function uniqueEmail(label: string): string {
  counter += 1;
  return `${label}-${Date.now()}-${counter}@tests.example`;
}

export const testPassword = 'correct horse battery';

/** Signs up a new shop; returns a cookie-keeping agent signed in as its owner. */
export async function signUpShop(h: Harness, shopName = 'Quarry Hill Framing') {
  const agent = request.agent(h.app);
  const email = uniqueEmail('owner');
  const res = await agent.post('/api/auth/sign-up').send({ shopName, name: 'Ada Test', email, password: testPassword });
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  const me = await agent.get('/api/auth/me');
  return { agent, email, shopId: me.body.shop.id as string };
}

/** Adds a member with `role` straight into the database and signs them in. */
export async function addMember(h: Harness, shopId: string, role: MemberRole) {
  const email = uniqueEmail(role);
  await h.database.db.insert(members).values({
    id: generateIdFromEntropySize(10),
    shopId,
    email,
    name: `Test ${role}`,
    role,
    passwordHash: await hashPassword(testPassword),
  });
  const agent = request.agent(h.app);
  const res = await agent.post('/api/auth/sign-in').send({ email, password: testPassword });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`);
  return agent;
}

/**
 * Brings a job to `status` for a test's set-up by the moves the shop's rules allow (an owner's `agent`;
 * "approved" by the owner's override with a reason). "Waiting for approval" only comes from sending a
 * proof, so it is written straight to the table here.
 */
export async function moveJobTo(h: Harness, agent: ReturnType<typeof request.agent>, jobId: string, status: JobStatus) {
  if (status === 'awaiting_approval') {
    await h.database.db.update(jobs).set({ status }).where(eq(jobs.id, jobId));
    return;
  }
  const pipeline: JobStatus[] = ['taken_in', 'designing', 'approved', 'cutting', 'assembling', 'ready'];
  const current = (await agent.get(`/api/jobs/${jobId}`)).body.job.status as JobStatus;
  const finalStep: JobStatus[] = status === 'shipped' || status === 'collected' ? ['ready', status] : [status];
  const steps: JobStatus[] =
    status === 'cancelled' || status === 'taken_in'
      ? [status]
      : [...pipeline.slice(0, pipeline.indexOf(finalStep[0] as JobStatus) + 1), ...finalStep.slice(1)].slice(pipeline.indexOf(current) + 1);
  for (const step of steps) {
    const body = step === 'approved' ? { status: step, note: 'Approved at the counter (test set-up)' } : { status: step };
    const res = await agent.post(`/api/jobs/${jobId}/status`).send(body);
    if (res.status !== 200) throw new Error(`Could not move the job to ${step}: ${res.status} ${JSON.stringify(res.body)}`);
  }
}
