import { expect, test } from './cspGuard';

const sizes = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1280, height: 800 },
] as const;

for (const size of sizes) {
  test(`a new shop signs up, adds a customer and a job, sees it listed and signs out (${size.name})`, async ({ page }) => {
    await page.setViewportSize({ width: size.width, height: size.height });
    const email = `owner-${size.name}-${Date.now()}@e2e.example`;

    await page.goto('/');
    await expect(page).toHaveURL(/\/sign-in$/);
    await page.getByText('Set up your shop').click();

    await page.getByTestId('shop-name').fill('Lantern Quay Framing');
    await page.getByTestId('name').fill('Saoirse Delacourt');
    await page.getByTestId('email').fill(email);
    await page.getByTestId('password').fill('a long enough password');
    await page.getByTestId('sign-up').click();

    await expect(page.getByTestId('jobs-empty')).toBeVisible();
    await expect(page.getByText('Lantern Quay Framing')).toBeVisible();

    await page.getByTestId('new-customer').click();
    await page.getByTestId('save-customer').click();
    await expect(page.getByText("Enter the customer's name")).toBeVisible();
    await page.getByTestId('customer-name').fill('Ambrose Quillfeather');
    await page.getByTestId('customer-email').fill('ambrose@quillfeather.example');
    await page.getByTestId('save-customer').click();
    // Saving lands on the new customer, with a word that it worked.
    await expect(page).toHaveURL(/\/customers\/[0-9a-f-]{36}/);
    await expect(page.getByTestId('customer-saved')).toContainText('Customer saved');

    await page.getByTestId('nav-jobs').click();
    await page.getByTestId('new-job').click();
    await page.getByTestId('job-title').fill('Riverbend Pebblewhisks jersey #12 with two patches');
    await page.getByTestId('customer-option-Ambrose Quillfeather').click();
    await page.getByTestId('job-due').fill('2027-04-09');
    await page.getByTestId('job-notes').fill('Signed on the front number; keep it clear of the window edge.');
    await page.getByTestId('save-job').click();
    // Opening the job lands on the job itself.
    await expect(page).toHaveURL(/\/jobs\/[0-9a-f-]{36}/);
    await expect(page.getByTestId('job-title-heading')).toHaveText('Riverbend Pebblewhisks jersey #12 with two patches');

    await page.getByTestId('nav-jobs').click();
    const list = page.getByTestId('job-list');
    await expect(list.getByText('Riverbend Pebblewhisks jersey #12 with two patches')).toBeVisible();
    await expect(list.getByText('Ambrose Quillfeather')).toBeVisible();
    await expect(list.getByText('Taken in')).toBeVisible();

    await page.getByTestId('account-menu').click();
    await page.getByTestId('sign-out').click();
    await expect(page).toHaveURL(/\/sign-in$/);
    await page.goto('/');
    await expect(page).toHaveURL(/\/sign-in$/);
  });
}

test('the demo owner printed by npm start can sign in and sees the demo jobs', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByTestId('email').fill('owner@tallowmere.example');
  await page.getByTestId('password').fill('wrong password');
  await page.getByTestId('sign-in').click();
  await expect(page.getByText('That e-mail and password do not match an account')).toBeVisible();
  await page.getByTestId('password').fill('demo-frames-2026');
  await page.getByTestId('sign-in').click();
  await expect(page.getByText('Tallowmere Frame Works')).toBeVisible();
  await expect(page.getByTestId('job-list').getByText(/Port Wendle Tidewicks home jersey #14/)).toBeVisible();
  // The invented demo pipeline has a job in every status to try the filters on
  // (other specs add jobs to the demo shop, so the test counts only what the filter keeps).
  await page.getByTestId('filter-cutting').click();
  await expect(page.getByTestId('job-list').getByText(/Brindle Hollow Thistlejacks retirement jersey/)).toBeVisible();
  await expect(page.getByTestId('job-list').getByText(/Port Wendle Tidewicks home jersey #14/)).toHaveCount(0);
  // Due dates in the demo run relative to today: the ready youth jersey was due yesterday,
  // the shipped captain's jersey six days ago, but finished work stays out of the list until asked for.
  await page.getByTestId('filter-cutting').click();
  await page.getByTestId('due-past').click();
  await expect(page.getByTestId('job-list').getByText(/Skylarrows youth jersey #5/)).toBeVisible();
  await expect(page.getByTestId('job-late').first()).toContainText('Past due');
  await expect(page.getByTestId('job-list').getByText(/Port Wendle Tidewicks home jersey #14/)).toHaveCount(0);
  await expect(page.getByTestId('job-list').getByText(/Ironwhelms captain jersey #1/)).toHaveCount(0);
  await page.getByTestId('show-finished').click();
  await expect(page.getByTestId('job-list').getByText(/Ironwhelms captain jersey #1/)).toBeVisible();
  // A shipped job reminds the shop how glass travels.
  await page.getByTestId('job-list').getByText(/Ironwhelms captain jersey #1/).click();
  await expect(page.getByText('Safety: shipping')).toBeVisible();
});
