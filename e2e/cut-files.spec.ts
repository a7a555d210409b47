import { expect, test, type APIRequestContext } from './cspGuard';

const mat = (id: string, name: string, color: string) => ({ id, name, color, coreColor: '#F6F3EA', ply: 4, thickness: 0.055, bevelAngle: 45, sheet: { width: 32, height: 40 } });
const document = {
  schemaVersion: 2,
  outer: { width: 16, height: 20 },
  mats: [mat('top', 'Harbour navy', '#1D2B4A'), mat('lower', 'Old gold', '#B8902F')],
  mountingBoard: { color: '#FFFFFF', cut: false },
  openings: [
    { id: 'photo', shape: { kind: 'rectangle', width: 8, height: 10 }, center: { x: 6, y: 8 }, depth: 2, reveals: [0.25] },
    { id: 'patch', shape: { kind: 'circle', radius: 2 }, center: { x: 12, y: 15 }, depth: 1 },
  ],
};

/** A new shop with one job whose layout is frozen at version 1; the page's cookies carry the owner's session. */
async function frozenVersion(request: APIRequestContext) {
  const email = `owner-cut-${Date.now()}@e2e.example`;
  expect((await request.post('/api/auth/sign-up', { data: { shopName: 'Gullwing Frame Loft', name: 'Tamsin Vorley', email, password: 'a long enough password' } })).status()).toBe(201);
  const customer = (await (await request.post('/api/customers', { data: { name: 'Idris Fenwhistle' } })).json()).customer;
  const job = (await (await request.post('/api/jobs', { data: { title: 'Harrowgate Reedspinners #7', customerId: customer.id } })).json()).job;
  const layout = (await (await request.post(`/api/jobs/${job.id}/layouts`, { data: { name: 'Jersey and patch', document } })).json()).layout;
  expect((await request.post(`/api/layouts/${layout.id}/versions`, { data: { baseRevision: 1 } })).status()).toBe(201);
  // The customer approved it at the counter: the owner releases version 1 for cutting.
  const release = await request.post(`/api/layouts/${layout.id}/versions/1/release`, { data: { reason: 'Approved at the counter' } });
  expect(release.status()).toBe(201);
  return `/api/layouts/${layout.id}/versions/1`;
}

test('a download link saves the cut file under the name the server gives it', async ({ page }) => {
  const base = await frozenVersion(page.request);
  await page.goto('/api/health');
  await page.setContent(`<a id="file" href="${base}/export?format=dxf&profile=default&mat=1" download>Mat 1</a>`);
  const [download] = await Promise.all([page.waitForEvent('download'), page.click('#file')]);
  expect(download.suggestedFilename()).toBe('harrowgate-reedspinners-7-v1-mat1.dxf');
});

test('the cut sheet lists every mat and opening, and printing drops the on-screen hint but keeps the cautions', async ({ page }) => {
  const base = await frozenVersion(page.request);
  await page.goto(`${base}/cut-sheet`);
  await expect(page.getByRole('heading', { name: 'Harrowgate Reedspinners #7' })).toBeVisible();
  await expect(page.locator('section.board')).toHaveCount(2);
  // Mat 1: the photo's back edge is the 8 x 10 sight plus a 1/4 in reveal each side.
  // Openings are named by the piece they show, or by their place in the layout: the photo opening is the first.
  await expect(page.locator('section.board').first().locator('tr', { hasText: 'Opening 1' })).toContainText('8 1/2" × 10 1/2"');
  // Each cut number is drawn on the board's picture too.
  await expect(page.locator('section.board').first().locator('text.cut-number')).not.toHaveCount(0);
  // The drawing of each mat keeps the board's proportions (16 x 20).
  const box = await page.locator('section.board figure svg').first().boundingBox();
  expect(box!.height / box!.width).toBeCloseTo(20 / 16, 2);
  await page.emulateMedia({ media: 'print' });
  await expect(page.locator('.screen-only')).toBeHidden();
  await expect(page.getByText('sharps container')).toBeVisible();
  await page.screenshot({ path: 'e2e/output/cut-sheet-print.png', fullPage: true });
});
