import { AxeBuilder } from '@axe-core/playwright';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { launchBrowser, mailbox, newPage, screenshot, signIn, type ViewportName, VIEWPORTS } from './support';

const organizer = DEMO_PEOPLE.find((p) => p.key === 'organizer')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('club invites at %s size', (size) => {
  it('the organizer invites an address, sees it waiting, revokes it and sees it gone', async () => {
    // A fresh address each run, so a rerun against the same database starts clean.
    const email = `visitor.${size}.${Date.now()}@example.org`;
    const { context, page } = await newPage(browser, size);
    await signIn(page, organizer);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));

    await page.goto('/clubs');
    await page.getByTestId('club-link').first().click();
    const card = page.getByTestId('club-invite');
    await card.waitFor();
    await page.getByTestId('club-pending-invites').waitFor();

    await page.getByTestId('club-invite-email').fill(email);
    await page.getByTestId('club-invite-submit').click();
    await page.getByTestId('club-invite-sent').waitFor();
    // The list refreshes after inviting: the address is there, with its expiry and a labelled button.
    const row = page.getByTestId('club-pending-invite').filter({ hasText: email });
    await row.waitFor();
    expect(await row.innerText()).toMatch(/Link works until .+\(in 7 days\)/);
    await expect.poll(async () => (await mailbox()).some((m) => m.to.includes(email))).toBe(true);
    await card.scrollIntoViewIfNeeded();
    await screenshot(page, `club-invites-${size}`);
    // The invite card with a pending row: no serious or critical axe findings.
    const axe = await new AxeBuilder({ page: page as never }).include('[data-testid="club-invite"]').analyze();
    expect(axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.help}`)).toEqual([]);

    await page.getByRole('button', { name: `Revoke the invite to ${email}` }).click();
    await row.waitFor({ state: 'detached' });
    await expect.poll(() => page.getByTestId('club-invite-sent').count()).toBe(0);
    expect(await page.getByTestId('club-pending-invites').innerText()).not.toContain(email);
    await context.close();
  });
});
