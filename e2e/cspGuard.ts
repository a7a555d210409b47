import { expect, test as base } from '@playwright/test';

/**
 * Playwright's `test`, with every page of a test's browser context watched for
 * Content-Security-Policy violations: the browser reports each thing the
 * server's policy blocks as a securitypolicyviolation event, and a test that saw
 * one fails. So the whole browser suite runs, and passes, under the real CSP.
 */
/**
 * React's words for markup that did not match what the page arrived with (pages are
 * pre-rendered, then hydrated): in production builds they come as numbered errors.
 * https://react.dev/errors/418 (text or markup differs), /423 (gave up hydrating), /425.
 */
const HYDRATION_ERROR = /Minified React error #(418|423|425)|react\.dev\/errors\/(418|423|425)|Hydration failed|did not match/i;

export const test = base.extend<{ cspGuard: void; hydrationGuard: void }>({
  hydrationGuard: [
    async ({ context }, use) => {
      const mismatches: string[] = [];
      context.on('console', (message) => {
        if (message.type() === 'error' && HYDRATION_ERROR.test(message.text())) mismatches.push(message.text());
      });
      context.on('weberror', (error) => {
        if (HYDRATION_ERROR.test(String(error.error()))) mismatches.push(String(error.error()));
      });
      await use();
      expect(mismatches, 'pre-rendered markup that React could not adopt').toEqual([]);
    },
    { auto: true },
  ],
  cspGuard: [
    async ({ context }, use) => {
      const violations: string[] = [];
      await context.exposeBinding('reportCspViolation', (_source, text: string) => {
        violations.push(text);
      });
      await context.addInitScript(() => {
        document.addEventListener('securitypolicyviolation', (e) => {
          const report = (window as unknown as { reportCspViolation: (text: string) => void }).reportCspViolation;
          report(`${e.violatedDirective} blocked ${e.blockedURI || 'inline'} (${e.sourceFile}:${e.lineNumber})`);
        });
      });
      await use();
      expect(violations, 'Content-Security-Policy violations').toEqual([]);
    },
    { auto: true },
  ],
});

export { expect };
export type { APIRequestContext, Browser, Locator, Page } from '@playwright/test';
