import { afterAll, describe, expect, it } from 'vitest';
import { jobStatuses } from '../../features/jobs/schema';
import { addMember, createHarness, moveJobTo, signUpShop } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

async function shopWithCustomer() {
  const shop = await signUpShop(h);
  const c = await shop.agent.post('/api/customers').send({ name: 'Juniper Vale' });
  return { ...shop, customerId: c.body.customer.id as string };
}

describe('job status', () => {
  it('moving a job through the pipeline logs who moved it, from what and to what', async () => {
    const { agent, customerId, shopId } = await shopWithCustomer();
    const job = (await agent.post('/api/jobs').send({ title: 'Gullwing Ravelmoths jersey #5', customerId })).body.job;
    const designer = await addMember(h, shopId, 'designer');

    const moved = await designer.post(`/api/jobs/${job.id}/status`).send({ status: 'designing', note: 'Starting the layout' });
    expect(moved.status).toBe(200);
    expect(moved.body.job.status).toBe('designing');
    expect(Date.parse(moved.body.job.statusChangedAt)).toBeGreaterThanOrEqual(Date.parse(job.statusChangedAt));

    const log = (await agent.get(`/api/jobs/${job.id}/activity`)).body.activity;
    expect(log.map((a: { kind: string }) => a.kind)).toEqual(['status_changed', 'job_created']);
    expect(log[0]).toMatchObject({ memberName: 'Test designer', detail: { from: 'taken_in', to: 'designing', note: 'Starting the layout' } });
  });

  it('a move to the status the job already has is refused with 409', async () => {
    const { agent, customerId } = await shopWithCustomer();
    const job = (await agent.post('/api/jobs').send({ title: 'Same', customerId })).body.job;
    const res = await agent.post(`/api/jobs/${job.id}/status`).send({ status: 'taken_in' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('same_status');
  });

  it('an unknown status is a 400 naming the status field', async () => {
    const { agent, customerId } = await shopWithCustomer();
    const job = (await agent.post('/api/jobs').send({ title: 'Odd', customerId })).body.job;
    const res = await agent.post(`/api/jobs/${job.id}/status`).send({ status: 'lost_in_the_mail' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['status']);
  });

  it("another shop cannot move, edit or read the log of this shop's job", async () => {
    const { agent, customerId } = await shopWithCustomer();
    const job = (await agent.post('/api/jobs').send({ title: 'Private', customerId })).body.job;
    const other = await signUpShop(h, 'Elsewhere Frames');
    expect((await other.agent.post(`/api/jobs/${job.id}/status`).send({ status: 'ready' })).status).toBe(404);
    expect((await other.agent.patch(`/api/jobs/${job.id}`).send({ title: 'Mine now' })).status).toBe(404);
    expect((await other.agent.get(`/api/jobs/${job.id}/activity`)).status).toBe(404);
    expect((await agent.get(`/api/jobs/${job.id}`)).body.job.title).toBe('Private');
  });
});

describe('job list filters', () => {
  async function shopWithManyJobs() {
    const shop = await shopWithCustomer();
    const other = (await shop.agent.post('/api/customers').send({ name: 'Bartholomew Crane' })).body.customer.id;
    const made = [];
    for (const [i, status] of jobStatuses.entries()) {
      const day = String(10 + i).padStart(2, '0');
      const customerId = i % 2 === 0 ? shop.customerId : other;
      const job = (await shop.agent.post('/api/jobs').send({ title: `Job ${i} ${status}`, customerId, dueDate: `2027-05-${day}` })).body.job;
      if (status !== 'taken_in') await moveJobTo(h, shop.agent, job.id, status);
      made.push(job);
    }
    return { ...shop, other, made };
  }

  it('filters by status, due range, customer and text, and reports the total before paging', async () => {
    const { agent, other } = await shopWithManyJobs();
    const byStatus = (await agent.get('/api/jobs?status=cutting,ready')).body;
    expect(byStatus.jobs.map((j: { status: string }) => j.status).sort()).toEqual(['cutting', 'ready']);

    const byDue = (await agent.get('/api/jobs?dueFrom=2027-05-12&dueTo=2027-05-14')).body;
    expect(byDue.jobs.map((j: { dueDate: string }) => j.dueDate)).toEqual(['2027-05-12', '2027-05-13', '2027-05-14']);

    const byCustomer = (await agent.get(`/api/jobs?customerId=${other}`)).body;
    expect(byCustomer.total).toBe(5);
    expect(byCustomer.jobs.every((j: { customerName: string }) => j.customerName === 'Bartholomew Crane')).toBe(true);

    const byText = (await agent.get('/api/jobs?q=crane')).body;
    expect(byText.total).toBe(5);

    const paged = (await agent.get('/api/jobs?limit=4&offset=8&sort=due&order=asc&count=exact')).body;
    expect(paged.total).toBe(jobStatuses.length);
    // Later pages skip the count unless it is asked for.
    expect((await agent.get('/api/jobs?limit=4&offset=8&sort=due&order=asc')).body.total).toBeNull();
    expect(paged.jobs.map((j: { dueDate: string }) => j.dueDate)).toEqual(['2027-05-18', '2027-05-19']);
  });

  it("text search finds the words in a title, in the notes or in the customer's name, any case, each job once, this shop's only", async () => {
    const { agent, customerId } = await shopWithCustomer();
    const heron = (await agent.post('/api/customers').send({ name: 'Mireille Heronsgate' })).body.customer.id;
    const jobs = [
      { title: 'Grey Heron print', customerId, notes: null },
      { title: 'Shadowbox, plain', customerId, notes: 'Customer wants the HERON crest centred' },
      { title: 'Heron Point pennant', customerId: heron, notes: 'heron twice: title, notes and customer' },
      { title: 'Quay regatta photo', customerId: heron, notes: null },
      { title: 'Lighthouse patch', customerId, notes: 'nothing to find here' },
    ];
    for (const job of jobs) await agent.post('/api/jobs').send({ ...job, notes: job.notes ?? undefined });
    const elsewhere = await signUpShop(h, 'Elsewhere Heron Frames');
    const theirCustomer = (await elsewhere.agent.post('/api/customers').send({ name: 'Heron Fielding' })).body.customer.id;
    await elsewhere.agent.post('/api/jobs').send({ title: 'Heron at dusk', customerId: theirCustomer });
    // The same rule worked out here, by brute force over what was sent.
    const names: Record<string, string> = { [heron]: 'Mireille Heronsgate' };
    const expected = jobs.filter((j) => [j.title, j.notes ?? '', names[j.customerId] ?? ''].some((t) => t.toLowerCase().includes('heron'))).map((j) => j.title).sort();
    const found = (await agent.get('/api/jobs?q=hErOn&limit=100')).body;
    expect(found.jobs.map((j: { title: string }) => j.title).sort()).toEqual(expected);
    expect(found.total).toBe(expected.length);
    expect(expected).toHaveLength(4);
  });

  it('sorts by due date descending with undated jobs still last', async () => {
    const { agent, customerId } = await shopWithManyJobs();
    await agent.post('/api/jobs').send({ title: 'No date yet', customerId });
    const jobs = (await agent.get('/api/jobs?sort=due&order=desc&limit=100')).body.jobs;
    expect(jobs[0].dueDate).toBe('2027-05-19');
    expect(jobs.at(-1).title).toBe('No date yet');
  });

  it('a bad filter value is a 400 naming the parameter', async () => {
    const { agent } = await shopWithCustomer();
    const res = await agent.get('/api/jobs?limit=0&sort=colour');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['limit', 'sort']);
  });
});
