import { expect, test as base } from '@playwright/test';

/**
 * Playwright's `test`, with every page of a test's browser context watched for
 * Content-Security-Policy violations: the browser reports each thing the
 * server's policy blocks as a securitypolicyviolation event, and a test that saw
 * one fails. So the whole browser suite runs, and passes, under the real CSP.
 */
export const test = base.extend<{ cspGuard: void }>({
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
