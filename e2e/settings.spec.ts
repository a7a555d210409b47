import { expect, test } from './cspGuard';

test('an owner changes the rounding, a check limit and the sheet sizes; the shop reads them back after a reload', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/sign-up');
  await page.getByTestId('shop-name').fill('Gannet Point Framers');
  await page.getByTestId('name').fill('Perpetua Nightingale');
  await page.getByTestId('email').fill(`owner-settings-${Date.now()}@e2e.example`);
  await page.getByTestId('password').fill('a long enough password');
  await page.getByTestId('sign-up').click();
  await expect(page.getByText('Gannet Point Framers')).toBeVisible();

  await page.getByTestId('nav-settings').click();
  await page.getByTestId('rounding-1/8').click();
  // A framer types fractions; 5/8 in is wider than the common 1/2 in warning (common practice).
  await page.getByTestId('bridge-warn').fill('5/8');
  await page.getByTestId('bridge-error').fill('one quarter');
  await page.getByTestId('save-settings').click();
  await expect(page.getByText(/could not be read as a length/)).toBeVisible();
  await page.getByTestId('bridge-error').fill('1/4');
  await page.getByTestId('add-sheet').click();
  await page.getByTestId('sheet-2').getByLabel('Name').fill('Museum board 20 x 24');
  await page.getByTestId('sheet-2').getByLabel('Width').fill('20');
  await page.getByTestId('sheet-2').getByLabel('Height').fill('24');
  await page.getByTestId('save-settings').click();
  await expect(page.getByTestId('settings-saved')).toBeVisible();

  await page.reload();
  await expect(page.getByTestId('bridge-warn')).toHaveValue('5/8"');
  const stored = (await (await page.request.get('/api/settings')).json()).settings;
  expect(stored).toMatchObject({ rounding: '1/8', bridgeWarnIn: 0.625, bridgeErrorIn: 0.25 });
  await expect(page.getByTestId('sheet-2').getByLabel('Name')).toHaveValue('Museum board 20 x 24');
  await expect(page.getByTestId('sheet-2').getByLabel('Height')).toHaveValue('24"');
});
