import { expect, test, type Page } from './cspGuard';
import { demoOwner, desktop, elementsPastRightEdge, phone, saveScreen, seriousViolations, signIn } from './support/screens';

/** The seeded demo job with its layout, and a demo customer, found through the API. */
async function demoIds(page: Page) {
  const jobs = (await (await page.request.get('/api/jobs?q=Tidewicks%20home')).json()).jobs as { id: string }[];
  const jobId = jobs[0]!.id;
  const layouts = (await (await page.request.get(`/api/jobs/${jobId}/layouts`)).json()).layouts as { id: string }[];
  const customers = (await (await page.request.get('/api/customers?q=Marguerite')).json()).customers as { id: string }[];
  const pieces = (await (await page.request.get(`/api/jobs/${jobId}/pieces`)).json()).pieces as { id: string; kind: string }[];
  return { jobId, layoutId: layouts[0]!.id, customerId: customers[0]!.id, garmentId: pieces.find((p) => p.kind === 'garment')!.id };
}

interface Stop {
  name: string;
  path: (ids: Awaited<ReturnType<typeof demoIds>>) => string;
  /** Something only this screen shows, so the walk waits until it has loaded. */
  ready: (page: Page) => ReturnType<Page['getByTestId']>;
}

const signedOut: Stop[] = [
  { name: 'sign-in', path: () => '/sign-in', ready: (p) => p.getByTestId('sign-in') },
  { name: 'sign-up', path: () => '/sign-up', ready: (p) => p.getByTestId('sign-up') },
];

const signedInStops: Stop[] = [
  { name: 'jobs', path: () => '/', ready: (p) => p.getByTestId('job-list') },
  { name: 'new-job', path: () => '/jobs/new', ready: (p) => p.getByTestId('customer-options').getByRole('radio').first() },
  { name: 'job', path: (ids) => `/jobs/${ids.jobId}`, ready: (p) => p.getByTestId('layouts-section').getByRole('link').first() },
  { name: 'customers', path: () => '/customers', ready: (p) => p.getByTestId('customers-search') },
  { name: 'customer', path: (ids) => `/customers/${ids.customerId}`, ready: (p) => p.getByRole('heading', { name: 'Marguerite Oduya' }) },
  { name: 'new-customer', path: () => '/customers/new', ready: (p) => p.getByTestId('save-customer') },
  { name: 'team', path: () => '/members', ready: (p) => p.getByTestId('send-invitation') },
  { name: 'outbox', path: () => '/outbox', ready: (p) => p.getByRole('heading', { name: 'Outbox' }) },
  { name: 'settings', path: () => '/settings', ready: (p) => p.getByTestId('save-settings') },
  { name: 'account', path: () => '/account', ready: (p) => p.getByTestId('change-password') },
  { name: 'trace', path: (ids) => `/trace/${ids.garmentId}?job=${ids.jobId}`, ready: (p) => p.getByRole('heading', { name: /^Trace / }) },
  { name: 'designer', path: (ids) => `/layouts/${ids.layoutId}`, ready: (p) => p.locator('[data-opening]').first() },
  { name: 'not-found', path: () => '/no/such/page', ready: (p) => p.getByTestId('not-found') },
];

async function visit(page: Page, stop: Stop, ids: Awaited<ReturnType<typeof demoIds>> | null) {
  await page.goto(stop.path(ids!));
  await expect(stop.ready(page)).toBeVisible();
  // Fonts and the canvas's first fit settle before anything is measured.
  await page.evaluate(() => document.fonts.ready);
}

test.describe('every screen at 390 x 844', () => {
  test.use({ viewport: phone });

  test('the right-edge check reports a row that scrolls sideways and passes a clipped drawing', async ({ page }) => {
    await page.setContent(`
      <div style="overflow-x:auto;overflow-y:hidden;width:390px"><div style="display:flex;width:600px"><a data-testid="far">Settings</a></div></div>
      <div style="overflow:hidden;width:200px"><div data-testid="drawing" style="width:900px;height:10px"></div></div>`);
    const found = await elementsPastRightEdge(page);
    expect(found.some((f) => f.startsWith('div "Settings"'))).toBe(true);
    expect(found.some((f) => f.includes('[drawing]'))).toBe(false);
  });

  test('nothing runs off the right edge and axe finds no serious or critical problem, signed out', async ({ page }) => {
    for (const stop of signedOut) {
      await visit(page, stop, null);
      expect(await elementsPastRightEdge(page), `${stop.name}: elements past the right edge`).toEqual([]);
      expect(await seriousViolations(page), `${stop.name}: accessibility`).toEqual([]);
    }
  });

  test('nothing runs off the right edge and axe finds no serious or critical problem, signed in', async ({ page }) => {
    test.setTimeout(300_000);
    await signIn(page, demoOwner);
    const ids = await demoIds(page);
    for (const stop of signedInStops) {
      await visit(page, stop, ids);
      expect(await elementsPastRightEdge(page), `${stop.name}: elements past the right edge`).toEqual([]);
      expect(await seriousViolations(page), `${stop.name}: accessibility`).toEqual([]);
      await expect(page).toHaveTitle(/ · Matwright$/);
    }
  });

  test("the designer's canvas is the screen's full width and over half its height", async ({ page }) => {
    await signIn(page, demoOwner);
    const ids = await demoIds(page);
    await visit(page, signedInStops.find((s) => s.name === 'designer')!, ids);
    const canvas = (await page.getByTestId('mat-canvas').boundingBox())!;
    expect(canvas.width).toBeGreaterThanOrEqual(phone.width);
    expect(canvas.height).toBeGreaterThanOrEqual(phone.height / 2);
  });
});

for (const size of [phone, desktop]) {
  test(`screenshots of every screen at ${size.width} x ${size.height} for review`, async ({ page }) => {
    test.setTimeout(300_000);
    await page.setViewportSize(size);
    for (const stop of signedOut) {
      await visit(page, stop, null);
      await saveScreen(page, stop.name, size);
    }
    await signIn(page, demoOwner);
    const ids = await demoIds(page);
    for (const stop of signedInStops) {
      await visit(page, stop, ids);
      await expect(page).toHaveTitle(/ · Matwright$/);
      await saveScreen(page, stop.name, size);
    }
  });
}
