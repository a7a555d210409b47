import { expect, test, type Browser, type Page } from './cspGuard';

const firstPassword = 'a long enough password';
const newPassword = 'plum orchard ladder 7';

async function signIn(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByTestId('email').fill(email);
  await page.getByTestId('password').fill(password);
  await page.getByTestId('sign-in').click();
  await expect(page.getByText('Cobble Wynd Frames')).toBeVisible();
}

async function newBrowser(browser: Browser) {
  const context = await browser.newContext();
  return { context, page: await context.newPage() };
}

test('changing the password signs out the other browser; sign out everywhere ends this one', async ({ browser }) => {
  const email = `owner-account-${Date.now()}@e2e.example`;
  const here = await newBrowser(browser);
  const signedUp = await here.page.request.post('/api/auth/sign-up', {
    data: { shopName: 'Cobble Wynd Frames', name: 'Hester Quarrie', email, password: firstPassword },
  });
  expect(signedUp.status()).toBe(201);
  const elsewhere = await newBrowser(browser);
  await signIn(elsewhere.page, email, firstPassword);

  await here.page.goto('/');
  await here.page.getByTestId('account-menu').click();
  await here.page.getByTestId('account-password').click();
  await here.page.getByTestId('current-password').fill(firstPassword);
  await here.page.getByTestId('new-password').fill('password12');
  await here.page.getByTestId('change-password').click();
  await expect(here.page.getByText('This password is too common or too easy to guess', { exact: false })).toBeVisible();
  await here.page.getByTestId('new-password').fill(newPassword);
  await here.page.getByTestId('change-password').click();
  await expect(here.page.getByText('Password changed. Other browsers were signed out.')).toBeVisible();
  await here.page.screenshot({ path: 'e2e/output/account-password-changed.png', fullPage: true });

  await elsewhere.page.reload();
  await expect(elsewhere.page).toHaveURL(/\/sign-in$/);
  await signIn(elsewhere.page, email, newPassword);

  // The menu on a phone: it opens over the page, below the bar.
  await here.page.setViewportSize({ width: 390, height: 844 });
  await here.page.getByTestId('account-menu').click();
  await expect(here.page.getByTestId('sign-out')).toBeVisible();
  await here.page.screenshot({ path: 'e2e/output/account-menu-phone.png' });
  await here.page.getByTestId('sign-out-everywhere').click();
  await expect(here.page).toHaveURL(/\/sign-in$/);
  await elsewhere.page.reload();
  await expect(elsewhere.page).toHaveURL(/\/sign-in$/);
  await Promise.all([here.context.close(), elsewhere.context.close()]);
});
