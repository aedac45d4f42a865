import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { launchBrowser, mailbox, mailedLink, newPage, screenshot, signUp, VIEWPORTS, type ViewportName } from './support';

const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('at %s size', (size) => {
  it('sends a signed-out visitor to sign-in, then shows the keeper their own tanks', async () => {
    const { context, page } = await newPage(browser, size);
    await page.goto('/');
    await page.getByTestId('screen-sign-in').waitFor();
    await screenshot(page, `sign-in-${size}`);

    await page.getByTestId('sign-in-email').fill(member.email);
    await page.getByTestId('sign-in-password').fill(member.password);
    await page.getByTestId('sign-in-submit').click();

    await page.getByTestId('tank-list').waitFor();
    const cards = page.locator('[data-testid^="tank-card-"][role="link"], a[data-testid^="tank-card-"]');
    const names = await page.getByTestId('tank-list').innerText();
    expect(names).toContain('Living-room community');
    expect(names).toContain('Shrimp cube');
    expect(await cards.count()).toBeGreaterThanOrEqual(2);
    // Phone gets a bottom bar, wide a side rail.
    await page.getByTestId(size === 'phone' ? 'nav-bottom-bar' : 'nav-side-rail').waitFor();
    await screenshot(page, `home-${size}`);

    await cards.first().click();
    await page.getByTestId('tank-name').waitFor();
    await page.getByTestId('tank-livestock').waitFor();
    await screenshot(page, `tank-${size}`);
    await context.close();
  });

  it('shows a wrong password as a message on the sign-in form and keeps what was typed', async () => {
    const { context, page } = await newPage(browser, size);
    await page.goto('/sign-in');
    await page.getByTestId('sign-in-email').fill(member.email);
    await page.getByTestId('sign-in-password').fill('not-the-right-one');
    await page.getByTestId('sign-in-submit').click();
    await page.getByTestId('sign-in-banner').waitFor();
    expect(await page.getByTestId('sign-in-email').inputValue()).toBe(member.email);
    await context.close();
  });
});

describe('account life cycle in the browser', () => {
  it('signs up, sees the empty state, signs out and cannot come back without signing in', async () => {
    const { context, page } = await newPage(browser, 'phone', 'dark');
    await signUp(page, { displayName: 'Newcomer', email: `newcomer-${Date.now()}@example.org`, password: 'tidal-pebble-heron-90' });
    await screenshot(page, 'home-empty-phone-dark');

    await page.goto('/account');
    await page.getByTestId('sign-out').click();
    await page.getByTestId('screen-sign-in').waitFor();
    await page.goto('/');
    await page.getByTestId('screen-sign-in').waitFor();
    await context.close();
  });

  it('answers a sign-up for an e-mail that has an account like any other, and e-mails its owner instead', async () => {
    const { context, page } = await newPage(browser, 'wide');
    await page.goto('/sign-up');
    await page.getByTestId('sign-up-name').fill('Someone');
    await page.getByTestId('sign-up-email').fill(member.email);
    await page.getByTestId('sign-up-password').fill('tidal-pebble-heron-90');
    await page.getByTestId('sign-up-submit').click();
    const sent = await page.getByTestId('sign-up-sent').innerText();
    expect(sent).toMatch(/if it already has one, the e-mail helps you sign in/);
    await screenshot(page, 'sign-up-sent-wide');
    // The owner hears of the attempt, with a way in (sent just after the answer).
    await mailedLink(member.email, /https?:\/\/\S+\/sign-in\b/);
    const mail = (await mailbox()).find((m) => m.to.includes(member.email));
    expect(mail?.subject).toBe('You already have a Shoalshift account');
    await context.close();
  });

  it('resets a forgotten password through the e-mailed link', async () => {
    // A fresh account, so other test files' demo sign-ins keep their passwords.
    const keeper = { email: `forgetful-${Date.now()}@example.org` };
    const { context, page } = await newPage(browser, 'phone');
    await signUp(page, { displayName: 'Forgetful', email: keeper.email, password: 'tidal-pebble-heron-90' });
    await page.goto('/account');
    await page.getByTestId('sign-out').click();
    await page.getByTestId('screen-sign-in').waitFor();

    await page.goto('/forgot-password');
    await page.getByTestId('forgot-email').fill(keeper.email);
    await page.getByTestId('forgot-submit').click();
    await page.getByTestId('forgot-sent').waitFor();

    let link: string | undefined;
    for (let i = 0; i < 50 && !link; i++) {
      const mail = (await mailbox()).find((m) => m.to.includes(keeper.email));
      link = mail?.text.match(/https?:\/\/\S+reset-password\?token=[\w-]+/)?.[0];
      if (!link) await new Promise((r) => setTimeout(r, 100));
    }
    expect(link, 'the reset e-mail reached the local fake with a link').toBeDefined();
    await page.goto(new URL(link!).pathname + new URL(link!).search);
    await page.getByTestId('reset-password').fill('harbour-lantern-otter-45');
    await page.getByTestId('reset-submit').click();
    await page.getByTestId('reset-done').waitFor();

    await page.goto('/sign-in');
    await page.getByTestId('sign-in-email').fill(keeper.email);
    await page.getByTestId('sign-in-password').fill('harbour-lantern-otter-45');
    await page.getByTestId('sign-in-submit').click();
    await page.getByTestId('screen-home').waitFor();
    await context.close();
  });
});
