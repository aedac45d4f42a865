import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error';
import { launchBrowser, newPage, screenshot, signIn, type ViewportName, VIEWPORTS } from './support';

// Issue 14, point 3: "how fast" starts on the planned day, and Apply keeps it.

const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** A plan on the member's community tank, made through the API as the signed-in page. */
async function planOnCommunityTank(page: Page, name: string, events: unknown[]): Promise<string> {
  return page.evaluate(
    async ({ name, events, header, value }) => {
      const { tanks } = (await (await fetch('/api/tanks')).json()) as { tanks: { id: string; name: string }[] };
      const tank = tanks.find((t) => t.name === 'Living-room community');
      if (!tank) throw new Error('no community tank');
      const res = await fetch(`/api/tanks/${tank.id}/plans`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', [header]: value },
        body: JSON.stringify({ name, startDate: new Date().toISOString().slice(0, 10), events }),
      });
      if (res.status !== 201) throw new Error(`plan not made: ${res.status} ${await res.text()}`);
      return ((await res.json()) as { id: string }).id;
    },
    { name, events, header: CSRF_HEADER, value: CSRF_HEADER_VALUE },
  );
}

/** The days of the plan's neon additions, read from the timeline's buttons. */
async function neonDays(page: Page): Promise<number[]> {
  const labels = await page.getByTestId('event-timeline').getByRole('button', { name: /^Day \d+: Add \d+ Neon tetra/ }).evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
  return labels.map((l) => Number(/^Day (\d+)/.exec(l)![1]));
}

async function askHowFast(page: Page, planId: string) {
  await page.goto(`/plans/${planId}`);
  await page.getByTestId('screen-plan').waitFor();
  await page.getByTestId('advice-tab-addition').click();
  await page.getByTestId('advice-addition-run').click();
  await page.getByTestId('advice-addition-result').waitFor({ timeout: 60_000 });
}

describe.each(Object.keys(VIEWPORTS) as ViewportName[])('"how fast" at %s size', (size) => {
  it('starts from the planned day 7, and Apply puts every batch on day 7 or later', async () => {
    const { context, page } = await newPage(browser, size);
    await signIn(page, member);
    const planId = await planOnCommunityTank(page, `Neons on day 7 (${size})`, [{ type: 'add-fish', day: 7, fish: { species: 'neon-tetra', count: 6, lengthCm: 3 } }]);
    await askHowFast(page, planId);
    expect(await page.getByTestId('advice-addition').innerText()).toMatch(/starts on day 7, the day you planned/);
    const summary = await page.getByTestId('advice-summary').innerText();
    await page.getByTestId('advice-addition-result').scrollIntoViewIfNeeded();
    await screenshot(page, `how-fast-day7-${size}`);
    const apply = page.getByTestId('advice-apply');
    if ((await apply.count()) === 0) {
      // Nothing safe: the answer says what stands in the way instead.
      expect(summary).toMatch(/No safe schedule/);
      await page.getByTestId('advice-blocker').waitFor();
    } else {
      expect(summary).toMatch(/6 neon tetra: .*day \d+ \(\w{3} \d+ \w{3} \d{4}\)/);
      await apply.click();
      await page.getByTestId('advice-applied').waitFor();
      const days = await neonDays(page);
      expect(days.length).toBeGreaterThan(0);
      expect(Math.min(...days)).toBeGreaterThanOrEqual(7);
    }
    await context.close();
  });

  it('for more fish than the tank takes, names what stands in the way and offers checked suggestions with fields to change the limits', async () => {
    const { context, page } = await newPage(browser, size);
    await signIn(page, member);
    const planId = await planOnCommunityTank(page, `40 platies (${size})`, [{ type: 'add-fish', day: 0, fish: { species: 'platy', count: 40 } }]);
    await askHowFast(page, planId);
    const summary = await page.getByTestId('advice-summary').innerText();
    if (/No safe schedule/.test(summary)) {
      await page.getByTestId('advice-blocker').waitFor();
      expect(await page.getByTestId('advice-blocker').innerText()).toMatch(/limit/);
      await page.getByTestId('advice-suggestions').waitFor();
    }
    // The limits are fields that re-run the search; a bad value is refused next to its field.
    await page.getByTestId('addition-max-batches').fill('50');
    await page.getByTestId('advice-addition-run').click();
    await page.getByText('At most 20 batches.').waitFor();
    await page.getByTestId('addition-max-batches').fill('8');
    await page.getByTestId('advice-addition').scrollIntoViewIfNeeded();
    await screenshot(page, `how-fast-40-platies-${size}`);
    await context.close();
  });
});
