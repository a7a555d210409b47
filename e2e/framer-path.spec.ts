import { expect, test, type Page } from './cspGuard';
import sharp from 'sharp';
import { createCustomer, createJob, createLayout, demoOwner, desktop, newShop, phone, signIn } from './support/screens';

// NIST Handbook 44, Appendix C: 1 in = 25.4 mm exactly.
const MM = 25.4;

async function openDesigner(page: Page, layoutId: string) {
  await page.goto(`/layouts/${layoutId}`);
  await expect(page.getByTestId('save-status')).toHaveText('All changes saved');
}

async function setField(page: Page, testId: string, text: string) {
  const field = page.getByTestId(testId);
  await field.fill(text);
  await field.press('Enter');
}

test('the job page counts the versions frozen of each layout (1280 x 800)', async ({ page }) => {
  await page.setViewportSize(desktop);
  await signIn(page, demoOwner);
  const jobId = await createJob(page.request, 'Vellmoor Saltspinners jersey #6', await createCustomer(page.request, 'Orla Pendergast'));
  const layout = await createLayout(page.request, jobId);
  expect((await page.request.post(`/api/layouts/${layout.id}/versions`, { data: { baseRevision: 1 } })).status()).toBe(201);
  const second = await createLayout(page.request, jobId, 'Second idea');
  await page.goto(`/jobs/${jobId}`);
  await expect(page.getByTestId(`layout-link-${layout.id}`)).toContainText('1 version frozen');
  await expect(page.getByTestId(`layout-link-${second.id}`)).toContainText('no versions frozen');
});

test.describe('on a phone (390 x 844)', () => {
  test.use({ viewport: phone });

  test('undo keeps the chosen opening chosen, and its read-out stays in view', async ({ page }) => {
    await signIn(page, demoOwner);
    const jobId = await createJob(page.request, 'Undo check', await createCustomer(page.request, 'Ansel Varrow'));
    await openDesigner(page, (await createLayout(page.request, jobId)).id);
    await page.getByTestId('tab-add').click();
    await page.getByTestId('add-rectangle').click();
    await page.getByTestId('tab-window').click();
    const readout = page.getByTestId('selection-readout');
    await expect(readout).toBeVisible();
    const before = await readout.textContent();
    await setField(page, 'field-width', '9');
    await expect(readout).toContainText('9"');
    await page.getByTestId('undo').click();
    await expect(readout).toBeVisible();
    await expect(readout).toHaveText(before!);
    await page.getByTestId('redo').click();
    await expect(readout).toContainText('9"');
  });

  test('the canvas shows the 32 x 40 board large, the read-out sits below it, and the bar and tabs fit', async ({ page }) => {
    await signIn(page, demoOwner);
    const jobs = (await (await page.request.get('/api/jobs?q=Tidewicks%20home')).json()).jobs as { id: string }[];
    const layouts = (await (await page.request.get(`/api/jobs/${jobs[0]!.id}/layouts`)).json()).layouts as { id: string }[];
    await page.goto(`/layouts/${layouts[0]!.id}`);
    const canvas = (await page.getByTestId('mat-canvas').boundingBox())!;
    await page.locator('[data-opening="plaque"]').waitFor({ state: 'attached' });
    // Choose the plaque: its read-out must not cover any opening, the plaque included.
    await page.getByTestId('tab-window').click();
    const plaque = (await page.locator('[data-opening="plaque"]').boundingBox())!;
    await page.mouse.click(plaque.x + plaque.width / 2, plaque.y + 2);
    const readout = (await page.getByTestId('selection-readout').boundingBox())!;
    expect(readout.y).toBeGreaterThanOrEqual(canvas.y + canvas.height - 0.5);
    for (const opening of await page.locator('[data-opening]').all()) {
      const box = (await opening.boundingBox())!;
      expect(box.y + box.height).toBeLessThanOrEqual(canvas.y + canvas.height);
    }
    // The 32 in wide board fills most of the 390 px screen (it was 258 px).
    const board = (await page.locator('[data-testid="mat-canvas"] svg rect[width="32"][height="40"]').last().boundingBox())!;
    expect(board.width).toBeGreaterThan(320);
    expect(board.height / board.width).toBeCloseTo(40 / 32, 2);
    // Every place in the shop bar and every designer tab is inside the screen.
    for (const id of ['nav-settings', 'tab-versions', 'tab-checks', 'redo']) {
      const box = (await page.getByTestId(id).boundingBox())!;
      expect(box.x + box.width, id).toBeLessThanOrEqual(phone.width);
    }
    // The shop's name is shown whole, not cut with an ellipsis.
    const name = page.getByTestId('shop-name-bar');
    await expect(name).toHaveText('Tallowmere Frame Works');
    expect(await name.evaluate((el) => el.scrollWidth <= el.clientWidth && el.scrollHeight <= el.clientHeight + 1)).toBe(true);
  });

  test('in a millimetre shop a bare number is millimetres in the designer, the settings and the piece form', async ({ page }) => {
    await newShop(page.request, 'mm-shop');
    const settings = (await (await page.request.get('/api/settings')).json()).settings;
    expect((await page.request.put('/api/settings', { data: { ...settings, units: 'mm', rounding: '0.5mm' } })).status()).toBe(200);
    const jobId = await createJob(page.request, 'Metric shadowbox', await createCustomer(page.request, 'Ilse Grunewald'));
    const layout = await createLayout(page.request, jobId);

    await openDesigner(page, layout.id);
    await page.getByTestId('tab-add').click();
    await page.getByTestId('add-rectangle').click();
    await page.getByTestId('tab-window').click();
    await expect(page.getByTestId('field-width')).toHaveValue(/ mm$/);
    await setField(page, 'field-width', '83');
    await expect(page.getByTestId('selection-readout')).toContainText('83 mm x');
    await expect(page.getByTestId('save-status')).toHaveText('All changes saved');
    const draft = (await (await page.request.get(`/api/layouts/${layout.id}`)).json()).layout.draft;
    expect(draft.openings[0].shape.width).toBeCloseTo(83 / MM, 6);

    await page.goto('/settings');
    await page.getByTestId('default-reveal').fill('6');
    await page.getByTestId('save-settings').click();
    await expect(page.getByTestId('settings-saved')).toBeVisible();
    const saved = (await (await page.request.get('/api/settings')).json()).settings;
    expect(saved.defaultRevealIn).toBeCloseTo(6 / MM, 6);

    await page.goto(`/jobs/${jobId}`);
    await page.getByTestId('add-piece').click();
    await page.getByTestId('piece-kind-plaque').click();
    await page.getByTestId('piece-label').fill('Name plaque');
    await page.getByTestId('piece-width').fill('216');
    await page.getByTestId('piece-height').fill('2 in');
    await page.getByTestId('save-piece').click();
    await expect(page.getByTestId('piece-row-Name plaque').getByTestId('piece-size')).toHaveText('216 x 51 mm');
  });

  test('a length typed as 4½ reads as four and a half, and 1e3 is refused as computer notation', async ({ page }) => {
    await newShop(page.request, 'fractions');
    const jobId = await createJob(page.request, 'Fractions', await createCustomer(page.request, 'Tobiah Crane'));
    await page.goto(`/jobs/${jobId}`);
    await page.getByTestId('add-piece').click();
    await page.getByTestId('piece-kind-plaque').click();
    await page.getByTestId('piece-label').fill('Plaque');
    await page.getByTestId('piece-width').fill('4½');
    await page.getByTestId('piece-height').fill('1e3');
    await page.getByTestId('save-piece').click();
    await expect(page.getByText(/"1e3" is a number in computer notation/)).toBeVisible();
    await expect(page.getByText(/is not known/)).toHaveCount(0);
    await page.getByTestId('piece-height').fill('2¾"');
    await page.getByTestId('save-piece').click();
    await expect(page.getByTestId('piece-row-Plaque').getByTestId('piece-size')).toHaveText('4 1/2 x 2 3/4 in');
  });

  test("a plaque's thumbnail shows the whole photo, not a square crop", async ({ page }) => {
    await newShop(page.request, 'thumbs');
    const jobId = await createJob(page.request, 'Plaque photo', await createCustomer(page.request, 'Mireille Oakhart'));
    const piece = await page.request.post(`/api/jobs/${jobId}/pieces`, { data: { kind: 'plaque', label: 'Plaque', widthIn: 9, heightIn: 3 } });
    const pieceId = (await piece.json()).piece.id as string;
    // A 1200 x 400 picture of a 9 x 3 in plaque, made here so the test carries no binary file.
    const png = await sharp({ create: { width: 1200, height: 400, channels: 3, background: '#6b5a2e' } }).png().toBuffer();
    const upload = await page.request.post(`/api/jobs/${jobId}/pieces/${pieceId}/photos`, { multipart: { photo: { name: 'plaque.png', mimeType: 'image/png', buffer: png } } });
    expect(upload.status()).toBe(201);
    await page.goto(`/jobs/${jobId}`);
    const thumb = page.getByTestId('photo-thumb');
    await expect(thumb).toBeVisible();
    // React Native Web draws an Image as a background; "contain" fits the whole picture inside the square.
    const sizes = await thumb.evaluate((el) => Array.from(el.querySelectorAll('*')).map((c) => getComputedStyle(c).backgroundSize));
    expect(sizes).toContain('contain');
    expect(sizes).not.toContain('cover');
  });

  test('the customer chooser lists the newest customer first and narrows as one types', async ({ page }) => {
    await signIn(page, demoOwner);
    const name = `Zebedee Newcombe ${Date.now()}`;
    await createCustomer(page.request, name);
    await page.goto('/jobs/new');
    const options = page.getByTestId('customer-options').getByRole('radio');
    await expect(options.first()).toContainText(name);
    await page.getByTestId('customer-search').pressSequentially('Marguer');
    await expect(options).toHaveCount(1);
    await expect(options.first()).toContainText('Marguerite Oduya');
  });

  test('a refused form says why beside each field and puts the focus on the first one', async ({ page }) => {
    await signIn(page, demoOwner);
    await page.goto('/customers/new');
    await page.getByTestId('customer-email').fill('not an address');
    await page.getByTestId('save-customer').click();
    const focused = page.locator(':focus');
    await expect(focused).toHaveAttribute('data-testid', 'customer-name');
    await expect(focused).toHaveAttribute('aria-invalid', 'true');
    const describedBy = await focused.getAttribute('aria-describedby');
    await expect(page.locator(`[id="${describedBy}"]`)).toHaveText("Enter the customer's name");
    const email = page.getByTestId('customer-email');
    const emailNote = await email.getAttribute('aria-describedby');
    await expect(page.locator(`[id="${emailNote}"]`)).toHaveText('Enter an e-mail address like name@example.com');
  });

  test('choosing millimetres rounds to 0.5 mm and says what a bare number means', async ({ page }) => {
    await newShop(page.request, 'units');
    await page.goto('/settings');
    await expect(page.getByText('A number typed without a unit means inches')).toBeVisible();
    await page.getByTestId('units-mm').click();
    await expect(page.getByTestId('rounding-0.5mm')).toHaveAttribute('aria-checked', 'true');
    await expect(page.getByTestId('rounding-1/16')).toHaveCount(0);
    await expect(page.getByText('A number typed without a unit means millimetres')).toBeVisible();
    await page.getByTestId('save-settings').click();
    await expect(page.getByTestId('settings-saved')).toBeVisible();
    const saved = (await (await page.request.get('/api/settings')).json()).settings;
    expect(saved).toMatchObject({ units: 'mm', rounding: '0.5mm' });
  });

  test('deleting a customer asks first and keeps them when the framer says keep', async ({ page }) => {
    await signIn(page, demoOwner);
    const id = await createCustomer(page.request, 'Walk-in Wendeline Aske');
    await page.goto(`/customers/${id}`);
    await page.getByTestId('customer-delete').click();
    await expect(page.getByText(/Delete Walk-in Wendeline Aske\? This cannot be undone/)).toBeVisible();
    await page.getByRole('button', { name: 'Keep' }).click();
    expect((await page.request.get(`/api/customers/${id}`)).status()).toBe(200);
    await page.getByTestId('customer-delete').click();
    await page.getByTestId('customer-delete-confirm').click();
    await expect(page).toHaveURL(/\/customers$/);
    expect((await page.request.get(`/api/customers/${id}`)).status()).toBe(404);
  });
});
