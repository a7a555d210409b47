import { expect, test, type Locator, type Page } from './cspGuard';
import { garmentPhoto } from '../server/test/fixtures/garmentPhoto';

/** Picks a file through the photo button; waiting for the chooser keeps headless Chromium from reporting it cancelled. */
async function pickFile(page: Page, button: Locator, file: { name: string; mimeType: string; buffer: Buffer }) {
  const chooser = page.waitForEvent('filechooser');
  await button.click();
  await (await chooser).element().setInputFiles(file);
}

test('a designer traces a folded jersey from a photo on a phone, corrects a node, saves it, and sees the photo under its window in the designer', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/sign-in');
  await page.getByTestId('email').fill('designer@tallowmere.example');
  await page.getByTestId('password').fill('demo-frames-2026');
  await page.getByTestId('sign-in').click();
  await expect(page.getByText('Tallowmere Frame Works')).toBeVisible();

  const customerId = (await (await page.request.post('/api/customers', { data: { name: 'Rosalind Thackery' } })).json()).customer.id;
  const jobId = (await (await page.request.post('/api/jobs', { data: { title: 'Pellworth Reedgliders home jersey', customerId } })).json()).job.id as string;
  const piece = await page.request.post(`/api/jobs/${jobId}/pieces`, { data: { kind: 'garment', label: 'Home jersey', widthIn: 16, heightIn: 18 } });
  const pieceId = (await piece.json()).piece.id as string;
  const layout = (await (await page.request.post(`/api/jobs/${jobId}/layouts`, { data: { name: 'Home jersey' } })).json()).layout.id as string;

  // The fixture photo: a made-up jersey beside a Letter sheet, seen through a 15 degree tilt.
  const photo = await garmentPhoto(1600, 1200, 15);
  await page.goto(`/jobs/${jobId}`);
  await page.getByTestId('trace-piece-Home jersey').click();
  await expect(page.getByText('Trace Home jersey')).toBeVisible();
  await pickFile(page, page.getByTestId('add-photo-Home jersey'), { name: 'jersey.jpg', mimeType: 'image/jpeg', buffer: photo.jpeg });

  // Matwright proposes the sheet's corners; they sit on the true corners within a few pixels.
  await expect(page.getByTestId('corner-status')).toContainText('found a rectangle', { timeout: 30_000 });
  for (const [i, corner] of photo.sheetCorners.entries()) {
    const mark = page.getByTestId(`mark-${i}`);
    await expect.poll(async () => Math.hypot(Number(await mark.getAttribute('data-x')) - corner.x, Number(await mark.getAttribute('data-y')) - corner.y)).toBeLessThan(8);
  }
  await page.getByTestId('start-trace').click();
  await expect(page).toHaveURL(/trace=/);
  await expect(page.getByTestId('outline-canvas')).toBeVisible({ timeout: 60_000 });

  // Drag one node 30 screen pixels to the right.
  const node = page.getByTestId('outline-node-0');
  await page.getByTestId('outline-canvas').scrollIntoViewIfNeeded();
  const before = Number(await node.getAttribute('cx'));
  const box = (await node.boundingBox())!;
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width / 2 + 15, box.y + box.height / 2, { steps: 3 });
  await page.mouse.move(box.x + box.width / 2 + 30, box.y + box.height / 2, { steps: 3 });
  await page.mouse.up();
  await expect.poll(async () => Number(await node.getAttribute('cx'))).toBeGreaterThan(before + 0.1);
  await expect(page.getByTestId('outline-undo')).toBeEnabled();

  await page.getByTestId('save-outline').click();
  await expect(page.getByTestId('outline-saved')).toBeVisible();

  // In the designer, the garment's window follows the outline and the squared photo lies under it.
  await page.goto(`/layouts/${layout}`);
  await expect(page.getByTestId('designer-phone')).toBeVisible();
  await page.getByTestId('tab-add').click();
  const saves: string[] = [];
  page.on('request', (r) => {
    if (r.method() === 'PUT' && r.url().endsWith(`/api/layouts/${layout}/draft`)) saves.push(r.postData() ?? '');
  });
  await page.getByTestId(`add-piece-${pieceId}`).click();
  const image = page.locator('[data-piece-photo="garment-1"]');
  await expect(image).toHaveCount(1);
  await expect(image).toHaveAttribute('href', /\/api\/traces\/[0-9a-f-]+\/image/);
  const answer = await page.request.get((await image.getAttribute('href'))!);
  expect(answer.headers()['content-type']).toBe('image/jpeg');
  // The photo is drawn at the traced photo's size in inches, wider than the 16 in jersey it shows.
  expect(Number(await image.getAttribute('width'))).toBeGreaterThan(16);

  // The new window's outline is saved with every point once; after that a nudge sends the outline by the name the server gave it.
  await expect(page.getByTestId('save-status')).toHaveText('All changes saved', { timeout: 15_000 });
  const traced = (await (await page.request.get(`/api/layouts/${layout}`)).json()).layout;
  const garment = traced.draft.openings.find((o: { shape: { kind: string } }) => o.shape.kind === 'outline');
  expect(garment.shape.points.length).toBeGreaterThan(20);
  expect(saves.some((body) => body.includes('"points"'))).toBe(true);
  await page.locator(`[data-opening="${garment.id}"]`).click({ force: true });
  await page.keyboard.press('ArrowRight');
  await expect(page.getByTestId('save-status')).toHaveText('All changes saved', { timeout: 15_000 });
  const nudged = saves.at(-1)!;
  expect(nudged).toContain(`"pointsRef":"${traced.outlineRefs[garment.id]}"`);
  expect(nudged).not.toContain('"points"');
  const after = (await (await page.request.get(`/api/layouts/${layout}`)).json()).layout;
  expect(after.draftRevision).toBeGreaterThan(traced.draftRevision);
  const moved = after.draft.openings.find((o: { id: string }) => o.id === garment.id);
  expect(moved.center.x).toBeGreaterThan(garment.center.x);
  expect(moved.shape.points).toEqual(garment.shape.points);
});
