import { afterAll, describe, expect, it } from 'vitest';
import { addMember, createHarness, signUpShop } from '../test/harness';

const h = createHarness();
afterAll(() => h.database.close());

describe('customers', () => {
  it('editing a customer changes only the fields sent', async () => {
    const { agent } = await signUpShop(h);
    const c = (await agent.post('/api/customers').send({ name: 'Odile Fenwright', phone: '555-0110' })).body.customer;
    const res = await agent.patch(`/api/customers/${c.id}`).send({ address: '7 Lark Hill, Port Wendle' });
    expect(res.status).toBe(200);
    expect(res.body.customer).toMatchObject({ name: 'Odile Fenwright', phone: '555-0110', address: '7 Lark Hill, Port Wendle' });
  });

  it('deleting a customer with jobs is refused with a clear message and loses nothing', async () => {
    const { agent } = await signUpShop(h);
    const c = (await agent.post('/api/customers').send({ name: 'Has Jobs' })).body.customer;
    await agent.post('/api/jobs').send({ title: 'Keep me', customerId: c.id });
    const res = await agent.delete(`/api/customers/${c.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('This customer has 1 job, so they cannot be deleted. Archive them instead to hide them from lists.');
    expect((await agent.get(`/api/customers/${c.id}`)).status).toBe(200);
    expect((await agent.get('/api/jobs')).body.jobs.map((j: { title: string }) => j.title)).toEqual(['Keep me']);
  });

  it('the recent order lists the newest customer first and still filters by the search', async () => {
    const { agent } = await signUpShop(h);
    for (const name of ['Avery Quillfeather', 'Zelda Pennyroyal', 'Milo Quillon']) {
      expect((await agent.post('/api/customers').send({ name })).status).toBe(201);
    }
    const names = async (query: string) => (await agent.get(`/api/customers?${query}`)).body.customers.map((c: { name: string }) => c.name);
    expect(await names('order=recent')).toEqual(['Milo Quillon', 'Zelda Pennyroyal', 'Avery Quillfeather']);
    expect(await names('')).toEqual(['Avery Quillfeather', 'Milo Quillon', 'Zelda Pennyroyal']);
    expect(await names('order=recent&q=quill')).toEqual(['Milo Quillon', 'Avery Quillfeather']);
    const refused = await agent.get('/api/customers?order=sideways');
    expect(refused.status).toBe(400);
  });

  it('lists customers a page at a time, in name order with no one repeated or skipped, counting only the first page', async () => {
    const { agent } = await signUpShop(h);
    const names = Array.from({ length: 23 }, (_, i) => `Paged Customer ${String.fromCharCode(65 + ((i * 7) % 23))}${i}`);
    for (const name of names) expect((await agent.post('/api/customers').send({ name })).status).toBe(201);
    const pages = [];
    for (let offset = 0; offset < 30; offset += 10) pages.push((await agent.get(`/api/customers?limit=10&offset=${offset}`)).body);
    expect(pages.map((p) => p.customers.length)).toEqual([10, 10, 3]);
    expect(pages.map((p) => p.total)).toEqual([23, null, null]);
    // The independent order: JavaScript's own sort of the names sent (plain ASCII, so byte order equals the database's).
    expect(pages.flatMap((p) => p.customers.map((c: { name: string }) => c.name))).toEqual([...names].sort());
    expect((await agent.get('/api/customers?limit=10&offset=10&count=exact')).body.total).toBe(23);
    expect((await agent.get('/api/customers?limit=1000')).status).toBe(400);
  });

  it('a customer without jobs can be deleted', async () => {
    const { agent } = await signUpShop(h);
    const c = (await agent.post('/api/customers').send({ name: 'Walk-in' })).body.customer;
    expect((await agent.delete(`/api/customers/${c.id}`)).status).toBe(204);
    expect((await agent.get(`/api/customers/${c.id}`)).status).toBe(404);
  });

  it('an archived customer leaves the list but keeps their jobs and comes back on request', async () => {
    const { agent } = await signUpShop(h);
    const c = (await agent.post('/api/customers').send({ name: 'Old Regular' })).body.customer;
    await agent.post('/api/jobs').send({ title: 'Their last job', customerId: c.id });
    const archived = await agent.patch(`/api/customers/${c.id}`).send({ archived: true });
    expect(archived.body.customer.archivedAt).not.toBeNull();
    expect((await agent.get('/api/customers')).body.customers).toEqual([]);
    expect((await agent.get('/api/customers?includeArchived=true')).body.customers.map((x: { name: string }) => x.name)).toEqual(['Old Regular']);
    expect((await agent.get('/api/jobs')).body.total).toBe(1);
  });

  it("a customer's jobs are listed by customer id", async () => {
    const { agent } = await signUpShop(h);
    const a = (await agent.post('/api/customers').send({ name: 'Alma' })).body.customer;
    const b = (await agent.post('/api/customers').send({ name: 'Bruno' })).body.customer;
    await agent.post('/api/jobs').send({ title: 'For Alma', customerId: a.id });
    await agent.post('/api/jobs').send({ title: 'For Bruno', customerId: b.id });
    expect((await agent.get(`/api/jobs?customerId=${a.id}`)).body.jobs.map((j: { title: string }) => j.title)).toEqual(['For Alma']);
  });

  it('a designer may edit but not delete customers; front desk may delete', async () => {
    const { agent, shopId } = await signUpShop(h);
    const c = (await agent.post('/api/customers').send({ name: 'Role Check' })).body.customer;
    const designer = await addMember(h, shopId, 'designer');
    expect((await designer.patch(`/api/customers/${c.id}`).send({ notes: 'Prefers e-mail' })).status).toBe(200);
    expect((await designer.delete(`/api/customers/${c.id}`)).status).toBe(403);
    const desk = await addMember(h, shopId, 'front_desk');
    expect((await desk.delete(`/api/customers/${c.id}`)).status).toBe(204);
  });

  it("another shop gets 404 editing or deleting this shop's customer", async () => {
    const { agent } = await signUpShop(h);
    const c = (await agent.post('/api/customers').send({ name: 'Mine' })).body.customer;
    const other = await signUpShop(h, 'Far Away Frames');
    expect((await other.agent.patch(`/api/customers/${c.id}`).send({ name: 'Stolen' })).status).toBe(404);
    expect((await other.agent.delete(`/api/customers/${c.id}`)).status).toBe(404);
    expect((await agent.get(`/api/customers/${c.id}`)).body.customer.name).toBe('Mine');
  });

  it('an empty edit is a 400', async () => {
    const { agent } = await signUpShop(h);
    const c = (await agent.post('/api/customers').send({ name: 'Nothing' })).body.customer;
    const res = await agent.patch(`/api/customers/${c.id}`).send({});
    expect(res.status).toBe(400);
  });
});
