import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { launchBrowser, newPage, screenshot, signIn } from './support';

const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** How the page writes a date `days` from now (the browser's own locale), with a day either side for midnight. */
async function datesAround(page: import('playwright-core').Page, days: number): Promise<string[]> {
  return page.evaluate((d) => {
    const f = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', year: 'numeric' });
    return [d - 1, d, d + 1].map((n) => f.format(new Date(Date.now() + n * 86_400_000)));
  }, days);
}

describe('a read-only link to a plan', () => {
  it('expires in 30 days unless the keeper picks a year, opens without an account showing only that plan, and stops working once revoked', async () => {
    const { context, page } = await newPage(browser, 'phone');
    await signIn(page, member);
    await page.getByTestId('tank-list').waitFor();
    await page.goto('/plans');
    await page.getByTestId('plans-list').getByText('Harlequin rasboras in three batches').click();
    await page.getByTestId('screen-plan').waitFor();

    const panel = page.getByTestId('share-links');
    await panel.scrollIntoViewIfNeeded();
    // The default link: 30 days.
    await page.getByTestId('share-create').click();
    await page.getByTestId('share-url').waitFor();
    await expect.poll(async () => page.getByTestId('share-link-line').count()).toBe(1);
    const month = await datesAround(page, 30);
    expect(month.some((d) => d.length > 0)).toBe(true);
    const firstLine = await page.getByTestId('share-link-line').first().innerText();
    expect(month.some((d) => firstLine.includes(`works until ${d}`)), firstLine).toBe(true);
    expect(await panel.innerText()).not.toMatch(/until revoked/);

    // The keeper chooses longer: a year.
    const firstUrl = (await page.getByTestId('share-url').innerText()).trim();
    await page.getByTestId('share-create-365').click();
    await expect.poll(async () => (await page.getByTestId('share-url').innerText()).trim()).not.toBe(firstUrl);
    const url = (await page.getByTestId('share-url').innerText()).trim();
    expect(url).toMatch(/\/s\/[A-Za-z0-9_-]{20,}$/);
    await expect.poll(async () => page.getByTestId('share-link-line').count()).toBe(2);
    const year = await datesAround(page, 365);
    const newest = await page.getByTestId('share-link-line').first().innerText();
    expect(year.some((d) => newest.includes(`works until ${d}`)), newest).toBe(true);
    await screenshot(page, 'plan-share-link-phone');

    // Someone without an account, on a wide screen.
    const visitor = await newPage(browser, 'wide');
    await visitor.page.goto(new URL(url).pathname);
    await visitor.page.getByTestId('shared-title').getByText('Harlequin rasboras in three batches').waitFor();
    await visitor.page.getByTestId('shared-plan-events').waitFor();
    const shown = await visitor.page.getByTestId('screen-shared').innerText();
    // Only the plan: not the keeper's address, nor her other tanks.
    expect(shown).not.toContain(member.email);
    await screenshot(visitor.page, 'shared-plan-wide');

    for (const left of [1, 0]) {
      await page.getByTestId('share-revoke').first().click();
      await expect.poll(async () => page.getByTestId('share-revoke').count()).toBe(left);
    }
    await visitor.page.reload();
    await visitor.page.getByTestId('shared-gone').waitFor();
    await visitor.context.close();
    await context.close();
  });
});
