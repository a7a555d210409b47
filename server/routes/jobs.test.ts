import { afterAll, describe, expect, it } from 'vitest';
import { addMember, createHarness, signUpShop } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

async function shopWithJob() {
  const shop = await signUpShop(h);
  const customer = await shop.agent.post('/api/customers').send({ name: 'Wendell Ashgrove', email: 'wendell@example.org', phone: '555-0100' });
  expect(customer.status).toBe(201);
  const job = await shop.agent
    .post('/api/jobs')
    .send({ title: 'Harbourside Lanternjacks jersey #31', customerId: customer.body.customer.id, dueDate: '2027-02-14', notes: 'Sleeves folded back' });
  expect(job.status).toBe(201);
  return { ...shop, customerId: customer.body.customer.id as string, jobId: job.body.job.id as string };
}

describe('customers and jobs', () => {
  it('a new job appears in the shop list with its customer name and first status', async () => {
    const { agent, jobId } = await shopWithJob();
    const list = await agent.get('/api/jobs');
    expect(list.status).toBe(200);
    expect(list.body.jobs).toHaveLength(1);
    expect(list.body.jobs[0]).toMatchObject({
      id: jobId,
      title: 'Harbourside Lanternjacks jersey #31',
      customerName: 'Wendell Ashgrove',
      dueDate: '2027-02-14',
      notes: 'Sleeves folded back',
      status: 'taken_in',
    });
  });

  it('every role of the shop can read and add customers and jobs', async () => {
    const { shopId, customerId } = await shopWithJob();
    for (const role of ['designer', 'front_desk'] as const) {
      const member = await addMember(h, shopId, role);
      expect((await member.get('/api/jobs')).body.jobs).toHaveLength(role === 'designer' ? 1 : 2);
      const res = await member.post('/api/jobs').send({ title: `Added by ${role}`, customerId });
      expect(res.status).toBe(201);
    }
  });

  it('jobs list undated work after dated work, earliest due first', async () => {
    const { agent, customerId } = await shopWithJob();
    await agent.post('/api/jobs').send({ title: 'No date', customerId });
    await agent.post('/api/jobs').send({ title: 'Sooner', customerId, dueDate: '2027-01-03' });
    const titles = (await agent.get('/api/jobs')).body.jobs.map((j: { title: string }) => j.title);
    expect(titles).toEqual(['Sooner', 'Harbourside Lanternjacks jersey #31', 'No date']);
  });

  it('customer search matches part of a name or e-mail, ignoring case', async () => {
    const { agent } = await shopWithJob();
    await agent.post('/api/customers').send({ name: 'Priya Thornbury' });
    expect((await agent.get('/api/customers?q=thorn')).body.customers.map((c: { name: string }) => c.name)).toEqual(['Priya Thornbury']);
    expect((await agent.get('/api/customers?q=EXAMPLE.ORG')).body.customers.map((c: { name: string }) => c.name)).toEqual(['Wendell Ashgrove']);
  });
});

describe('shops are sealed from each other', () => {
  it("a member of another shop gets 404 for this shop's customer and job, and sees none in lists", async () => {
    const mine = await shopWithJob();
    const other = await signUpShop(h, 'Other Town Framers');
    expect((await other.agent.get(`/api/jobs/${mine.jobId}`)).status).toBe(404);
    expect((await other.agent.get(`/api/customers/${mine.customerId}`)).status).toBe(404);
    expect((await other.agent.get('/api/jobs')).body.jobs).toEqual([]);
    expect((await other.agent.get('/api/customers')).body.customers).toEqual([]);
  });

  it("a job cannot be opened for another shop's customer", async () => {
    const mine = await shopWithJob();
    const other = await signUpShop(h, 'Other Town Framers');
    const res = await other.agent.post('/api/jobs').send({ title: 'Sneaky', customerId: mine.customerId });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.customerId).toBe('No such customer in this shop');
  });

  it('an id that is not a UUID is a 404, not a database error', async () => {
    const { agent } = await shopWithJob();
    const res = await agent.get('/api/jobs/12345');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('malformed bodies', () => {
  it('a job without a title or customer gets 400 with both fields named', async () => {
    const { agent } = await shopWithJob();
    const res = await agent.post('/api/jobs').send({ dueDate: '2027-02-30' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      title: 'Give the job a title',
      customerId: 'Choose a customer',
      dueDate: expect.stringMatching(/date/i),
    });
  });

  it('a customer with a bad e-mail gets 400 naming the e-mail field', async () => {
    const { agent } = await shopWithJob();
    const res = await agent.post('/api/customers').send({ name: 'Bad Mail', email: 'nope' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['email']);
  });
});
