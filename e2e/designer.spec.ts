import { readFileSync } from 'node:fs';
import type { APIRequestContext } from '@playwright/test';
import { expect, test, type Page } from './cspGuard';

const sizes = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1280, height: 800 },
] as const;

const outlineText = readFileSync(new URL('./fixtures/folded-jersey-outline.json', import.meta.url), 'utf8');

/** The shop's owner releases a frozen version for cutting, with a reason, from a session of their own. */
async function releaseAsOwner(request: APIRequestContext, layoutId: string, number: number) {
  expect((await request.post('/api/auth/sign-in', { data: { email: 'owner@tallowmere.example', password: 'demo-frames-2026' } })).status()).toBe(200);
  const res = await request.post(`/api/layouts/${layoutId}/versions/${number}/release`, { data: { reason: 'Customer approved the layout at the counter' } });
  expect(res.status()).toBe(201);
}

async function signInAsDesigner(page: Page) {
  await page.goto('/sign-in');
  await page.getByTestId('email').fill('designer@tallowmere.example');
  await page.getByTestId('password').fill('demo-frames-2026');
  await page.getByTestId('sign-in').click();
  await expect(page.getByText('Tallowmere Frame Works')).toBeVisible();
}

/** A job and a starter layout of its own, so every run starts clean. */
async function newLayout(page: Page, label: string): Promise<string> {
  const customer = await page.request.post('/api/customers', { data: { name: `Ottoline Marchbanks ${label}`, email: 'ottoline@marchbanks.example' } });
  expect(customer.status()).toBe(201);
  const customerId = (await customer.json()).customer.id as string;
  const job = await page.request.post('/api/jobs', { data: { title: `Harrowgate Reedspinners away jersey #9 (${label})`, customerId } });
  expect(job.status()).toBe(201);
  const jobId = (await job.json()).job.id as string;
  const layout = await page.request.post(`/api/jobs/${jobId}/layouts`, { data: { name: 'Jersey, two patches, photo, plaque' } });
  expect(layout.status()).toBe(201);
  return (await layout.json()).layout.id as string;
}

for (const size of sizes) {
  test(`a designer builds a mat stack, sees a narrow bridge, undoes it, and the saved layout and a frozen version come back (${size.name})`, async ({ page, request }) => {
    // The whole walk from an empty layout to a frozen version's cut files; on a shared machine it runs near a minute.
    test.setTimeout(150_000);
    await page.setViewportSize({ width: size.width, height: size.height });
    const phone = size.name === 'phone';
    // The checks run beside the page in a Web Worker of their own (HTML standard, dedicated workers).
    const workers: string[] = [];
    page.on('worker', (worker) => workers.push(worker.url()));
    await signInAsDesigner(page);
    const layoutId = await newLayout(page, size.name);
    await page.goto(`/layouts/${layoutId}`);
    await expect(page.getByTestId(phone ? 'designer-phone' : 'designer-wide')).toBeVisible();
    await expect(page.getByTestId('save-status')).toHaveText('All changes saved');

    // The desktop keeps the add tools in the left column; the phone has them in a tab.
    const showAdd = async () => (phone ? page.getByTestId('tab-add').click() : undefined);
    const showTab = (tab: 'window' | 'mats' | 'checks' | 'versions') => page.getByTestId(`tab-${tab}`).click();
    const setField = async (testId: string, value: string) => {
      const field = page.getByTestId(testId);
      await field.fill(value);
      await field.press('Enter');
    };
    const place = async (x: string, y: string) => {
      await setField('field-x', x);
      await setField('field-y', y);
    };

    // A traced garment window from the fixture outline.
    await showAdd();
    await page.getByTestId('outline-text').fill(outlineText);
    await page.getByTestId('add-outline').click();
    await showTab('window');
    await expect(page.getByTestId('opening-properties')).toContainText('outline-1');
    await place('16', '11');

    // Two 4 in circles, cut in the top mat only.
    for (const [id, y] of [['circle-1', '26'], ['circle-2', '34']] as const) {
      await showAdd();
      await page.getByTestId('add-circle').click();
      await showTab('window');
      await expect(page.getByTestId('opening-properties')).toContainText(id);
      await setField('field-diameter', '4');
      await place('6', y);
      await expect(page.getByTestId('depth-text')).toContainText('Cuts 1 of 2');
    }

    // An 8 x 10 photo overlapped 1/4 in all round, through two mats with a 1/4 in reveal.
    await showAdd();
    await page.getByTestId('add-rectangle').click();
    await showTab('window');
    await setField('field-width', '7 1/2');
    await setField('field-height', '9-1/2"');
    await place('16', '27');
    await page.getByTestId('depth-more').click();
    await expect(page.getByTestId('depth-text')).toContainText('Cuts 2 of 2');
    await setField('field-reveal-2', '1/4');
    await setField('field-clearance', '-1/4');
    // A mistyped length is refused beside the field and changes nothing.
    await setField('field-width', '7 1/');
    await expect(page.getByText(/could not be read as a length/)).toBeVisible();
    await setField('field-width', '7 1/2');
    await expect(page.getByTestId('opening-numbers')).toContainText('7 1/2" x 9 1/2"');

    // A plaque window.
    await showAdd();
    await page.getByTestId('add-rectangle').click();
    await showTab('window');
    await setField('field-width', '8 3/4');
    await setField('field-height', '2 3/4');
    await place('16', '35 1/2');
    await expect(page.locator('[data-opening]')).toHaveCount(5);

    await showTab('checks');
    await expect(page.getByTestId('finding-bridge-narrow')).toHaveCount(0);

    // Drag the lower circle up towards the upper one, holding Alt so it lands exactly where it is let go.
    const upper = (await page.locator('[data-opening="circle-1"]').boundingBox())!;
    const lower = (await page.locator('[data-opening="circle-2"]').boundingBox())!;
    // The circles' centres are 8 in apart; their boxes include the hit target's stroke, so their heights overstate the scale.
    const pixelsPerInch = (lower.y + lower.height / 2 - (upper.y + upper.height / 2)) / 8;
    const start = { x: lower.x + lower.width / 2, y: lower.y + lower.height / 2 };
    // From 8 in apart to 4 1/2 in: under 1/2 in of board left between the two face edges, short of touching.
    const rise = (8 - 4.5) * pixelsPerInch;
    expect(upper.y).toBeLessThan(lower.y);
    await page.mouse.move(start.x, start.y);
    await page.mouse.down();
    await page.keyboard.down('Alt');
    for (let i = 1; i <= 10; i++) await page.mouse.move(start.x, start.y - (rise * i) / 10);
    // Still held: the list says it follows the moving opening, and the narrow bridge is found before letting go.
    await expect(page.getByTestId('checks-pending')).toContainText('Checking as the opening moves');
    await expect(page.getByTestId('finding-bridge-narrow')).toHaveCount(1);
    // While held, the dragged opening is drawn from its lines at the start, shifted.
    await expect(page.locator('[data-opening="circle-2"]')).toHaveAttribute('transform', /translate/);
    await page.keyboard.up('Alt');
    await page.mouse.up();
    await expect(page.getByTestId('checks-pending')).toHaveCount(0);
    await expect(page.getByTestId('finding-bridge-narrow')).toHaveCount(1);
    // Let go, the opening's own lines are drawn where it landed: no shift is left over.
    await expect(page.locator('[data-opening="circle-2"]')).not.toHaveAttribute('transform', /translate/);
    expect(workers.some((url) => url.includes('checksWorker'))).toBe(true);
    // Findings name openings by the piece they show, or by their place in the layout: the circles are the 2nd and 3rd.
    await expect(page.getByTestId('finding-bridge-narrow')).toContainText('opening 2 and opening 3');
    await expect(page.locator('[data-finding="bridge-narrow"]')).toHaveCount(1);
    await page.getByTestId('mat-canvas').screenshot({ path: `e2e/output/designer-bridge-${size.name}.png` });

    // One undo takes the whole drag back.
    await page.getByTestId('undo').click();
    await expect(page.getByTestId('finding-bridge-narrow')).toHaveCount(0);
    await expect(page.locator('[data-finding="bridge-narrow"]')).toHaveCount(0);

    // The draft saves itself; a reload brings back the same layout.
    await expect(page.getByTestId('save-status')).toHaveText('All changes saved', { timeout: 15_000 });
    await page.getByTestId('zoom-fit').click();
    await page.getByTestId('mat-canvas').screenshot({ path: `e2e/output/designer-canvas-${size.name}.png` });
    await page.reload();
    await expect(page.getByTestId('layout-name')).toHaveText('Jersey, two patches, photo, plaque');
    await expect(page.locator('[data-opening]')).toHaveCount(5);
    for (const id of ['outline-1', 'circle-1', 'circle-2', 'rectangle-1', 'rectangle-2']) await expect(page.locator(`[data-opening="${id}"]`)).toHaveCount(1);
    await page.locator('[data-opening="circle-2"]').click({ force: true });
    await showTab('window');
    await expect(page.getByTestId('field-y')).toHaveValue('34"');

    // Freeze the draft as version 1 and look at it.
    await showTab('versions');
    await page.getByTestId('version-note').fill('First look for the customer');
    await page.getByTestId('freeze-version').click();
    await expect(page.getByText('Version 1 is frozen.')).toBeVisible();
    await expect(page.getByTestId('version-1')).toContainText('First look for the customer');
    await page.getByTestId('version-preview-1').click();
    await expect(page.getByTestId('version-picture-1')).toBeVisible();

    // No proof was approved yet, so the cut files wait; the owner releases version 1 with a reason.
    await page.getByTestId('version-cut-files-1').click();
    await expect(page.getByTestId('cut-not-approved')).toContainText('has not approved version 1');
    await expect(page.getByTestId('cut-not-approved')).toContainText('An owner can release this version');
    await releaseAsOwner(request, layoutId, 1);
    await page.reload();
    await showTab('versions');
    await page.getByTestId('version-cut-files-1').click();
    await expect(page.getByTestId('cut-approval')).toContainText('Released for cutting without the customer');
    // The frozen version's cut file for the top mat comes from the server with the job's name.
    const download = page.waitForEvent('download');
    await page.getByTestId('cut-file-1').click();
    expect((await download).suggestedFilename()).toMatch(/-v1-mat1\.dxf$/);
  });
}

test('undoing back to the draft last saved leaves nothing waiting to be saved', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 800 });
  await signInAsDesigner(page);
  const layoutId = await newLayout(page, 'undo to saved');
  await page.goto(`/layouts/${layoutId}`);
  await expect(page.getByTestId('save-status')).toHaveText('All changes saved');
  const saves: string[] = [];
  page.on('request', (req) => {
    if (req.method() === 'PUT' && req.url().endsWith('/draft')) saves.push(req.url());
  });

  // A circle, saved.
  await page.getByTestId('add-circle').click();
  await expect(page.getByTestId('save-status')).toHaveText('All changes saved');
  expect(saves).toHaveLength(1);
  const savedDraft = (await (await page.request.get(`/api/layouts/${layoutId}`)).json()).layout.draft;

  // Another, taken back at once: the layout is again exactly the one saved.
  await page.getByTestId('add-circle').click();
  await expect(page.getByTestId('opening-count')).toContainText('2 of');
  await page.getByTestId('undo').click();
  await expect(page.getByTestId('opening-count')).toContainText('1 of');
  await expect(page.getByTestId('save-status')).toHaveText('All changes saved');
  // Nothing new went out, and what the server holds is still that draft.
  await page.waitForTimeout(2_000); // longer than the autosave's wait, so a late save would show
  expect(saves).toHaveLength(1);
  expect((await (await page.request.get(`/api/layouts/${layoutId}`)).json()).layout.draft).toEqual(savedDraft);
});
