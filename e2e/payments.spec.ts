import { expect, test, type Page } from './cspGuard';
import { withE2eDatabase } from './support/database';
import { elementsPastRightEdge, seriousViolations } from './support/screens';

// A worked quote: subtotal 444.00, tax 8 % = 35.52, total 479.52, deposit 50 % = 239.76 (by hand).
const quote = { subtotalCents: 44_400, taxCents: 3_552, totalCents: 47_952, depositCents: 23_976 };

/**
 * A new shop (the page keeps the owner's session) with a customer, a job, and the job's quote
 * accepted. The quote is written straight to the run's database: accepting a quote with the
 * proof's approval belongs to the proof page, which these tests do not drive.
 */
async function jobWithAcceptedQuote(page: Page) {
  const request = page.request;
  const email = `owner-pay-${Date.now()}@e2e.example`;
  expect((await request.post('/api/auth/sign-up', { data: { shopName: 'Wickenby Lane Frames', name: 'Odile Pennyworth', email, password: 'a long enough password' } })).status()).toBe(201);
  const shopId = (await (await request.get('/api/auth/me')).json()).shop.id as string;
  const customerEmail = `tamsin-${Date.now()}@customers.example`;
  const customer = (await (await request.post('/api/customers', { data: { name: 'Tamsin Harrowgate', email: customerEmail } })).json()).customer;
  const job = (await (await request.post('/api/jobs', { data: { title: 'Copperfield Wrens #4 jersey', customerId: customer.id } })).json()).job;
  const line = { kind: 'extra', label: 'Framing as quoted', explanation: 'Set up for the payment test', amountCents: quote.subtotalCents };
  await withE2eDatabase((db) =>
    db.query(
      `INSERT INTO quotes (shop_id, job_id, version, state, lines, subtotal_cents, tax_cents, total_cents, deposit_cents, accepted_at, accepted_name)
       VALUES ($1, $2, 1, 'accepted', $3, $4, $5, $6, $7, now(), 'Tamsin Harrowgate')`,
      [shopId, job.id, JSON.stringify([line]), quote.subtotalCents, quote.taxCents, quote.totalCents, quote.depositCents],
    ),
  );
  return { jobId: job.id as string, customerEmail };
}

test('the deposit is paid on the provider page and the job shows part paid with the balance; cash pays the rest (390 x 844)', async ({ page, baseURL }) => {
  // Two full loads of the app, the provider's page, two payments and an accessibility scan.
  test.setTimeout(150_000);
  await page.setViewportSize({ width: 390, height: 844 });
  const { jobId, customerEmail } = await jobWithAcceptedQuote(page);
  await page.goto(`/jobs/${jobId}`);
  const panel = page.getByTestId('payments-section');
  await expect(panel.getByTestId('payment-state')).toHaveText('Due', { timeout: 30_000 });
  await expect(panel.getByTestId('payment-amounts')).toHaveText('Total $479.52 · paid $0.00 · still to pay $479.52');

  await panel.getByTestId('pay-deposit').click();
  await expect(page.getByTestId('checkout-total')).toHaveText('$239.76');
  // The provider's own page (the local stand-in), not one of Matwright's.
  expect(new URL(page.url()).origin).not.toBe(new URL(baseURL!).origin);
  await expect(page.getByText('Deposit for Copperfield Wrens #4 jersey')).toBeVisible();
  await page.screenshot({ path: 'e2e/output/screens/provider-checkout-390x844.png', fullPage: true });
  expect(await elementsPastRightEdge(page)).toEqual([]);
  await page.getByTestId('checkout-pay').click();

  await expect(page).toHaveURL(new RegExp(`/jobs/${jobId}\\?payment=cs_test_`));
  // The whole app loads again after the provider's page; on a busy machine that takes a while.
  await expect(panel.getByTestId('payment-landed')).toBeVisible({ timeout: 30_000 });
  await expect(panel.getByTestId('payment-state')).toHaveText('Part paid');
  // 479.52 - 239.76 = 239.76 still to pay.
  await expect(panel.getByTestId('payment-amounts')).toHaveText('Total $479.52 · paid $239.76 · still to pay $239.76');
  await expect(panel.getByTestId('payment-row')).toHaveCount(1);
  await expect(panel.getByTestId('payment-row').first()).toContainText('$239.76 · Card, online');
  await expect(panel.getByTestId('payment-row').first()).toContainText('confirmed by the payment provider');
  await expect(panel.getByTestId('pay-deposit')).toHaveCount(0);

  // The rest in cash at the counter; more than the balance is refused first.
  await panel.getByTestId('manual-amount').fill('300');
  await panel.getByTestId('manual-record').click();
  await expect(panel.getByText('That is more than the $239.76 still owed on this job; nothing was recorded. Take $239.76 or less.')).toBeVisible();
  await panel.getByTestId('manual-amount').fill('239.76');
  await panel.getByTestId('manual-note').fill('Paid at pick-up');
  await panel.getByTestId('manual-record').click();
  await expect(panel.getByTestId('payment-state')).toHaveText('Paid');
  await expect(panel.getByTestId('payment-amounts')).toHaveText('Total $479.52 · paid $479.52 · still to pay $0.00');
  await expect(panel.getByTestId('payment-row').first()).toContainText('recorded by Odile Pennyworth');
  await expect(page.getByTestId('activity')).toContainText('Recorded a payment of $239.76 (cash)');

  // One receipt per payment in the shop's outbox, to the customer.
  const outbox = (await (await page.request.get('/api/outbox')).json()).messages as { subject: string; toAddress: string; error: string | null }[];
  const receipts = outbox.filter((m) => m.subject === 'Wickenby Lane Frames: receipt for $239.76, Copperfield Wrens #4 jersey');
  expect(receipts.map((m) => [m.toAddress, m.error])).toEqual([
    [customerEmail, null],
    [customerEmail, null],
  ]);

  await panel.screenshot({ path: 'e2e/output/screens/job-payments-panel-390x844.png' });
  expect(await elementsPastRightEdge(page)).toEqual([]);
  expect(await seriousViolations(page)).toEqual([]);
});
