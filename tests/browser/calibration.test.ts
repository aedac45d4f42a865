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

describe('Fit to my tests on the demo plan', () => {
  it('shows what it is fitting while it runs, then the fit with the band moving the way it says', async () => {
    const { context, page } = await newPage(browser, 'wide');
    await signIn(page, member);
    await page.goto('/plans');
    await page.getByTestId('plans-list').getByText('Harlequin rasboras in three batches').click();
    await page.getByTestId('screen-plan').waitFor();
    await page.getByTestId('advice-tab-calibration').click();

    // Hold the answer back a second so the running state is seen however fast the server is.
    await page.route('**/calibration', async (route) => {
      const response = await route.fetch();
      await new Promise((r) => setTimeout(r, 1000));
      await route.fulfill({ response });
    });
    await page.getByTestId('advice-calibration-run').click();
    await page.getByTestId('calibration-progress').waitFor();
    expect(await page.getByTestId('advice-calibration-run').innerText()).toMatch(/Fitting your \d+\+? tests…/);
    await screenshot(page, 'calibration-running');

    // Liveness only (the speed is measured by bench:advice): the demo history fits in seconds.
    await page.getByTestId('advice-calibration-result').waitFor({ timeout: 15_000 });
    const result = await page.getByTestId('advice-calibration-result').innerText();
    expect(result).toMatch(/Fit: (good|fair|poor) \(\d+ tests\)/);
    expect(result).toMatch(/the band for total ammonia (narrows by \d+ %|widens|stays about as wide)/);
    expect(await page.getByTestId('calibration-progress').count()).toBe(0);
    await screenshot(page, 'calibration-result');
    await context.close();
  }, 60_000);
});
