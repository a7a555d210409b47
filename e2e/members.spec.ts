import { expect, test, type Page } from './cspGuard';

const sizes = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1280, height: 800 },
] as const;

async function signUpOwner(page: Page, shopName: string, email: string) {
  await page.goto('/sign-up');
  await page.getByTestId('shop-name').fill(shopName);
  await page.getByTestId('name').fill('Marisol Quent');
  await page.getByTestId('email').fill(email);
  await page.getByTestId('password').fill('a long enough password');
  await page.getByTestId('sign-up').click();
  await expect(page.getByTestId('jobs-empty')).toBeVisible();
}

/** The join link of the newest invitation, read as the owner through the outbox API. */
async function newestJoinLink(page: Page): Promise<string> {
  const list = await page.request.get('/api/outbox?limit=1');
  const id = (await list.json()).messages[0].id as string;
  const message = await (await page.request.get(`/api/outbox/${id}`)).json();
  const link = /https?:\/\/\S+\/join\/[A-Za-z0-9_-]{43}/.exec(message.message.textBody)?.[0];
  if (!link) throw new Error(`no join link in the outbox message: ${message.message.textBody}`);
  return link;
}

for (const size of sizes) {
  test(`an owner invites a designer, who joins through the e-mailed link and lands signed in (${size.name})`, async ({ page, browser }) => {
    await page.setViewportSize({ width: size.width, height: size.height });
    const stamp = `${size.name}-${Date.now()}`;
    const invitee = `designer-${stamp}@e2e.example`;
    await signUpOwner(page, 'Hollins Cove Framing', `owner-${stamp}@e2e.example`);

    await page.goto('/members');
    await page.getByTestId('send-invitation').click();
    await expect(page.getByText('Enter an e-mail address like name@example.com')).toBeVisible();
    await page.getByTestId('invite-email').fill(invitee);
    await page.getByTestId('invite-role-designer').click();
    await page.getByTestId('send-invitation').click();
    await expect(page.getByText(`Invitation sent to ${invitee}.`)).toBeVisible();
    await expect(page.getByTestId('pending-invitations').getByText(invitee)).toBeVisible();

    await page.goto('/outbox');
    await page.getByTestId('outbox-list').getByText(`To ${invitee}`).click();
    await expect(page.getByTestId('outbox-body')).toContainText('/join/');
    await page.screenshot({ path: `e2e/output/outbox-${size.name}.png`, fullPage: true });
    const link = await newestJoinLink(page);

    const guest = await browser.newContext({ viewport: { width: size.width, height: size.height } });
    const joiner = await guest.newPage();
    await joiner.goto(link);
    await expect(joiner.getByText('Join Hollins Cove Framing')).toBeVisible();
    await joiner.screenshot({ path: `e2e/output/join-${size.name}.png`, fullPage: true });
    await expect(joiner.getByTestId('join-summary')).toHaveText(`You were invited as designer. You will sign in as ${invitee}.`);
    await joiner.getByTestId('join-name').fill('Tobiah Wrenlow');
    await joiner.getByTestId('join-password').fill('short');
    await joiner.getByTestId('join').click();
    await expect(joiner.getByText('Use at least 10 characters')).toBeVisible();
    await joiner.getByTestId('join-password').fill('another long password');
    await joiner.getByTestId('join').click();

    await expect(joiner.getByTestId('jobs-empty')).toBeVisible();
    await expect(joiner.getByText('Tobiah Wrenlow · Designer')).toBeVisible();
    await joiner.screenshot({ path: `e2e/output/joined-${size.name}.png`, fullPage: true });

    await joiner.goto(link);
    await expect(joiner.getByText('This invitation was already used; sign in instead')).toBeVisible();
    await guest.close();

    await page.goto('/members');
    await expect(page.getByTestId('team-list').getByText('Tobiah Wrenlow')).toBeVisible();
    await expect(page.getByTestId('pending-invitations')).toHaveCount(0);
    await page.screenshot({ path: `e2e/output/members-${size.name}.png`, fullPage: true });
  });
}
