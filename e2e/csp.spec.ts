import { expect, test } from './cspGuard';

// The server sends a Content-Security-Policy on every response; the browser
// reports each thing it blocks as a securitypolicyviolation event, which this
// test collects while the demo owner uses the main screens.
test('the app works under its Content-Security-Policy: the header is sent and nothing is blocked', async ({ page }) => {
  await page.addInitScript(() => {
    const seen: string[] = [];
    (window as unknown as { cspViolations: string[] }).cspViolations = seen;
    document.addEventListener('securitypolicyviolation', (e) => seen.push(`${e.violatedDirective} ${e.blockedURI}`));
  });
  const consoleErrors: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error' && /Content Security Policy/i.test(m.text())) consoleErrors.push(m.text());
  });

  const response = await page.goto('/sign-in');
  const policy = response?.headers()['content-security-policy'] ?? '';
  expect(policy).toContain("default-src 'self'");
  expect(policy).toContain("script-src 'self'");
  expect(policy).toContain("frame-ancestors 'none'");
  expect(response?.headers()['x-frame-options']).toBe('DENY');

  await page.getByTestId('email').fill('owner@tallowmere.example');
  await page.getByTestId('password').fill('demo-frames-2026');
  await page.getByTestId('sign-in').click();
  await expect(page.getByText('Tallowmere Frame Works')).toBeVisible();
  await expect(page.getByTestId('job-list')).toBeVisible();
  // The designer: SVG canvas, fonts, and the geometry the browser computes.
  const jobs = (await (await page.request.get('/api/jobs?status=designing,taken_in,awaiting_approval')).json()).jobs as { id: string }[];
  const layoutIds: string[] = [];
  for (const job of jobs) {
    const layouts = (await (await page.request.get(`/api/jobs/${job.id}/layouts`)).json()).layouts as { id: string }[];
    layoutIds.push(...layouts.map((l) => l.id));
  }
  expect(layoutIds.length).toBeGreaterThan(0);
  await page.goto(`/layouts/${layoutIds[0]}`);
  await expect(page.getByText('Jersey, two patches, photo and plaque').first()).toBeVisible();
  await page.goto('/');
  await page.getByTestId('nav-customers').click();
  await page.getByTestId('nav-settings').click();
  await page.getByTestId('account-menu').click();
  await page.getByTestId('account-password').click();
  await expect(page.getByText('Your account')).toBeVisible();

  const violations = await page.evaluate(() => (window as unknown as { cspViolations: string[] }).cspViolations);
  expect(violations).toEqual([]);
  expect(consoleErrors).toEqual([]);
});
