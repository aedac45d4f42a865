import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
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

/** Puts the person's units back through the settings screen (the demo keeper starts metric, as N). */
async function setUnits(page: Page, volume: 'L' | 'USgal', temperature: 'C' | 'F', basis: 'N' | 'ion') {
  await page.goto('/settings');
  await page.getByTestId('screen-settings').waitFor();
  for (const id of [`settings-volume-${volume}`, `settings-temperature-${temperature}`, `settings-basis-${basis}`]) {
    const option = page.getByTestId(id);
    if ((await option.getAttribute('aria-checked')) !== 'true') {
      await option.click();
      await page.waitForFunction((sel) => document.querySelector(`[data-testid="${sel}"]`)?.getAttribute('aria-checked') === 'true', id);
      await page.getByTestId('settings-saved').waitFor();
    }
  }
}

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('keeper tanks at %s size', (size) => {
  it('creates a tank, adds fish, logs a test, switches units, imports a CSV', async () => {
    const { context, page } = await newPage(browser, size, size === 'phone' ? 'light' : 'dark');
    await signIn(page, sam);
    await setUnits(page, 'L', 'C', 'N');

    // New tank from a name, a volume and a filter kind.
    await page.goto('/');
    await page.getByTestId('home-new-tank').click();
    await page.getByTestId('screen-new-tank').waitFor();
    const name = `Quarantine ${size} ${Date.now() % 100000}`;
    await page.getByTestId('new-tank-name').fill(name);
    await page.getByTestId('new-tank-volume').fill('abc');
    await page.getByTestId('new-tank-submit').click();
    await page.getByTestId('new-tank-volume-error').waitFor();
    expect(await page.getByTestId('new-tank-name').inputValue()).toBe(name);
    await page.getByTestId('new-tank-volume').fill('120');
    await page.getByTestId('new-tank-filter-sponge').click();
    await page.getByTestId('new-tank-more').click();
    await page.getByTestId('new-tank-details').waitFor();
    await screenshot(page, `keeper-new-tank-${size}`);
    await page.getByTestId('new-tank-submit').click();
    await page.getByTestId('tank-name').waitFor();
    expect(await page.getByTestId('tank-name').innerText()).toBe(name);
    expect(await page.getByTestId('tank-facts').innerText()).toContain('120 L · 25 °C');

    // Fish from the catalogue.
    await page.getByTestId('livestock-species-search').fill('neon');
    await page.getByTestId('livestock-species-option-neon-tetra').click();
    await page.getByTestId('livestock-count').fill('8');
    await page.getByTestId('livestock-submit').click();
    await page.getByTestId('livestock-added').waitFor();
    expect(await page.getByTestId('tank-livestock').innerText()).toContain('Neon tetra');

    // A water test at the tank, as N: nitrate 10 mg/L as N, nitrite over its 0.1 limit.
    await page.getByTestId('quick-test-basis-N').click();
    await page.getByTestId('quick-test-tan').fill('0.25');
    await page.getByTestId('quick-test-no2').fill('0.3');
    await page.getByTestId('quick-test-no3').fill('10');
    await page.getByTestId('quick-test-temperature').fill('25');
    await page.getByTestId('quick-test-save').click();
    await page.getByTestId('quick-test-saved').waitFor();
    // The test log is folded below the tank's first screen until opened.
    await page.getByTestId('tank-readings-toggle').click();
    await page.getByTestId('readings-table').waitFor();
    const table = await page.getByTestId('readings-table').innerText();
    expect(table).toContain('Over limit');
    await page.getByTestId('tank-latest-over').waitFor();
    await screenshot(page, `keeper-tank-${size}`);
    await page.getByTestId('readings-table').scrollIntoViewIfNeeded();
    await screenshot(page, `keeper-test-log-${size}`);

    // US gallons, °F, as the ion: 120 L = 31.7 US gal; 25 °C = 77 °F; nitrate 10 mg N/L = 44.3 mg NO3−/L (MODEL.md §4.6).
    await setUnits(page, 'USgal', 'F', 'ion');
    await screenshot(page, `keeper-settings-${size}`);
    await page.goto('/');
    await page.getByTestId('tank-list').waitFor();
    const card = page.locator('[data-testid^="tank-card-"]', { hasText: name }).first();
    await card.waitFor();
    const cardText = await card.innerText();
    expect(cardText).toContain('31.7 US gal · 77 °F');
    expect(cardText).toContain('Over a limit');
    await screenshot(page, `keeper-home-us-${size}`);
    await card.click();
    await page.getByTestId('tank-name').waitFor();
    expect(await page.getByTestId('tank-facts').innerText()).toContain('31.7 US gal · 77 °F');
    expect(await page.getByTestId('tank-latest-figures-no3MgN').innerText()).toBe('44');
    await page.getByTestId('tank-readings-toggle').click();
    expect(await page.getByTestId('readings-table').innerText()).toContain('77');

    // CSV import through the upload control: a bad row first (nothing imported), then a good file.
    const dir = mkdtempSync(path.join(tmpdir(), 'keeper-csv-'));
    const header = 'taken_at,basis,total_ammonia,nitrite,nitrate,ph,temperature_c,kh_dkh,note';
    const bad = path.join(dir, 'bad.csv');
    writeFileSync(bad, `${header}\n2026-01-02T08:00:00Z,N,0.1,0,5,7.2,25,4,\n2026-01-03T08:00:00Z,N,lots,0,5,7.2,25,4,\n`);
    await page.getByTestId('csv-file').setInputFiles(bad);
    await page.getByTestId('csv-row-error-3').waitFor();
    await page.getByTestId('csv-row-errors').scrollIntoViewIfNeeded();
    await screenshot(page, `keeper-csv-errors-${size}`);
    expect(await page.getByTestId('csv-row-error-3').innerText()).toContain('total_ammonia');
    const good = path.join(dir, 'good.csv');
    writeFileSync(good, `${header}\n2026-01-02T08:00:00Z,N,0.1,0,5,7.2,25,4,imported one\n2026-01-03T08:00:00Z,ion,0.5,0,20,7.2,25,4,imported two\n`);
    await page.getByTestId('csv-file').setInputFiles(good);
    await page.getByTestId('csv-confirm').waitFor();
    await page.getByTestId('csv-preview').scrollIntoViewIfNeeded();
    await screenshot(page, `keeper-csv-preview-${size}`);
    await page.getByTestId('csv-confirm').click();
    await page.getByTestId('csv-result-ok').waitFor();
    await page.waitForFunction(() => document.querySelector('[data-testid="readings-page"]')?.textContent?.includes('3 tests'));
    expect(await page.getByTestId('readings-table').innerText()).toContain('imported two');

    // Back to metric for the next run, then clean up the tank.
    await setUnits(page, 'L', 'C', 'N');
    await page.goto('/');
    await page.locator('[data-testid^="tank-card-"]', { hasText: name }).first().click();
    await page.getByTestId('tank-delete').click();
    await page.getByTestId('tank-delete-yes').click();
    await page.getByTestId('screen-home').waitFor();
    await context.close();
  });
});
