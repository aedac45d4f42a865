import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { DEMO_LESSONS } from '../../server/demo-lessons';
import { forecast } from '../../simulation/forecast';
import { peakOf } from '../../simulation/series-stats';
import { fromPixels, guessGeometry } from '../../components/lessons/guess-geometry';
import { shortValue } from '../../components/lessons/guess-score';
import { launchBrowser, newPage, screenshot, signIn, type ViewportName, VIEWPORTS } from './support';

const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;
const lesson = DEMO_LESSONS.find((l) => l.key === 'big-purchase')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('a starter lesson at %s size', (size) => {
  it('the demo member opens it, drags a guess, reveals the forecast and sees how close it was', async () => {
    const { context, page } = await newPage(browser, size);
    await signIn(page, member);
    await page.getByTestId('tank-list').waitFor();

    await page.goto('/lessons');
    await page.getByTestId('screen-lessons').getByText(lesson.title).click();
    await page.getByTestId('lesson-title').waitFor();
    expect(await page.getByTestId('lesson-step-0').innerText()).toContain(lesson.steps[0].title);

    // Drag the marker like a finger: press on the chart, move in small steps, release.
    const area = page.getByTestId('guess-chart-area');
    await area.scrollIntoViewIfNeeded();
    const box = (await area.boundingBox())!;
    const start = { x: box.x + box.width * 0.3, y: box.y + box.height * 0.6 };
    const end = { x: box.x + box.width * 0.2, y: box.y + box.height * 0.35 };
    await page.mouse.move(start.x, start.y);
    await page.mouse.down();
    for (let i = 1; i <= 8; i++) await page.mouse.move(start.x + ((end.x - start.x) * i) / 8, start.y + ((end.y - start.y) * i) / 8);
    await page.mouse.up();
    const g = guessGeometry({ horizonDays: lesson.scenario.horizonDays!, width: Math.round(box.width), limitMgN: 0.1 });
    const expected = fromPixels(end.x - box.x, end.y - box.y, g);
    await expect.poll(() => page.getByTestId('lesson-guess-value').innerText()).toBe(`Your guess: day ${expected.day}, ${shortValue(expected.value)} mg/L nitrite as N`);
    await screenshot(page, `lesson-guess-${size}`);

    await page.getByTestId('lesson-reveal').click();
    const score = page.getByTestId('lesson-score');
    await score.waitFor();
    // The browser ran the same engine: its peak matches the one computed here.
    const f = forecast(lesson.scenario);
    const peak = peakOf(f.series.days, f.series.no2MgN);
    expect(await score.innerText()).toContain(`Forecast peak: day ${peak.day}, ${shortValue(peak.value)} mg/L.`);
    expect(await score.innerText()).toMatch(/You were (on the right day|\d+ days? (early|late))/);
    await page.getByTestId('guess-peak').waitFor({ state: 'attached' });

    // Fast and staged side by side on a wide screen, one above the other on a phone.
    const fast = (await page.getByTestId('lesson-forecast-fast').boundingBox())!;
    const staged = (await page.getByTestId('lesson-forecast-staged').boundingBox())!;
    if (size === 'wide') {
      expect(Math.abs(fast.y - staged.y)).toBeLessThan(2);
      expect(staged.x).toBeGreaterThan(fast.x + fast.width - 1);
    } else {
      expect(staged.y).toBeGreaterThan(fast.y + fast.height - 1);
    }
    const stagedPeak = peakOf(forecast(lesson.stagedScenario!).series.days, forecast(lesson.stagedScenario!).series.no2MgN);
    expect(await page.getByTestId('lesson-peak-staged').innerText()).toContain(`day ${stagedPeak.day} at ${shortValue(stagedPeak.value)} mg/L`);
    await page.getByTestId('lesson-cautions').waitFor();
    await screenshot(page, `lesson-revealed-${size}`);
    await page.getByTestId('lesson-forecasts').scrollIntoViewIfNeeded();
    await screenshot(page, `lesson-compare-${size}`);
    await context.close();
  }, 60_000);
});
