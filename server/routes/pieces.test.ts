import { and, eq } from 'drizzle-orm';
import type { Agent } from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { activity } from '../../db/schema';
import { addMember, createHarness, signUpShop } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

const homeJersey = { kind: 'garment', label: 'Home jersey #31', widthIn: 22.5, heightIn: 30.25, notes: 'Fold sleeves behind' };

async function shopWithJob() {
  const shop = await signUpShop(h, 'Fennimore Lane Frames');
  const customer = await shop.agent.post('/api/customers').send({ name: 'Odalys Brightwater' });
  const job = await shop.agent.post('/api/jobs').send({ title: 'Saltmarsh Dunwhistlers jersey', customerId: customer.body.customer.id });
  expect(job.status).toBe(201);
  const jobId = job.body.job.id as string;
  return { ...shop, jobId, base: `/api/jobs/${jobId}/pieces` };
}

async function addPiece(agent: Agent, base: string, body: Record<string, unknown> = homeJersey) {
  const res = await agent.post(base).send(body);
  expect(res.status).toBe(201);
  return res.body.piece as { id: string; label: string; widthIn: number; heightIn: number };
}

async function activityKinds(shopId: string, jobId: string) {
  const rows = await h.database.db
    .select({ kind: activity.kind, detail: activity.detail })
    .from(activity)
    .where(and(eq(activity.shopId, shopId), eq(activity.jobId, jobId)));
  return rows;
}

describe('pieces of a job', () => {
  it('a new piece is listed on its job with its size in inches, its notes and no photos', async () => {
    const { agent, base } = await shopWithJob();
    const created = await addPiece(agent, base);
    const list = await agent.get(base);
    expect(list.status).toBe(200);
    expect(list.body.pieces).toEqual([
      { id: created.id, jobId: expect.any(String), kind: 'garment', label: 'Home jersey #31', widthIn: 22.5, heightIn: 30.25, notes: 'Fold sleeves behind', outline: null, createdAt: expect.any(String), photos: [] },
    ]);
  });

  it('pieces list in the order they were added', async () => {
    const { agent, base } = await shopWithJob();
    await addPiece(agent, base, { kind: 'patch', label: 'Anniversary patch', widthIn: 4, heightIn: 4 });
    await addPiece(agent, base, { kind: 'plaque', label: 'Name plaque', widthIn: 6, heightIn: 2 });
    await addPiece(agent, base, { kind: 'photo', label: 'Team photo', widthIn: 8, heightIn: 10 });
    const labels = (await agent.get(base)).body.pieces.map((p: { label: string }) => p.label);
    expect(labels).toEqual(['Anniversary patch', 'Name plaque', 'Team photo']);
  });

  it('owner, designer and front desk can each add, change and remove a piece', async () => {
    const { agent, shopId, base } = await shopWithJob();
    const members = { owner: agent, designer: await addMember(h, shopId, 'designer'), front_desk: await addMember(h, shopId, 'front_desk') };
    for (const [role, member] of Object.entries(members)) {
      const piece = await addPiece(member, base, { kind: 'card', label: `Ticket from ${role}`, widthIn: 2.75, heightIn: 5.5 });
      const changed = await member.patch(`${base}/${piece.id}`).send({ label: `Signed ticket (${role})`, widthIn: 3 });
      expect(changed.status).toBe(200);
      expect(changed.body.piece).toMatchObject({ label: `Signed ticket (${role})`, widthIn: 3, heightIn: 5.5 });
      expect((await member.delete(`${base}/${piece.id}`)).status).toBe(204);
      expect((await member.get(`${base}/${piece.id}`)).status).toBe(404);
    }
    expect((await agent.get(base)).body.pieces).toEqual([]);
  });

  it('adding and removing a piece each leave a line in the job activity naming the piece', async () => {
    const { agent, shopId, jobId, base } = await shopWithJob();
    const piece = await addPiece(agent, base);
    await agent.delete(`${base}/${piece.id}`);
    const rows = await activityKinds(shopId, jobId);
    expect(rows.filter((r) => r.kind !== 'job_created')).toEqual(
      expect.arrayContaining([
        { kind: 'piece_added', detail: { pieceId: piece.id, kind: 'garment', label: 'Home jersey #31' } },
        { kind: 'piece_removed', detail: { pieceId: piece.id, kind: 'garment', label: 'Home jersey #31' } },
      ]),
    );
  });

  it('changing only the notes keeps every other field', async () => {
    const { agent, base } = await shopWithJob();
    const piece = await addPiece(agent, base);
    const res = await agent.patch(`${base}/${piece.id}`).send({ notes: 'Number faces out' });
    expect(res.body.piece).toMatchObject({ kind: 'garment', label: 'Home jersey #31', widthIn: 22.5, heightIn: 30.25, notes: 'Number faces out' });
  });

  it('a signed-out visitor gets 401 for the piece list', async () => {
    const { base } = await shopWithJob();
    const { default: request } = await import('supertest');
    expect((await request(h.app).get(base)).status).toBe(401);
  });
});

describe('sizes', () => {
  it('accepts sizes just above 0 and just under 120 in', async () => {
    const { agent, base } = await shopWithJob();
    const piece = await addPiece(agent, base, { kind: 'other', label: 'Banner', widthIn: 119.99, heightIn: 0.0625 });
    expect(piece).toMatchObject({ widthIn: 119.99, heightIn: 0.0625 });
  });

  it('refuses 0, negative and 120 in sizes, naming each field', async () => {
    const { agent, base } = await shopWithJob();
    const res = await agent.post(base).send({ kind: 'photo', label: 'Team photo', widthIn: 0, heightIn: 120 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ widthIn: 'Width must be more than 0', heightIn: 'Height must be under 120 in' });
    const negative = await agent.post(base).send({ kind: 'photo', label: 'Team photo', widthIn: 8, heightIn: -10 });
    expect(negative.body.error.fields).toEqual({ heightIn: 'Height must be more than 0' });
  });
});

describe('malformed bodies', () => {
  it('a piece with an unknown kind, no label and sizes as text gets 400 naming all four fields, and nothing is added', async () => {
    const { agent, base } = await shopWithJob();
    const res = await agent.post(base).send({ kind: 'hat', label: '  ', widthIn: '8', heightIn: null });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields).toEqual({
      kind: 'Choose what kind of piece this is',
      label: 'Give the piece a short name',
      widthIn: 'Width must be a number of inches',
      heightIn: 'Height must be a number of inches',
    });
    expect((await agent.get(base)).body.pieces).toEqual([]);
  });

  it('an empty change gets 400 and a bad size in a change names that field and keeps the piece as it was', async () => {
    const { agent, base } = await shopWithJob();
    const piece = await addPiece(agent, base);
    const empty = await agent.patch(`${base}/${piece.id}`).send({});
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields).toEqual({ _: 'Send at least one field to change' });
    const bad = await agent.patch(`${base}/${piece.id}`).send({ widthIn: 500 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ widthIn: 'Width must be under 120 in' });
    expect((await agent.get(`${base}/${piece.id}`)).body.piece.widthIn).toBe(22.5);
  });

  it('a body that is not JSON gets 400, not 500', async () => {
    const { agent, base } = await shopWithJob();
    const res = await agent.post(base).set('Content-Type', 'application/json').send('{"kind": "patch",');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });
});

describe('shops are sealed from each other', () => {
  it("every piece route answers 404 for another shop's job and piece, and the piece is untouched", async () => {
    const mine = await shopWithJob();
    const piece = await addPiece(mine.agent, mine.base);
    const other = await signUpShop(h, 'Kestrel Row Framing');
    const pieceUrl = `${mine.base}/${piece.id}`;
    const answers = [
      await other.agent.get(mine.base),
      await other.agent.post(mine.base).send(homeJersey),
      await other.agent.get(pieceUrl),
      await other.agent.patch(pieceUrl).send({ label: 'Taken over' }),
      await other.agent.delete(pieceUrl),
    ];
    expect(answers.map((r) => r.status)).toEqual([404, 404, 404, 404, 404]);
    expect(answers.every((r) => r.body.error.code === 'not_found')).toBe(true);
    expect((await mine.agent.get(mine.base)).body.pieces.map((p: { label: string }) => p.label)).toEqual(['Home jersey #31']);
  });

  it("a piece cannot be reached through another job of the same shop", async () => {
    const mine = await shopWithJob();
    const piece = await addPiece(mine.agent, mine.base);
    const customer = await mine.agent.post('/api/customers').send({ name: 'Tobiah Reedwarren' });
    const second = await mine.agent.post('/api/jobs').send({ title: 'Second job', customerId: customer.body.customer.id });
    const wrongJob = `/api/jobs/${second.body.job.id}/pieces/${piece.id}`;
    expect((await mine.agent.get(wrongJob)).status).toBe(404);
    expect((await mine.agent.delete(wrongJob)).status).toBe(404);
  });

  it('ids that are not UUIDs are 404s, not database errors', async () => {
    const { agent, base } = await shopWithJob();
    expect((await agent.get('/api/jobs/not-a-uuid/pieces')).status).toBe(404);
    expect((await agent.patch(`${base}/42`).send({ label: 'x' })).status).toBe(404);
    expect((await agent.delete(`${base}/42`)).status).toBe(404);
  });
});
