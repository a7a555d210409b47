import { expect, test, type Locator, type Page } from './cspGuard';
import sharp from 'sharp';

/** A shop, a customer and a job made through the API, so the test spends its time on the pieces screen. */
async function openNewJob(page: Page, label: string) {
  const email = `pieces-${label}-${Date.now()}@e2e.example`;
  const signUp = await page.request.post('/api/auth/sign-up', {
    data: { shopName: 'Wickerby Green Framing', name: 'Isolde Fernhallow', email, password: 'a long enough password' },
  });
  expect(signUp.status()).toBe(201);
  const customer = await (await page.request.post('/api/customers', { data: { name: 'Bartholomew Sedgewick' } })).json();
  const job = await (
    await page.request.post('/api/jobs', { data: { title: 'Millbrook Cindervanes jersey with team photo', customerId: customer.customer.id } })
  ).json();
  await page.goto(`/jobs/${job.job.id}`);
  await expect(page.getByTestId('job-title-heading')).toHaveText('Millbrook Cindervanes jersey with team photo');
}

/**
 * Picks a file through the photo button. Waiting for the chooser keeps headless
 * Chromium from reporting the picker as cancelled before the file is set.
 */
async function pickFile(page: Page, button: Locator, file: { name: string; mimeType: string; buffer: Buffer }) {
  const chooser = page.waitForEvent('filechooser');
  await button.click();
  const input = (await chooser).element();
  expect(await input.getAttribute('type')).toBe('file');
  await input.setInputFiles(file);
}

async function addPiece(page: Page, kind: string, label: string, width: string, height: string) {
  await page.getByTestId('add-piece').click();
  await page.getByTestId(`piece-kind-${kind}`).click();
  await page.getByTestId('piece-label').fill(label);
  await page.getByTestId('piece-width').fill(width);
  await page.getByTestId('piece-height').fill(height);
  await page.getByTestId('save-piece').click();
}

const sizes = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1280, height: 800 },
] as const;

for (const size of sizes) {
  test(`a piece typed with fractional sizes is listed in inches, and its uploaded PNG shows as a thumbnail (${size.name})`, async ({ page }) => {
    await page.setViewportSize({ width: size.width, height: size.height });
    await openNewJob(page, size.name);
    await expect(page.getByTestId('pieces-empty')).toBeVisible();

    await addPiece(page, 'photo', 'Team photo', 'eight', '120');
    await expect(page.getByText('"eight" could not be read as a length; try 3 1/4, 3.25 in or 82.5 mm.')).toBeVisible();
    await expect(page.getByText('Height must be under 120 in')).toBeVisible();
    await page.getByTestId('piece-width').fill('8 1/2');
    await page.getByTestId('piece-height').fill('11');
    await page.getByTestId('save-piece').click();
    const photoRow = page.getByTestId('piece-row-Team photo');
    await expect(photoRow.getByTestId('piece-size')).toHaveText('8 1/2 x 11 in');

    await addPiece(page, 'plaque', 'Name plaque', '3-1/4"', '216mm');
    await expect(page.getByTestId('piece-row-Name plaque').getByTestId('piece-size')).toHaveText('3 1/4 x 8 1/2 in');

    const png = await sharp({ create: { width: 1200, height: 900, channels: 3, background: '#3b6e8f' } }).png().toBuffer();
    await pickFile(page, photoRow.getByTestId('add-photo-Team photo'), { name: 'team-photo.png', mimeType: 'image/png', buffer: png });
    const thumb = photoRow.getByTestId('photo-thumb');
    await expect(thumb).toBeVisible();
    // The thumbnail is the server's preview, fetched with the session cookie and decoded by the browser.
    await expect.poll(() => thumb.locator('img').evaluate((img) => (img as unknown as { naturalWidth: number }).naturalWidth)).toBeGreaterThan(0);

    await pickFile(page, photoRow.getByTestId('add-photo-Team photo'), { name: 'photo.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('not really a photo') });
    await expect(photoRow.getByTestId('photo-upload-problem')).toHaveText(/not a photo Matwright can read\. Upload a JPEG, PNG, WebP or AVIF image/);
    await expect(photoRow.getByTestId('photo-thumb')).toHaveCount(1);
    await page.screenshot({ path: `e2e/output/pieces-${size.name}.png`, fullPage: true });

    await page.getByTestId('edit-piece-Name plaque').click();
    await expect(page.getByTestId('piece-width')).toHaveValue('3 1/4"');
    await page.getByTestId('piece-width').fill('4 1/8');
    await page.getByTestId('save-piece').click();
    await expect(page.getByTestId('piece-row-Name plaque').getByTestId('piece-size')).toHaveText('4 1/8 x 8 1/2 in');

    await page.getByTestId('remove-piece-Name plaque').click();
    await page.getByTestId('confirm-remove-piece').click();
    await expect(page.getByTestId('piece-row-Name plaque')).toHaveCount(0);
    await expect(page.getByTestId('activity').getByText('Removed a piece: Name plaque')).toBeVisible();
  });
}
