import sharp from 'sharp';
import { expect, test, type Browser, type Page } from './cspGuard';
import { elementsPastRightEdge, seriousViolations } from './support/screens';

const mat = (id: string, name: string, color: string) => ({ id, name, color, coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const designWith = (x: number, pieceId: string) => ({
  schemaVersion: 2,
  outer: { width: 20, height: 24 },
  mats: [mat('top', 'Harbour navy', '#1D2B4A'), mat('lower', 'Old gold', '#B8902F')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [{ id: 'jersey', pieceId, pieceSize: { width: 8.5, height: 10.5 }, clearance: -0.25, shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x, y: 12 }, depth: 2, reveals: [0.25] }],
});

/** A new shop (the page keeps the owner's session) with one job and one cuttable layout. */
async function jobWithLayout(page: Page) {
  const email = `owner-proof-${Date.now()}@e2e.example`;
  const request = page.request;
  expect((await request.post('/api/auth/sign-up', { data: { shopName: 'Brackenford Frame Room', name: 'Perpetua Lindqvist', email, password: 'a long enough password' } })).status()).toBe(201);
  const customer = (await (await request.post('/api/customers', { data: { name: 'Casimir Okonjo', email: `casimir-${Date.now()}@customers.example` } })).json()).customer;
  const job = (await (await request.post('/api/jobs', { data: { title: 'Millbrook Hollowpipers #21 jersey', customerId: customer.id } })).json()).job;
  const piece = (await (await request.post(`/api/jobs/${job.id}/pieces`, { data: { kind: 'photo', label: 'Signed team photo', widthIn: 8.5, heightIn: 10.5 } })).json()).piece;
  // An 850 x 1050 scan made here, so the test carries no binary file.
  const png = await sharp({ create: { width: 850, height: 1050, channels: 3, background: { r: 160, g: 40, b: 50 } } }).png().toBuffer();
  const upload = await request.post(`/api/jobs/${job.id}/pieces/${piece.id}/photos`, { multipart: { photo: { name: 'team.png', mimeType: 'image/png', buffer: png } } });
  expect(upload.status()).toBe(201);
  const layout = (await (await request.post(`/api/jobs/${job.id}/layouts`, { data: { name: 'Photo shadowbox', document: designWith(10, piece.id) } })).json()).layout;
  return { jobId: job.id as string, layoutId: layout.id as string, pieceId: piece.id as string };
}

async function sendProofFromJob(page: Page, jobId: string, message: string): Promise<string> {
  await page.goto(`/jobs/${jobId}`);
  await page.getByTestId('proof-message-input').fill(message);
  await page.getByTestId('send-proof').click();
  await expect(page.getByText(/The link was e-mailed to casimir-\d+@customers\.example/)).toBeVisible();
  const link = (await page.getByTestId('proof-link').textContent()) ?? '';
  expect(link).toMatch(/\/proof\/[A-Za-z0-9_-]{43}$/);
  return new URL(link).pathname;
}

/** A browser context with no cookies at all: the customer has no account. */
async function customerPage(browser: Browser, baseURL: string, viewport: { width: number; height: number }) {
  const context = await browser.newContext({ baseURL, viewport });
  expect(await context.cookies()).toEqual([]);
  return { page: await context.newPage(), close: () => context.close() };
}

const jobStatus = async (page: Page, jobId: string) => (await (await page.request.get(`/api/jobs/${jobId}`)).json()).job.status;

/** The zoom the picture is shown at, as the page's zoom script records it on the frame. */
async function pictureZoom(page: Page): Promise<number> {
  return Number(await page.getByTestId('proof-zoom-frame').getAttribute('data-zoom'));
}

/** The picture's drawn width in CSS pixels. */
const pictureWidth = (page: Page) => page.getByTestId('proof-picture').evaluate((el) => el.getBoundingClientRect().width);

/** The customer zooms with a button, a tap and the keyboard; the picture grows inside its frame and never spills past the screen. */
async function customerZooms(page: Page) {
  expect(await pictureZoom(page)).toBe(1);
  const fitted = await pictureWidth(page);
  await page.getByTestId('proof-zoom-in').click();
  await expect.poll(() => pictureZoom(page)).toBe(2);
  expect(Math.round(await pictureWidth(page))).toBe(Math.round(fitted * 2));
  // Zoomed, the picture scrolls inside its frame: the page itself stays as wide as the screen.
  expect(await page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
  await page.getByTestId('proof-zoom-fit').click();
  await expect.poll(() => pictureZoom(page)).toBe(1);
  // A tap on the picture zooms in one step; a second tap shows the whole design again.
  await page.getByTestId('proof-zoom-frame').click();
  await expect.poll(() => pictureZoom(page)).toBe(2);
  await page.getByTestId('proof-zoom-frame').click();
  await expect.poll(() => pictureZoom(page)).toBe(1);
  await page.getByTestId('proof-zoom-frame').focus();
  await page.keyboard.press('+');
  await expect.poll(() => pictureZoom(page)).toBe(2);
  await page.keyboard.press('0');
  await expect.poll(() => pictureZoom(page)).toBe(1);
  expect(Math.round(await pictureWidth(page))).toBe(Math.round(fitted));
}

const sizes = [
  { name: 'phone', viewport: { width: 390, height: 844 } },
  { name: 'desktop', viewport: { width: 1280, height: 800 } },
] as const;

for (const { name, viewport } of sizes) {
  test(`a proof goes out, the customer asks for changes with a sketch, a new proof replaces it, the customer approves and a cut file is made (${viewport.width} x ${viewport.height})`, async ({ page, browser, baseURL }) => {
    // A long walk through two browsers; the machine running it may be shared.
    test.setTimeout(420_000);
    await page.setViewportSize(viewport);
    const { jobId, layoutId, pieceId } = await jobWithLayout(page);
    const firstPath = await sendProofFromJob(page, jobId, 'Here is the first idea for your jersey');
    await expect(page.getByTestId('proof-state').first()).toHaveText('Sent');
    expect(await jobStatus(page, jobId)).toBe('awaiting_approval');

    const customer = await customerPage(browser, baseURL!, viewport);
    const photo = customer.page.waitForResponse((r) => /\/api\/proofs\/[^/]+\/pieces\/0\/photo$/.test(r.url()));
    const response = await customer.page.goto(firstPath);
    expect(response!.headers()['referrer-policy']).toBe('no-referrer');
    expect(response!.headers()['x-robots-tag']).toContain('noindex');
    await expect(customer.page.getByTestId('proof-title')).toHaveText('Millbrook Hollowpipers #21 jersey');
    await expect(customer.page.getByTestId('proof-picture')).toBeVisible();
    await expect(customer.page.getByTestId('proof-outer')).toContainText('20" wide by 24" high');
    await expect(customer.page.getByText('Signed team photo: 8 1/2" by 10 1/2"')).toBeVisible();
    // The photo lies under its opening at the piece's size, fetched through the link with no cookies.
    await expect(customer.page.locator('[data-piece-photo="jersey"]')).toHaveAttribute('width', '8.5');
    expect((await photo).status()).toBe(200);
    await customer.page.screenshot({ path: `e2e/output/proof-${name}.png`, fullPage: true });
    expect(await elementsPastRightEdge(customer.page)).toEqual([]);
    expect(await seriousViolations(customer.page)).toEqual([]);
    await customerZooms(customer.page);
    expect(await elementsPastRightEdge(customer.page)).toEqual([]);

    await customer.page.getByTestId('proof-comment').fill('Could the gold mat be a little wider?');
    const sketch = await sharp({ create: { width: 600, height: 400, channels: 3, background: { r: 240, g: 236, b: 220 } } }).jpeg().toBuffer();
    await customer.page.getByTestId('proof-sketch').setInputFiles({ name: 'my-sketch.jpg', mimeType: 'image/jpeg', buffer: sketch });
    await customer.page.getByTestId('proof-send-changes').click();
    await expect(customer.page.getByTestId('proof-answered')).toContainText('Could the gold mat be a little wider?');
    await expect(customer.page.getByTestId('proof-answered')).toContainText('Your photo went with it.');

    await page.reload();
    await expect(page.getByTestId('job-status')).toHaveText('Designing');
    await expect(page.getByTestId('proof-changes-asked')).toContainText('Could the gold mat be a little wider?');
    await expect(page.getByTestId('proof-changes-photo')).toBeVisible();
    await expect(page.getByTestId('activity')).toContainText('Could the gold mat be a little wider?');
    expect(await elementsPastRightEdge(page)).toEqual([]);
    expect(await seriousViolations(page)).toEqual([]);
    await expect(page.getByTestId('proof-state').first()).toHaveText('Changes asked');
    expect(await jobStatus(page, jobId)).toBe('designing');

    // The designer moves the opening and sends the changed design.
    const layout = (await (await page.request.get(`/api/layouts/${layoutId}`)).json()).layout;
    expect((await page.request.put(`/api/layouts/${layoutId}/draft`, { data: { document: designWith(9.5, pieceId), baseRevision: layout.draftRevision } })).status()).toBe(200);
    const secondPath = await sendProofFromJob(page, jobId, 'Moved the opening a little');
    const thirdPath = await sendProofFromJob(page, jobId, 'Same design, fresh link');
    expect(thirdPath).not.toBe(secondPath);

    // The replaced link and the first (answered, then replaced) link say the proof is closed, and why that may be.
    for (const old of [secondPath, firstPath]) {
      await customer.page.goto(old);
      await expect(customer.page.getByRole('heading', { name: 'This proof is closed' })).toBeVisible();
      await expect(customer.page.getByTestId('proof-closed')).toHaveText(/newer one: use the link in their latest message/);
      await expect(customer.page.getByTestId('proof-picture')).toHaveCount(0);
    }
    await customer.page.screenshot({ path: `e2e/output/proof-${name}-closed.png`, fullPage: true });

    await customer.page.goto(thirdPath);
    await customer.page.getByTestId('proof-approve').click();
    await expect(customer.page.getByText('Type your name to approve')).toBeVisible();
    await customer.page.getByTestId('proof-name').fill('Casimir Okonjo');
    await customer.page.getByTestId('proof-approve').click();
    await expect(customer.page.getByTestId('proof-answered')).toContainText('Approved by Casimir Okonjo');
    await customer.page.screenshot({ path: `e2e/output/proof-${name}-approved.png`, fullPage: true });
    await customer.close();

    await page.reload();
    await expect(page.getByTestId('job-status')).toHaveText('Approved');
    await expect(page.getByTestId('proof-state').first()).toHaveText('Approved');
    await expect(page.getByTestId('proofs-section').getByText('Approved by Casimir Okonjo')).toBeVisible();
    expect(await jobStatus(page, jobId)).toBe('approved');
    // The approved version makes a cut file.
    const approved = (await (await page.request.get(`/api/jobs/${jobId}/proofs`)).json()).proofs[0];
    const cut = await page.request.get(`/api/layouts/${layoutId}/versions/${approved.versionNumber}/export?format=dxf&profile=default&mat=1`);
    expect(cut.status()).toBe(200);
    // A DXF file ends with the EOF group (AutoCAD DXF reference).
    expect((await cut.text()).trim().endsWith('EOF')).toBe(true);
  });
}
