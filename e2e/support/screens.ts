import AxeBuilder from '@axe-core/playwright';
import { expect, type APIRequestContext, type Page } from '@playwright/test';

export const phone = { width: 390, height: 844 } as const;
export const desktop = { width: 1280, height: 800 } as const;

export const demoOwner = { email: 'owner@tallowmere.example', password: 'demo-frames-2026' } as const;

export async function signIn(page: Page, who: { email: string; password: string } = demoOwner) {
  await page.goto('/sign-in');
  await page.getByTestId('email').fill(who.email);
  await page.getByTestId('password').fill(who.password);
  await page.getByTestId('sign-in').click();
  await expect(page.getByTestId('account-menu')).toBeVisible();
}

/** A new shop of its own through the API (signed in on the page's cookies), so a test can change its settings freely. */
export async function newShop(request: APIRequestContext, label: string) {
  const email = `${label}-${Date.now()}@e2e.example`;
  const password = 'a long enough password';
  const res = await request.post('/api/auth/sign-up', { data: { shopName: 'Quenby Marsh Frame Room', name: 'Perpetua Loxley', email, password } });
  expect(res.status()).toBe(201);
  return { email, password };
}

export async function createCustomer(request: APIRequestContext, name: string): Promise<string> {
  const res = await request.post('/api/customers', { data: { name, email: `${name.split(' ')[0]!.toLowerCase()}@customers.example` } });
  expect(res.status()).toBe(201);
  return (await res.json()).customer.id as string;
}

export async function createJob(request: APIRequestContext, title: string, customerId: string): Promise<string> {
  const res = await request.post('/api/jobs', { data: { title, customerId } });
  expect(res.status()).toBe(201);
  return (await res.json()).job.id as string;
}

export async function createLayout(request: APIRequestContext, jobId: string, name = 'Jersey and plaque') {
  const res = await request.post(`/api/jobs/${jobId}/layouts`, { data: { name } });
  expect(res.status()).toBe(201);
  return (await res.json()).layout as { id: string; draft: Record<string, unknown>; draftRevision: number };
}

/** Every element whose right edge lies past the viewport, except drawing inside a deliberately clipped box (the canvas). */
export async function elementsPastRightEdge(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const limit = window.innerWidth + 0.5;
    const clippedBox = (el: Element): boolean => {
      for (let a = el.parentElement; a; a = a.parentElement) {
        const s = getComputedStyle(a);
        if (s.overflowX === 'hidden' && s.overflowY === 'hidden') return true;
      }
      return false;
    };
    const found: string[] = [];
    if (document.documentElement.scrollWidth > limit) found.push(`the page itself is ${document.documentElement.scrollWidth}px wide`);
    for (const el of Array.from(document.body.querySelectorAll('*'))) {
      if (el.closest('svg') && el.tagName.toLowerCase() !== 'svg') continue;
      const box = el.getBoundingClientRect();
      if (box.width === 0 || box.height === 0 || box.right <= limit) continue;
      const style = getComputedStyle(el);
      if (style.visibility === 'hidden' || style.display === 'none' || clippedBox(el)) continue;
      const id = el.getAttribute('data-testid');
      const text = (el.textContent ?? '').trim().slice(0, 40);
      found.push(`${el.tagName.toLowerCase()}${id ? `[${id}]` : ''} "${text}" ends at ${Math.round(box.right)}px`);
    }
    return found;
  });
}

/** Serious and critical accessibility violations (axe-core, WCAG 2.1 A and AA rules), named with where they are. */
export async function seriousViolations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => n.target.join(' ')).slice(0, 4).join(', ')}`);
}

/** A full-page picture of the screen for people to look at, in the run's git-ignored output folder. */
export async function saveScreen(page: Page, name: string, size: { width: number; height: number }) {
  await page.screenshot({ path: `e2e/output/screens/${name}-${size.width}x${size.height}.png`, fullPage: true });
}
