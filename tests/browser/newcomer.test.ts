import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, newPage, screenshot, signUp } from './support';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('a newcomer on a phone', () => {
  it('signs up, creates a tank, adds fish, plans a purchase, sees its forecast, asks for advice, saves, and logs a test', async () => {
    const { context, page } = await newPage(browser, 'phone');
    try {
      // Sign-up finishes with the e-mailed link (the answer never tells who has an account).
      await signUp(page, { displayName: 'New Keeper', email: `journey-${Date.now()}@example.org`, password: 'tidal-pebble-heron-90' });

      // A tank from a name and a volume; everything else defaulted.
      await page.getByTestId('home-new-tank').click();
      await page.getByTestId('new-tank-name').fill('Bedroom 60');
      await page.getByTestId('new-tank-volume').fill('60');
      await page.getByTestId('new-tank-submit').click();
      await page.getByTestId('tank-name').waitFor();

      await page.getByTestId('livestock-species-search').fill('zebra');
      await page.getByTestId('livestock-species-option-zebra-danio').click();
      await page.getByTestId('livestock-count').fill('6');
      await page.getByTestId('livestock-submit').click();
      await page.getByTestId('livestock-added').waitFor();

      // A plan for this tank: six more danios on day 2.
      await page.goto('/plans');
      await page.getByTestId('plan-new-name').fill('Six more danios');
      await page.getByTestId('plan-new-submit').click();
      await page.getByTestId('screen-plan').waitFor();
      await page.getByTestId('event-type-add-fish').click();
      await page.getByTestId('event-field-day').fill('2');
      // The tank's own fish are offered first: one tap picks them.
      await page.getByTestId('event-fish-0-species-option-zebra-danio').click();
      await page.getByTestId('event-field-fish.0.count').fill('6');
      await page.getByTestId('event-submit').click();
      await page.getByTestId('event-timeline').getByText(/Add 6/).waitFor();

      // The forecast, in numbers as well as a chart, with the cautions.
      await page.locator('[data-testid="chart-panel-ammonia"] svg path').first().waitFor({ timeout: 30_000 });
      expect(await page.getByTestId('forecast-peak-tan').innerText()).toMatch(/Peak/);
      expect(await page.getByTestId('plan-cautions').innerText()).toMatch(/water tests decide/);

      await page.getByTestId('plan-save-button').click();
      await page.getByTestId('plan-saved').waitFor({ timeout: 30_000 });

      await page.getByTestId('advice-tab-addition').click();
      await page.getByTestId('advice-addition-run').click();
      await page.getByTestId('advice-addition-result').waitFor({ timeout: 45_000 });
      expect(await page.getByTestId('advice-all-at-once').innerText()).toMatch(/All at once/);
      const apply = page.getByTestId('advice-apply');
      if ((await apply.count()) > 0) {
        await apply.click();
        await page.getByTestId('plan-save-button').click();
        await page.getByTestId('plan-saved').waitFor({ timeout: 30_000 });
      }
      await screenshot(page, 'newcomer-plan-phone');

      // Back at the tank: a water test in seconds.
      await page.getByTestId('plan-header').getByText('Open the tank').click();
      await page.getByTestId('quick-test-tan').fill('0');
      await page.getByTestId('quick-test-no2').fill('0');
      await page.getByTestId('quick-test-save').click();
      await page.getByTestId('quick-test-saved').waitFor();
      await screenshot(page, 'newcomer-tank-phone');
    } finally {
      await context.close();
    }
  });
});
