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

describe('a read-only link to a plan', () => {
  it('is made on the plan page, opens without an account showing only that plan, and stops working once revoked', async () => {
    const { context, page } = await newPage(browser, 'phone');
    await signIn(page, member);
    await page.getByTestId('tank-list').waitFor();
    await page.goto('/plans');
    await page.getByTestId('plans-list').getByText('Harlequin rasboras in three batches').click();
    await page.getByTestId('screen-plan').waitFor();

    const panel = page.getByTestId('share-links');
    await panel.scrollIntoViewIfNeeded();
    await page.getByTestId('share-create-7').click();
    const url = (await page.getByTestId('share-url').innerText()).trim();
    expect(url).toMatch(/\/s\/[A-Za-z0-9_-]{20,}$/);
    expect(await panel.innerText()).toMatch(/works until/);
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

    await page.getByTestId('share-revoke').first().click();
    await expect.poll(async () => page.getByTestId('share-revoke').count()).toBe(0);
    await visitor.page.reload();
    await visitor.page.getByTestId('shared-gone').waitFor();
    await visitor.context.close();
    await context.close();
  });
});
