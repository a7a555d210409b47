import { demoJerseyLayout } from '../db/demoLayout';
import { expect, test, type Browser, type Page } from './cspGuard';
import { elementsPastRightEdge, newShop, phone, seriousViolations } from './support/screens';

const demoPieces = {
  jersey: { kind: 'garment', label: 'Home jersey #14, folded', widthIn: 16, heightIn: 19 },
  patchA: { kind: 'patch', label: 'Crest patch', widthIn: 4, heightIn: 4 },
  patchB: { kind: 'patch', label: 'Anniversary patch', widthIn: 4, heightIn: 4 },
  photo: { kind: 'photo', label: 'Goal print', widthIn: 10, heightIn: 8 },
  plaque: { kind: 'plaque', label: 'Engraved plaque', widthIn: 9, heightIn: 3 },
} as const;

/** A new shop (signed in on the page) with a job holding the demo jersey layout and its five pieces. */
async function demoJob(page: Page) {
  const request = page.request;
  await newShop(request, 'owner-quote');
  const customer = (await (await request.post('/api/customers', { data: { name: 'Ottilie Fenwright', email: `ottilie-${Date.now()}@customers.example` } })).json()).customer;
  const job = (await (await request.post('/api/jobs', { data: { title: 'Brackwater Herons #14 jersey', customerId: customer.id } })).json()).job;
  const ids: Record<string, string> = {};
  for (const [key, piece] of Object.entries(demoPieces)) ids[key] = (await (await request.post(`/api/jobs/${job.id}/pieces`, { data: piece })).json()).piece.id;
  const document = demoJerseyLayout(ids as Parameters<typeof demoJerseyLayout>[0]);
  expect((await request.post(`/api/jobs/${job.id}/layouts`, { data: { name: 'Jersey shadowbox', document } })).status()).toBe(201);
  return job.id as string;
}

/** The customer's phone; with `scripts: false` the browser runs no script at all (the proof page's forms work without). */
async function customerPage(browser: Browser, baseURL: string, scripts = true) {
  const context = await browser.newContext({ baseURL, viewport: phone, javaScriptEnabled: scripts });
  return { page: await context.newPage(), close: () => context.close() };
}

test('choose a frame, build a quote from the demo layout, send it with a proof; the customer approves, pays the deposit on the provider page, and the job ships (390 x 844)', async ({ page, browser, baseURL }) => {
  // Two accessibility scans, the customer's page, the provider's page and the outbox: more than the default minute.
  test.setTimeout(360_000);
  await page.setViewportSize(phone);
  const jobId = await demoJob(page);
  await page.goto(`/jobs/${jobId}`);

  const frame = page.getByTestId('frame-panel');
  await frame.getByTestId('frame-moulding-BX-150').click();
  await frame.getByTestId('frame-glazing-acrylic').click();
  await frame.getByTestId('frame-depth').fill('2');
  await frame.getByTestId('frame-save').click();
  await expect(frame.getByTestId('frame-saved')).toHaveText('Saved on the job.');

  const quote = page.getByTestId('quote-section');
  await quote.getByTestId('build-quote').click();
  // The demo layout by hand (server/quotes/layoutQuote.test.ts): 795.90 + 8.25 % tax 65.66 = 861.56.
  await expect(quote.getByTestId('quote-total')).toHaveText('$861.56');
  await expect(quote.getByTestId('quote-state')).toHaveText('Draft, not sent');
  await expect(quote.getByText('Glazing, acrylic: 32 x 40 in = 8.89 sq ft x 14.50')).toBeVisible();

  // An extra typed by the framer: 795.90 + 25.00 = 820.90; tax 67.72425 -> 67.72; total 888.62.
  await quote.getByTestId('quote-edit').click();
  await quote.getByTestId('quote-add-extra').click();
  await quote.getByTestId('quote-extra-label-0').fill('Engraved brass plate');
  await quote.getByTestId('quote-extra-amount-0').fill('25');
  await quote.getByTestId('quote-save').click();
  await expect(quote.getByTestId('quote-total')).toHaveText('$888.62');
  await expect(quote.getByTestId('quote-deposit')).toHaveText('$444.31');
  expect(await elementsPastRightEdge(page)).toEqual([]);
  expect(await seriousViolations(page)).toEqual([]);
  await page.screenshot({ path: 'e2e/output/quote-phone-draft.png', fullPage: true });

  await page.getByTestId('send-proof').click();
  // Sending freezes the draft, which runs every check of the jersey outline on the server first.
  await expect(page.getByText(/The link was e-mailed to ottilie-\d+@customers\.example/)).toBeVisible({ timeout: 60_000 });
  const link = (await page.getByTestId('proof-link').textContent()) ?? '';
  await expect(quote.getByTestId('quote-state')).toHaveText('Sent with the proof');
  await expect(quote.getByTestId('quote-edit')).toHaveCount(0);

  const customer = await customerPage(browser, baseURL!);
  await customer.page.goto(new URL(link).pathname);
  await expect(customer.page.getByTestId('proof-title')).toHaveText('Brackwater Herons #14 jersey', { timeout: 30_000 });
  const price = customer.page.getByTestId('proof-quote');
  await expect(price.getByTestId('quote-total')).toHaveText('$888.62');
  await expect(price.getByText('Engraved brass plate')).toBeVisible();
  expect(await elementsPastRightEdge(customer.page)).toEqual([]);
  expect(await seriousViolations(customer.page)).toEqual([]);
  await customer.page.screenshot({ path: 'e2e/output/quote-phone-customer.png', fullPage: true });
  await customer.close();

  // The same link on a phone that runs no script: the answer is a plain form post.
  const noScript = await customerPage(browser, baseURL!, false);
  await noScript.page.goto(new URL(link).pathname);
  await noScript.page.getByTestId('proof-name').fill('Ottilie Fenwright');
  await noScript.page.getByTestId('proof-approve').click();
  await expect(noScript.page.getByTestId('proof-answered')).toContainText('Approved by Ottilie Fenwright');
  await expect(noScript.page.getByTestId('proof-quote')).toContainText('You accepted this price when you approved the design.');
  await noScript.close();

  await page.reload();
  await expect(quote.getByTestId('quote-state')).toHaveText('Accepted');
  await expect(quote.getByTestId('quote-accepted-by')).toContainText('Accepted by Ottilie Fenwright');
  await expect(quote.getByTestId('quote-total')).toHaveText('$888.62');

  // The deposit, computed on the server from the accepted quote (888.62 x 50 % = 444.31), paid on the provider's page.
  const payments = page.getByTestId('payments-section');
  await expect(payments.getByTestId('payment-amounts')).toHaveText('Total $888.62 · paid $0.00 · still to pay $888.62', { timeout: 30_000 });
  await payments.getByTestId('pay-deposit').click();
  await expect(page.getByTestId('checkout-total')).toHaveText('$444.31');
  await page.getByTestId('checkout-pay').click();
  await expect(page).toHaveURL(new RegExp(`/jobs/${jobId}\\?payment=cs_test_`));
  await expect(payments.getByTestId('payment-landed')).toBeVisible({ timeout: 30_000 });
  await expect(payments.getByTestId('payment-state')).toHaveText('Part paid');
  await expect(payments.getByTestId('payment-amounts')).toHaveText('Total $888.62 · paid $444.31 · still to pay $444.31');

  // Cut, assembled and ready; then shipped with a tracking number, and the notice is in the outbox.
  for (const status of ['cutting', 'assembling', 'ready']) {
    expect((await page.request.post(`/api/jobs/${jobId}/status`, { data: { status } })).status()).toBe(200);
  }
  await page.goto(`/jobs/${jobId}`);
  await page.getByTestId('tracking-number').fill('1ZQ 7781-40');
  await page.getByTestId('mark-shipped').click();
  await expect(page.getByTestId('shipment')).toContainText('tracking number 1ZQ 7781-40');
  await page.goto('/outbox');
  await page.getByRole('button', { name: /Brackwater Herons #14 jersey is on its way/ }).click();
  await expect(page.getByTestId('outbox-body')).toContainText('1ZQ%207781-40');
});
