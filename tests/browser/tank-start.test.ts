import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { launchBrowser, newPage, screenshot, signIn, VIEWPORTS, type ViewportName } from './support';

const sam = DEMO_PEOPLE.find((p) => p.key === 'keeper')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('a forecast starts from the tank\'s own test (%s)', (size) => {
  it('logs high readings, and the next plan forecast starts from them and warns that a settled tank does not read so', async () => {
    const { context, page } = await newPage(browser, size);
    await signIn(page, sam);
    // A tank of its own, so no other test's readings or fits touch it.
    const name = `High test ${size} ${Date.now() % 100000}`;
    await page.getByTestId('home-new-tank').click();
    await page.getByTestId('screen-new-tank').waitFor();
    await page.getByTestId('new-tank-name').fill(name);
    await page.getByTestId('new-tank-volume').fill('120');
    await page.getByTestId('new-tank-submit').click();
    await page.getByTestId('tank-name').waitFor();
    await page.getByTestId('livestock-species-search').fill('neon');
    await page.getByTestId('livestock-species-option-neon-tetra').click();
    await page.getByTestId('livestock-count').fill('10');
    await page.getByTestId('livestock-submit').click();
    await page.getByTestId('livestock-added').waitFor();

    // Total ammonia 2 and nitrite 1 mg/L as N, logged now.
    await page.getByTestId('quick-test-basis-N').click();
    await page.getByTestId('quick-test-tan').fill('2');
    await page.getByTestId('quick-test-no2').fill('1');
    await page.getByTestId('quick-test-save').click();
    await page.getByTestId('quick-test-saved').waitFor();
    await page.getByTestId('tank-start').scrollIntoViewIfNeeded();
    await screenshot(page, `tank-start-section-${size}`);

    // A new plan on that tank, starting today (the plans fold opens first).
    await page.getByTestId('tank-plans-toggle').click();
    await page.getByTestId('tank-new-plan').click();
    await page.getByTestId('plan-new').waitFor();
    await page.getByTestId('plan-new-name').fill('After the high test');
    await page.getByTestId('plan-new-submit').click();
    await page.getByTestId('screen-plan').waitFor();
    const start = page.getByTestId('forecast-start');
    await start.getByText(/^From your test of/).waitFor({ timeout: 30_000 });
    // In the keeper's basis: 2 and 1 mg/L as N, or 2.6 mg NH4+/L and 3.3 mg NO2−/L as the ion (molar masses, simulation/units.ts).
    expect(await start.innerText()).toMatch(/From your test of \d{1,2} \w{3}: total ammonia (2, nitrite 1 mg\/L as N|2\.6, nitrite 3\.3 \(mg\/L NH4\+)/);
    expect(await page.getByTestId('forecast-start-warnings').innerText()).toMatch(/which a settled tank does not read/);
    // The chart starts at the test: its ammonia peak is at least the logged 2 mg/L as N (more as the ion).
    const peak = Number((await page.getByTestId('forecast-peak-tan').innerText()).match(/Peak ([\d.]+)/)![1]);
    expect(peak).toBeGreaterThanOrEqual(2);
    await page.getByTestId('forecast-start-warnings').scrollIntoViewIfNeeded();
    await screenshot(page, `tank-start-plan-${size}`);
    await context.close();
  }, 90_000);
});
