import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { launchBrowser, newPage, screenshot, seriousFindings, signIn, VIEWPORTS, type ViewportName } from './support';

const sam = DEMO_PEOPLE.find((p) => p.key === 'keeper')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** A JSON call from inside the signed-in page (its cookie), for setting up what the test does not look at. */
async function api(page: Page, method: string, url: string, body?: unknown): Promise<{ status: number; body: { id: string } }> {
  return page.evaluate(
    async ({ method, url, body, header, value }) => {
      const res = await fetch(url, { method, headers: { 'content-type': 'application/json', [header]: value }, body: body === undefined ? undefined : JSON.stringify(body) });
      return { status: res.status, body: await res.json().catch(() => null) };
    },
    { method, url, body, header: CSRF_HEADER, value: CSRF_HEADER_VALUE },
  );
}

/** Whether the element's bottom edge is inside the window (above the fold). */
async function aboveTheFold(page: Page, testId: string): Promise<boolean> {
  const box = await page.getByTestId(testId).boundingBox();
  return box !== null && box.y + box.height <= page.viewportSize()!.height;
}

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('a plan’s life at %s size', (size) => {
  it('creates a plan, starts it, follows it from the tank page, logs a test that shows beside the forecast, and marks it done', async () => {
    // The phone in light, the wide screen in dark: axe checks both schemes.
    const { context, page } = await newPage(browser, size, size === 'phone' ? 'light' : 'dark');
    try {
      await signIn(page, sam);
      const tank = await api(page, 'POST', '/api/tanks', { name: `Plan life ${size} ${Date.now() % 100000}`, volumeL: 90 });
      expect(tank.status).toBe(201);
      const tankId = tank.body.id;
      expect((await api(page, 'POST', `/api/tanks/${tankId}/livestock`, { speciesId: 'neon-tetra', count: 8, lengthCm: 3 })).status).toBe(201);

      // The tank's first screen: its state and one next action (eight fish, never tested → a test).
      await page.goto(`/tanks/${tankId}`);
      await page.getByTestId('tank-overview').waitFor();
      expect(await page.getByTestId('tank-stock').innerText()).toContain('8 fish');
      expect(await page.getByTestId('tank-running-plan').innerText()).toContain('No plan running');
      await page.getByTestId('tank-action-log-test').waitFor();
      expect(await aboveTheFold(page, 'tank-next-action'), 'the next action on the first screen').toBe(true);

      // A plan through the plans page; a water change on day 3 through the event form.
      await page.goto(`/plans?tankId=${tankId}`);
      await page.getByTestId('plan-new-name').fill('Bigger water changes');
      await page.getByTestId('plan-new-submit').click();
      await page.getByTestId('screen-plan').waitFor();
      expect(await page.getByTestId('plan-status').innerText()).toBe('Draft');
      await page.getByTestId('event-type-water-change').click();
      await page.getByTestId('event-field-day').fill('3');
      await page.getByTestId('event-field-percent').fill('40');
      await page.getByTestId('event-submit').click();
      await page.getByTestId('event-timeline').getByText(/Change 40 %/).waitFor();
      // The header counts the unsaved event (it said "0 events" until saved before).
      expect(await page.getByTestId('plan-header').innerText()).toContain('1 event (unsaved changes)');
      await page.getByTestId('plan-life').scrollIntoViewIfNeeded();
      await screenshot(page, `plan-life-draft-${size}`);

      // Start: saves the draft, day 0 is today, the check days get their states.
      await page.getByTestId('plan-start').click();
      await page.getByTestId('plan-running-since').waitFor({ timeout: 30_000 });
      expect(await page.getByTestId('plan-status').innerText()).toBe('In progress');
      expect(await page.getByTestId('check-day-0-state').innerText()).toBe('Test today');
      expect(await page.getByTestId('check-day-3-state').innerText()).toBe('To come');
      await page.getByTestId('plan-due-today').waitFor();
      await page.locator('[data-testid="chart-panel-ammonia"] svg path').first().waitFor({ timeout: 30_000 });
      await page.getByTestId('plan-readings-none').waitFor();

      // The tank page follows the running plan: today (day 0) is a test day.
      await page.getByTestId('plan-tank-link').click();
      await page.getByTestId('tank-overview').waitFor();
      expect(await page.getByTestId('tank-running-plan').innerText()).toContain('Bigger water changes');
      expect(await page.getByTestId('tank-next-action-why').innerText()).toContain('Day 0 of “Bigger water changes” is a test day');
      await screenshot(page, `plan-life-tank-running-${size}`);
      expect(await aboveTheFold(page, 'tank-next-action'), 'the next action on the first screen').toBe(true);
      expect(await seriousFindings(page), 'tank page').toEqual([]);

      // Log today's test from the first screen's action: the form opens below.
      await page.getByTestId('tank-action-log-test').click();
      await page.getByTestId('quick-test-basis-N').click();
      await page.getByTestId('quick-test-tan').fill('0.5');
      await page.getByTestId('quick-test-no2').fill('0.05');
      await page.getByTestId('quick-test-save').click();
      await page.getByTestId('quick-test-saved').waitFor();
      // Tested today: the next action is the plan, with its next check day (day 3).
      await page.getByTestId('tank-action-open-plan').waitFor();
      expect(await page.getByTestId('tank-next-action-why').innerText()).toMatch(/^Next test day: .* \(day 3\): before the 40 % water change/);
      await page.getByTestId('tank-overview').scrollIntoViewIfNeeded();
      await screenshot(page, `plan-life-tank-tested-${size}`);

      // Back at the plan: the test is on the chart (a ring) and listed beside the forecast.
      await page.getByTestId('tank-action-open-plan').click();
      await page.getByTestId('plan-running-since').waitFor();
      await page.locator('[data-testid="chart-tested-ammonia"]').first().waitFor({ timeout: 30_000 });
      const listed = await page.getByTestId('plan-readings').innerText();
      expect(listed).toMatch(/Ammonia: tested 0\.5\d* mg\/L as N \(forecast \d/);
      expect(await page.getByTestId('check-day-0-state').innerText()).toBe('Tested');
      await page.getByTestId('plan-next-check').waitFor();
      await screenshot(page, `plan-life-running-${size}`);
      expect(await seriousFindings(page), 'running plan page').toEqual([]);

      // Mark as done (after a confirmation): read-only, its test kept beside the forecast.
      await page.getByTestId('plan-finish').click();
      await page.getByTestId('plan-finish-yes').click();
      await page.getByTestId('plan-done-summary').waitFor();
      expect(await page.getByTestId('plan-status').innerText()).toBe('Finished');
      expect(await page.getByTestId('event-form').count()).toBe(0);
      expect(await page.getByTestId('plan-save-button').count()).toBe(0);
      expect(await page.getByTestId('plan-readings').innerText()).toContain('tested 0.5');
      expect(await page.getByTestId('check-day-3-state').innerText()).toMatch(/Not needed/);
      await screenshot(page, `plan-life-done-${size}`);
      expect(await seriousFindings(page), 'finished plan page').toEqual([]);

      // The tank: nothing runs now, so the next action is a new plan.
      await page.getByTestId('plan-tank-link').click();
      await page.getByTestId('tank-action-plan-change').waitFor();
      expect(await page.getByTestId('tank-running-plan').innerText()).toContain('No plan running');
      expect((await api(page, 'DELETE', `/api/tanks/${tankId}`)).status).toBe(204);
    } finally {
      await context.close();
    }
  }, 120_000);
});
