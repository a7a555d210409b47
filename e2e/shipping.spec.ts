import sharp from 'sharp';
import { expect as baseExpect, test, type Browser, type Page } from './cspGuard';
import { elementsPastRightEdge, seriousViolations } from './support/screens';

// The machine running these is shared: a page may take longer than the default 10 s to appear.
const expect = baseExpect.configure({ timeout: 30_000 });

const mat = (id: string, color: string) => ({ id, name: id, color, coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const design = {
  schemaVersion: 2,
  outer: { width: 20, height: 16 },
  mats: [mat('top', '#1D2B4A'), mat('lower', '#B8902F')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [{ id: 'jersey', shape: { kind: 'rectangle', width: 8, height: 6 }, center: { x: 10, y: 8 }, depth: 1 }],
};

/** A new shop (the page keeps the owner's session) with a job in acrylic whose proof the customer approved. */
async function approvedJob(page: Page) {
  const request = page.request;
  const email = `owner-ship-${Date.now()}@e2e.example`;
  expect((await request.post('/api/auth/sign-up', { data: { shopName: 'Larkspur Quay Frames', name: 'Tamsin Oakridge', email, password: 'a long enough password' } })).status()).toBe(201);
  const customerEmail = `bram-${Date.now()}@customers.example`;
  const customer = (await (await request.post('/api/customers', { data: { name: 'Bram Hollins', email: customerEmail } })).json()).customer;
  const frame = { mouldingCode: 'BX-150', glazingKind: 'acrylic', shadowboxDepthIn: 2 };
  const job = (await (await request.post('/api/jobs', { data: { title: 'Fenwick Marshharriers #4 jersey', customerId: customer.id, frame } })).json()).job;
  const layout = (await (await request.post(`/api/jobs/${job.id}/layouts`, { data: { name: 'Shadowbox', document: design } })).json()).layout;
  const sent = await (await request.post(`/api/jobs/${job.id}/proofs`, { data: { layoutId: layout.id, baseRevision: 1 } })).json();
  const token = String(sent.link).split('/proof/')[1];
  expect((await request.post(`/api/proofs/${token}/decision`, { data: { decision: 'approve', name: 'Bram Hollins' } })).status()).toBe(200);
  return { jobId: job.id as string, customerEmail };
}

/** The one place the job is brought from approved to ready, following the shop's order of statuses. */
async function readyToShip(page: Page, jobId: string) {
  for (const status of ['cutting', 'assembling', 'ready']) {
    expect((await page.request.post(`/api/jobs/${jobId}/status`, { data: { status } })).status()).toBe(200);
  }
}

/** A browser context with no cookies at all: the customer has no account. */
async function customerPage(browser: Browser, baseURL: string, viewport: { width: number; height: number }) {
  const context = await browser.newContext({ baseURL, viewport });
  expect(await context.cookies()).toEqual([]);
  return { page: await context.newPage(), close: () => context.close() };
}

const sizes = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1280, height: 800 },
] as const;

for (const size of sizes) {
  test(`the job is shipped with a tracking number, the e-mail is in the outbox, and the customer tells how it arrived (${size.width} x ${size.height})`, async ({ page, browser, baseURL }) => {
    // Two browser contexts, an upload and the outbox: more steps than the default minute allows on a shared machine.
    test.setTimeout(180_000);
    const viewport = { width: size.width, height: size.height };
    await page.setViewportSize(viewport);
    const { jobId, customerEmail } = await approvedJob(page);
    await readyToShip(page, jobId);

    await page.goto(`/jobs/${jobId}`);
    await expect(page.getByTestId('estimate-glass')).toBeVisible();
    await expect(page.getByTestId('estimate-acrylic')).toContainText('(chosen)');
    // 20 x 16 in layout, 1.5 in face, 2.5 in deep, 2 in padding: 27 x 23 x 7 in; 4347 / 139 = 31.3, billed 32 lb.
    await expect(page.getByTestId('box-acrylic')).toHaveText('27 x 23 x 7 in');
    await expect(page.getByTestId('billed-acrylic')).toHaveText('32 lb');
    await expect(page.getByTestId('hanging-caution')).toContainText('twice the weight');
    await expect(page.getByTestId('packing-list')).toContainText('Acrylic: do not use glass cleaner');
    await expect(page.getByTestId('packing-list')).toContainText('THIS SIDE UP');
    expect(await elementsPastRightEdge(page)).toEqual([]);
    expect(await seriousViolations(page)).toEqual([]);

    await page.getByTestId('tracking-number').fill('1ZL 5520-77');
    await page.getByTestId('mark-shipped').click();
    await expect(page.getByTestId('shipment')).toContainText('tracking number 1ZL 5520-77');
    await expect(page.getByTestId('activity')).toContainText('to Shipped');

    await page.goto('/outbox');
    await page.getByRole('button', { name: new RegExp(`is on its way, to ${customerEmail.replace(/[.+]/g, '\\$&')}`) }).click();
    const body = page.getByTestId('outbox-body');
    await expect(body).toContainText('https://parcels.example/track?number=1ZL%205520-77');
    const arrivalLink = ((await body.textContent()) ?? '').match(/https?:\/\/[^\s]+\/proof\/[A-Za-z0-9_-]{43}/)?.[0];
    expect(arrivalLink).toBeTruthy();

    const customer = await customerPage(browser, baseURL!, viewport);
    await customer.page.goto(new URL(arrivalLink!).pathname);
    await expect(customer.page.getByRole('heading', { name: 'How did it arrive?' })).toBeVisible();
    await customer.page.getByTestId('arrival-comment-field').fill('Came through without a scratch, it is on the wall');
    await customer.page.getByTestId('arrival-send').click();
    await expect(customer.page.getByTestId('arrival-thanks')).toBeVisible();
    const png = await sharp({ create: { width: 640, height: 480, channels: 3, background: { r: 90, g: 120, b: 80 } } }).png().toBuffer();
    await customer.page.getByTestId('arrival-photo-file').setInputFiles({ name: 'wall.png', mimeType: 'image/png', buffer: png });
    await customer.page.getByTestId('arrival-add-photo').click();
    await expect(customer.page.getByTestId('arrival-own-photo')).toHaveCount(1);
    expect(await elementsPastRightEdge(customer.page)).toEqual([]);
    expect(await seriousViolations(customer.page)).toEqual([]);
    await customer.page.screenshot({ path: `e2e/output/arrival-${size.name}.png`, fullPage: true });
    await customer.close();

    await page.goto(`/jobs/${jobId}`);
    await expect(page.getByTestId('arrival-comment')).toContainText('Came through without a scratch');
    await expect(page.getByTestId('arrival-photo')).toHaveCount(1);
    await page.getByTestId('showcase-0').click();
    await expect(page.getByTestId('showcase-mark')).toHaveText('Showcase photo');
    const report = await (await page.request.get(`/api/jobs/${jobId}/arrival`)).json();
    expect(report.photos.map((p: { showcase: boolean }) => p.showcase)).toEqual([true]);
  });
}
