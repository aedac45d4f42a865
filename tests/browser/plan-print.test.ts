import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { DEMO_PEOPLE } from '../../server/demo-people';
import type { PlanDetail } from '../../shared/schemas/plan';
import { launchBrowser, newPage, screenshot, signIn, type ViewportName, VIEWPORTS } from './support';

const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function seriousFindings(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page: page as never }).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(', ')}`);
}

async function openPlan(page: Page): Promise<void> {
  await page.goto('/plans');
  await page.getByTestId('plans-list').getByText('Harlequin rasboras in three batches').click();
  await page.getByTestId('forecast-source').getByText(/Saved plan/).waitFor({ timeout: 30_000 });
}

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('the forecast verdict and the printable plan at %s size', (size) => {
  it('shows the verdict above the chart, marks the plan events, and prints every day of the plan without its controls', async () => {
    const { context, page } = await newPage(browser, size);
    type AddFish = Extract<PlanDetail['events'][number], { type: 'add-fish' }>;
    try {
      await signIn(page, member);
      await openPlan(page);
      // One verdict sentence first, then the charts: nitrite on its own panel, events marked.
      const verdict = page.getByTestId('forecast-summary-verdict');
      await page.locator('[data-testid="chart-panel-nitrite"] svg path').first().waitFor();
      expect(await page.getByTestId('forecast-summary-sentence').innerText()).toMatch(/limit/);
      const verdictBox = (await verdict.boundingBox())!;
      const chartBox = (await page.getByTestId('chart-panel-ammonia').boundingBox())!;
      expect(verdictBox.y + verdictBox.height).toBeLessThanOrEqual(chartBox.y);
      // Other tests may reschedule this plan: the expectations follow its saved events.
      const planId = page.url().split('/').pop()!;
      const plan = (await page.evaluate(async (id) => (await fetch(`/api/plans/${id}`)).json(), planId)) as PlanDetail;
      const adds = plan.events.filter((e): e is AddFish => e.type === 'add-fish');
      const legend = await page.getByTestId('forecast-chart-events').innerText();
      for (const e of adds) expect(legend).toContain(`day ${e.day}: Add ${e.fish[0]!.count} Harlequin rasbora`);
      expect(await page.getByTestId('forecast-basis-no2').innerText()).toMatch(/Boyd/);
      expect(await seriousFindings(page), 'plan page').toEqual([]);

      // The printable plan: tank facts, fish, limits, chart, a table to write readings in.
      await page.getByTestId('plan-print-link').click();
      await page.getByTestId('print-day-rows').waitFor();
      await page.locator('[data-testid="print-chart"] svg path').first().waitFor({ timeout: 30_000 });
      expect(await page.getByTestId('print-tank').innerText()).toMatch(/Volume: 120 L/);
      const added = adds.reduce((n, e) => n + e.fish[0]!.count, 0);
      expect(await page.getByTestId('print-fish').innerText()).toContain(`${added} Harlequin rasbora`);
      expect(await page.getByTestId('print-limits').innerText()).toMatch(/Nitrite: 0\.1 mg\/L as N/);
      expect(await seriousFindings(page), 'print page').toEqual([]);
      await screenshot(page, `plan-print-${size}`);

      const lastCheck = plan.checkDays.at(-1)!.day;
      const pdf = await page.pdf({ format: 'A4' });
      const parsed = new PDFParse({ data: pdf });
      const text = (await parsed.getText()).text;
      const info = await parsed.getInfo();
      await parsed.destroy();
      expect(info.total).toBeGreaterThan(1);
      expect(text).toContain(`Day ${lastCheck}`);
      expect(text).toContain('If a reading is high');
      expect(text).toContain('Keep in mind');
      expect(text).not.toContain('Back to the plan');
      expect(text).not.toMatch(/^Print$/m);
    } finally {
      await context.close();
    }
  }, 120_000);
});
