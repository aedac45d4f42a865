import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { launchBrowser, newPage, screenshot, signIn, type ViewportName, VIEWPORTS } from './support';

const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Every path of the total ammonia panel: changes whenever that chart is redrawn differently. */
async function chartSignature(page: Page): Promise<string> {
  return page.locator('[data-testid="chart-panel-ammonia"] svg path').evaluateAll((els) => els.map((e) => e.getAttribute('d')).join('|'));
}

/** Drags the slider's thumb from its place `steps` px to the right, in small moves like a finger. */
async function dragSlider(page: Page, dx: number): Promise<void> {
  const slider = page.getByTestId('fish-count-slider');
  await slider.scrollIntoViewIfNeeded();
  const box = (await slider.boundingBox())!;
  const value = Number(await slider.inputValue());
  const max = Number(await slider.getAttribute('max'));
  const startX = box.x + ((value - 1) / (max - 1)) * box.width;
  const y = box.y + box.height / 2;
  await page.mouse.move(startX, y);
  await page.mouse.down();
  for (let i = 1; i <= 10; i++) await page.mouse.move(startX + (dx * i) / 10, y);
  await page.mouse.up();
}

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('plan and forecast at %s size', (size) => {
  it("opens the member's active plan, redraws the forecast while the slider moves, applies advice and saves", async () => {
    const { context, page } = await newPage(browser, size);
    await signIn(page, member);
    await page.getByTestId('tank-list').waitFor();

    await page.goto('/plans');
    await page.getByTestId('plans-list').getByText('Harlequin rasboras in three batches').click();
    await page.getByTestId('screen-plan').waitFor();
    // The saved plan's forecast from the server, with its numbers as text.
    await page.getByTestId('forecast-source').getByText(/Saved plan/).waitFor({ timeout: 30_000 });
    const peak = await page.getByTestId('forecast-peak-tan').innerText();
    expect(peak).toMatch(/^Peak [\d.]+ mg\/L .* on day \d+$/);
    expect(await page.getByTestId('forecast-peak-no2').innerText()).toMatch(/Peak/);
    expect(await page.getByTestId('plan-cautions').innerText()).toMatch(/water tests decide/);
    if (size === 'wide') await page.getByTestId('plan-wide').waitFor();
    await page.locator('[data-testid="chart-panel-ammonia"] svg path').first().waitFor();
    await screenshot(page, `plan-${size}`);

    // Drag the fish-count slider: the live forecast (run in the browser) redraws the chart.
    const before = await chartSignature(page);
    const countBefore = Number(await page.getByTestId('fish-count-slider').inputValue());
    await dragSlider(page, 60);
    await page.getByTestId('forecast-source').getByText(/Live forecast/).waitFor();
    const countAfter = Number(await page.getByTestId('fish-count-slider').inputValue());
    expect(countAfter).toBeGreaterThan(countBefore);
    await expect.poll(() => chartSignature(page)).not.toBe(before);
    await screenshot(page, `plan-dragged-${size}`);

    // Ask how fast the fish can go in, and apply the schedule.
    await page.getByTestId('advice-tab-addition').click();
    await page.getByTestId('advice-addition-run').click();
    await page.getByTestId('advice-addition-result').waitFor({ timeout: 45_000 });
    expect(await page.getByTestId('advice-all-at-once').innerText()).toMatch(/All at once/);
    expect(await page.getByTestId('advice-binding').innerText()).toMatch(/limit (that sets the pace|in the way)/);
    await screenshot(page, `plan-advice-${size}`);
    // A schedule can be applied only when the advice found one; otherwise it says why not.
    const apply = page.getByTestId('advice-apply');
    if ((await apply.count()) === 0) await page.getByTestId('advice-blocker').waitFor();
    else {
      await apply.click();
      expect(await page.getByTestId('event-timeline').innerText()).toMatch(/Add \d+ Harlequin rasbora/);
    }

    // Save: the forecast comes from the server again.
    await page.getByTestId('plan-save-button').click();
    await page.getByTestId('plan-saved').waitFor({ timeout: 30_000 });
    await page.getByTestId('forecast-source').getByText(/Saved plan/).waitFor({ timeout: 30_000 });
    await screenshot(page, `plan-saved-${size}`);

    // The printable plan: what to do on which day, what to test, what to do if readings are high.
    if (size === 'wide') {
      await page.getByTestId('plan-print-link').click();
      await page.getByTestId('print-days').waitFor();
      expect(await page.getByTestId('print-days').innerText()).toMatch(/Test total ammonia and nitrite/);
      expect(await page.getByTestId('print-if-high').innerText()).toMatch(/water change/);
      await screenshot(page, 'plan-print-wide');
    }
    await context.close();
  }, 90_000);
});
