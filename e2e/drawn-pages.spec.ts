import { expect, test, type Page } from './cspGuard';
import { desktop, phone, signIn } from './support/screens';

/**
 * Signed-in pages drawn on the server with their data: the HTML already holds
 * the page; it stays on screen while the app draws its own from the reads it
 * came with (asking the API nothing for them), which then takes its place
 * without a loading wheel showing in between, and works as usual.
 */

/** Every loading wheel that was on screen (painted, not in the hidden root) from the page's start. */
async function watchWheels(page: Page) {
  await page.addInitScript(() => {
    const seen: string[] = [];
    (window as unknown as { wheelsSeen: string[] }).wheelsSeen = seen;
    const look = () => {
      for (const wheel of Array.from(document.querySelectorAll('[role="progressbar"]'))) {
        if (wheel.checkVisibility({ visibilityProperty: true })) seen.push(`${Math.round(performance.now())} ms`);
      }
      if (performance.now() < 8000) requestAnimationFrame(look);
    };
    requestAnimationFrame(look);
  });
  return () => page.evaluate(() => (window as unknown as { wheelsSeen: string[] }).wheelsSeen);
}

/** The API reads the page makes from the moment it is opened. */
function apiReads(page: Page): string[] {
  const reads: string[] = [];
  page.on('request', (r) => {
    if (new URL(r.url()).pathname.startsWith('/api/')) reads.push(`${r.method()} ${new URL(r.url()).pathname}`);
  });
  return reads;
}

const drawnTitle = (html: string) => /<div id="root">[^]*?Skylarrows youth jersey #5[^]*?matwright-first-reads/.test(html);

test('the jobs list arrives drawn on a phone, the app takes over with no wheel between, and opens a job', async ({ page }) => {
  await page.setViewportSize(phone);
  await signIn(page);
  // The list sign-in led to has read its jobs before the reads of the page opened next are counted.
  await expect(page.getByTestId('job-list')).toBeVisible();
  const wheels = await watchWheels(page);
  const reads = apiReads(page);
  const response = await page.goto('/');
  expect(drawnTitle(await response!.text()), 'the HTML holds the jobs').toBe(true);
  await expect(page.getByTestId('job-list')).toBeVisible();
  await expect(page.locator('#matwright-drawn')).toHaveCount(0);
  expect(await wheels(), 'loading wheels on screen').toEqual([]);
  // The app's own page, from the reads the page came with.
  await page.getByRole('link', { name: /Skylarrows youth jersey #5/ }).click();
  await expect(page).toHaveURL(/\/jobs\/[0-9a-f-]{36}$/);
  await expect(page.getByRole('heading', { name: /Skylarrows youth jersey #5/ })).toBeVisible();
  expect(reads.filter((r) => r === 'GET /api/jobs' || r === 'GET /api/auth/me'), 'reads the page came with, asked again').toEqual([]);
});

test("a job's page and the designer arrive drawn, and the designer's canvas answers", async ({ page }) => {
  await page.setViewportSize(phone);
  await signIn(page);
  const jobs = await (await page.request.get('/api/jobs?limit=50')).json();
  let layoutPath = '';
  for (const job of jobs.jobs as Array<{ id: string }>) {
    const { layouts } = await (await page.request.get(`/api/jobs/${job.id}/layouts`)).json();
    if (layouts.length > 0) {
      layoutPath = `/layouts/${layouts[0].id}`;
      const jobPage = await page.goto(`/jobs/${job.id}`);
      expect(await jobPage!.text()).toContain('id="matwright-first-reads"');
      await expect(page.getByRole('button', { name: 'New layout' })).toBeVisible();
      break;
    }
  }
  const reads = apiReads(page);
  const designer = await page.goto(layoutPath);
  const html = await designer!.text();
  expect(html).toContain('id="matwright-first-reads"');
  expect(html.slice(html.indexOf('<div id="root">'), html.indexOf('id="matwright-first-reads"')), "the designer's markup").toContain('Add opening');
  await expect(page.getByTestId('designer-phone')).toBeVisible();
  await expect(page.getByTestId('mat-canvas')).toBeVisible();
  await page.getByTestId('zoom-in').click();
  expect(reads.filter((r) => r.startsWith('GET /api/layouts/') || r === 'GET /api/settings')).toEqual([]);
});

/** The view cookie as the browser holds it: width x height | locale | time zone. */
async function viewCookie(page: Page): Promise<string | undefined> {
  const cookie = (await page.context().cookies()).find((c) => c.name === 'matwright_view');
  return cookie ? decodeURIComponent(cookie.value) : undefined;
}

test('the signed-in area writes the view the next page is drawn for, and follows the window when it changes', async ({ page }) => {
  await page.setViewportSize(phone);
  await page.goto('/sign-in');
  await expect(page.getByTestId('sign-in')).toBeEnabled();
  // Pages before sign-in leave it unwritten (their start would wait for the locale data).
  expect(await viewCookie(page)).toBeUndefined();
  await signIn(page);
  const zone = await page.evaluate(() => Intl.DateTimeFormat().resolvedOptions().timeZone);
  const locale = await page.evaluate(() => Intl.DateTimeFormat().resolvedOptions().locale);
  expect(await viewCookie(page)).toBe(`${phone.width}x${phone.height}|${locale}|${zone}`);
  await page.setViewportSize(desktop);
  await expect.poll(() => viewCookie(page)).toBe(`${desktop.width}x${desktop.height}|${locale}|${zone}`);
  const response = await page.goto('/');
  expect(await response!.text()).toContain('id="matwright-first-reads"');
  await expect(page.getByTestId('job-list')).toBeVisible();
  await expect(page.getByText('Matwright', { exact: true })).toBeVisible();
});

test('a page drawn for a phone gives way to the wide layout in a window that has grown since', async ({ page }) => {
  await page.setViewportSize(desktop);
  await signIn(page);
  // The view was written by this browser on a phone-sized window (another tab, say); the next
  // page is drawn for that phone.
  const { locale, timeZone } = await page.evaluate(() => Intl.DateTimeFormat().resolvedOptions());
  await page.context().addCookies([
    { name: 'matwright_view', value: encodeURIComponent(`${phone.width}x${phone.height}|${locale}|${timeZone}`), url: page.url() },
  ]);
  const response = await page.goto('/');
  expect(await response!.text()).toContain('id="matwright-first-reads"');
  await expect(page.getByTestId('job-list')).toBeVisible();
  // The wide layout: the shop bar shows the mark's word, which a phone leaves out.
  await expect(page.getByText('Matwright', { exact: true })).toBeVisible();
});

test('without a view the server sends the page undrawn, and the browser draws it', async ({ page, context }) => {
  await page.setViewportSize(desktop);
  await signIn(page);
  await context.clearCookies({ name: 'matwright_view' });
  const response = await page.goto('/');
  expect(await response!.text()).not.toContain('id="matwright-first-reads"');
  await expect(page.getByTestId('job-list')).toBeVisible();
});
