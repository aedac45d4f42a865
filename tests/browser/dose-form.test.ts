import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { AMMONIA_HANDLING_CAUTIONS, DOSING_WITH_FISH_CAUTIONS } from '../../simulation/advice/cautions';
import { launchBrowser, newPage, screenshot, signIn, type ViewportName, VIEWPORTS } from './support';

const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('the ammonia dose form at %s size', (size) => {
  it('offers once, N times a day or continuous, shows the handling and fish-present cautions, and says the split in the timeline', async () => {
    const { context, page } = await newPage(browser, size);
    await signIn(page, member);
    await page.goto('/plans');
    await page.getByTestId('plans-list').getByText('Harlequin rasboras in three batches').click();
    await page.getByTestId('screen-plan').waitFor();

    await page.getByTestId('event-type-ammonia-dose').click();
    const form = page.getByTestId('event-form');
    // A new dose goes in once; "Times a day" appears only for N times a day.
    expect(await page.getByTestId('event-field-delivery-once').getAttribute('aria-checked')).toBe('true');
    expect(await page.getByTestId('event-field-timesPerDay').count()).toBe(0);
    await page.getByTestId('event-field-delivery-split').click();
    await page.getByTestId('event-field-timesPerDay').waitFor();
    await page.getByTestId('event-field-timesPerDay').fill('4');
    await page.getByTestId('event-field-day').fill('2');
    await page.getByTestId('event-field-mgNPerL').fill('0.4');
    await page.getByTestId('event-field-repeatEveryDays').fill('1');
    await page.getByTestId('event-field-repeatCount').fill('10');

    // The member's tank holds fish: both cautions, in the engine's words.
    const handling = await page.getByTestId('dose-caution-handling').innerText();
    for (const c of AMMONIA_HANDLING_CAUTIONS) expect(handling).toContain(c);
    expect(await page.getByTestId('dose-caution-fish').innerText()).toContain(DOSING_WITH_FISH_CAUTIONS[0]);
    await page.getByTestId('event-field-delivery').scrollIntoViewIfNeeded();
    await screenshot(page, `dose-form-${size}`);
    await page.getByTestId('dose-cautions').scrollIntoViewIfNeeded();
    await screenshot(page, `dose-form-cautions-${size}`);

    // A refusal lands under its field.
    await page.getByTestId('event-field-timesPerDay').fill('12');
    await page.getByTestId('event-submit').click();
    expect(await form.innerText()).toMatch(/at most 8/);

    await page.getByTestId('event-field-timesPerDay').fill('4');
    await page.getByTestId('event-submit').click();
    expect(await page.getByTestId('event-timeline').innerText()).toMatch(/Dose ammonia 0\.4 mg N\/L in 4 equal doses 6 h apart, every day, 10 times/);

    // Continuous: no "Times a day"; the sentence says pump or drip.
    await page.getByTestId('event-type-ammonia-dose').click();
    await page.getByTestId('event-field-delivery-continuous').click();
    expect(await page.getByTestId('event-field-timesPerDay').count()).toBe(0);
    await page.getByTestId('event-field-day').fill('3');
    await page.getByTestId('event-field-repeatEveryDays').fill('1');
    await page.getByTestId('event-field-repeatCount').fill('5');
    await page.getByTestId('event-submit').click();
    expect(await page.getByTestId('event-timeline').innerText()).toMatch(/a day for 5 days, continuously \(dosing pump or drip\)/);
    await context.close();
  });
});
