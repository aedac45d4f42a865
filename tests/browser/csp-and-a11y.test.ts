import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { launchBrowser, newPage, seriousFindings, type ViewportName } from './support';

const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Records every CSP violation the page reports (the DOM event and the console line). */
async function watchCsp(page: Page): Promise<string[]> {
  const violations: string[] = [];
  page.on('console', (msg) => {
    if (/Content Security Policy|Refused to (load|execute|apply|connect|frame)/i.test(msg.text())) violations.push(msg.text());
  });
  await page.exposeFunction('__reportCsp', (text: string) => violations.push(text));
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { __reportCsp(t: string): void }).__reportCsp(`${e.violatedDirective} blocked ${e.blockedURI} at ${e.sourceFile}:${e.lineNumber}:${e.columnNumber}`);
    });
  });
  return violations;
}

const combos: [ViewportName, 'light' | 'dark'][] = [
  ['phone', 'light'],
  ['phone', 'dark'],
  ['wide', 'light'],
  ['wide', 'dark'],
];

describe('the web app under its Content Security Policy, checked with axe', () => {
  for (const [size, scheme] of combos) {
    it(`${size}, ${scheme}: the main pages have no CSP violations and no serious or critical axe findings`, async () => {
      const { context, page } = await newPage(browser, size, scheme);
      try {
        const violations = await watchCsp(page);
        const first = await page.goto('/');
        expect(first?.headers()['content-security-policy']).toContain("script-src 'self'");
        await page.getByTestId('screen-sign-in').waitFor();
        expect(await seriousFindings(page), 'sign-in page').toEqual([]);

        // Sign in through the API in this browser context (its cookie jar), then load home.
        const signIn = await context.request.post('/api/auth/sign-in', {
          data: { email: member.email, password: member.password },
          headers: { [CSRF_HEADER]: CSRF_HEADER_VALUE },
        });
        expect(signIn.status()).toBe(200);
        await page.goto('/');
        await page.getByTestId('tank-list').waitFor();
        expect(await seriousFindings(page), 'home page').toEqual([]);

        // The keeper's other main pages: a tank, a plan with its forecast chart, settings, lessons.
        await page.locator('[data-testid^="tank-card-"][role="link"], a[data-testid^="tank-card-"]').first().click();
        await page.getByTestId('tank-livestock').waitFor();
        expect(await seriousFindings(page), 'tank page').toEqual([]);
        await page.goto('/plans');
        await page.locator('[data-testid^="plans-item-"]').first().click();
        await page.getByTestId('forecast-chart').waitFor();
        expect(await seriousFindings(page), 'plan page').toEqual([]);
        await page.goto('/settings');
        await page.getByTestId('screen-settings').waitFor();
        expect(await seriousFindings(page), 'settings page').toEqual([]);
        await page.goto('/lessons');
        await page.getByTestId('screen-lessons').waitFor();
        expect(await seriousFindings(page), 'lessons page').toEqual([]);
        expect(violations, 'CSP violations').toEqual([]);
      } finally {
        await context.close();
      }
    });
  }
});
