import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error';
import { launchBrowser, newPage, screenshot, signUp, type ViewportName } from './support';

/**
 * The species picker in a plan event (issue 15): two species in one "Add fish" event picked by
 * their common names, a keeper's own fish needing its size (the message beside the field), and
 * the crowding warning where fish are added (event form and livestock).
 */

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function api(context: BrowserContext, url: string, data: object): Promise<{ id: string }> {
  const res = await context.request.post(url, { data, headers: { [CSRF_HEADER]: CSRF_HEADER_VALUE } });
  expect(res.status(), `${url}: ${await res.text()}`).toBe(201);
  return (await res.json()) as { id: string };
}

/** Serious and critical axe findings, as short lines. */
async function seriousFindings(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page: page as never }).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(', ')}`);
}

async function pick(page: Page, row: number, words: string, id: string) {
  await page.getByTestId(`event-fish-${row}-species-search`).fill(words);
  await page.getByTestId(`event-fish-${row}-species-option-${id}`).click();
  await page.getByTestId(`event-fish-${row}-species-chosen`).waitFor();
}

describe('plan events with the species picker', () => {
  for (const size of ['phone', 'wide'] as ViewportName[]) {
    it(`${size}: adds one event with two species picked by name, asks a custom fish's size beside its field, warns on crowding`, async () => {
      const { context, page } = await newPage(browser, size);
      try {
        await signUp(page, { displayName: 'Picker Keeper', email: `picker-${size}-${Date.now()}@example.org`, password: 'lagoon-pepper-willow-73' });
        const tank = await api(context, '/api/tanks', { name: 'Community 120', volumeL: 120 });
        const plan = await api(context, `/api/tanks/${tank.id}/plans`, { name: 'New shoal', startDate: '2026-05-01', events: [] });
        await page.goto(`/plans/${plan.id}`);
        await page.getByTestId('event-form').waitFor();

        // Two species in one event, by their common names: never a catalogue id on screen.
        await page.getByTestId('event-field-day').fill('3');
        await pick(page, 0, 'Neon', 'neon-tetra');
        expect(await page.getByTestId('event-fish-0-species-chosen').innerText()).toBe('✓ Neon tetra');
        await page.getByTestId('event-field-fish.0.count').fill('10');
        await page.getByTestId('event-add-group').click();
        await page.getByTestId('event-fish-1-species-search').fill('cory');
        await page.getByTestId('event-fish-1-species-option-bronze-corydoras').waitFor();
        await page.getByTestId('event-fish-1').evaluate((el) => el.scrollIntoView({ block: 'start' }));
        await screenshot(page, `plan-event-species-search-${size}`);
        expect(await page.getByTestId('event-fish-1').innerText()).toMatch(/Bronze corydoras[\s\S]*Panda corydoras/);
        await pick(page, 1, 'corydoras', 'bronze-corydoras');
        await page.getByTestId('event-field-fish.1.count').fill('6');
        await page.getByTestId('event-form').evaluate((el) => el.scrollIntoView({ block: 'start' }));
        await screenshot(page, `plan-event-two-species-${size}`);
        expect(await page.getByTestId('event-form').innerText()).not.toMatch(/neon-tetra|bronze-corydoras/);
        expect(await seriousFindings(page), 'plan page with the event form filled').toEqual([]);
        await page.getByTestId('event-submit').click();
        await page.getByTestId('event-timeline').getByText('Add 10 Neon tetra and 6 Bronze corydoras').waitFor();

        // The keeper's own fish without a size: the message sits beside its length field.
        await page.getByTestId('event-fish-0-species-search').fill('Big red');
        await page.getByTestId('event-fish-0-species-custom').click();
        await page.getByTestId('event-field-fish.0.count').fill('1');
        await page.getByTestId('event-submit').click();
        const lengthField = page.getByTestId('event-field-fish.0.lengthCm');
        await expect.poll(() => lengthField.getAttribute('aria-invalid')).toBe('true');
        expect(await page.getByTestId('event-fish-0').innerText()).toContain('A fish that is not in the species list needs its length (or its weight).');
        expect(await page.getByTestId('screen-plan').innerText()).not.toMatch(/events\.\d|fish\.\d|lengthCm/);
        await page.getByTestId('event-fish-0').evaluate((el) => el.scrollIntoView({ block: 'start' }));
        await screenshot(page, `plan-event-custom-fish-error-${size}`);
        await lengthField.fill('9');
        await page.getByTestId('event-submit').click();
        await page.getByTestId('event-timeline').getByText('Add 1 Big red').waitFor();

        // 10,000 neon tetras in 120 L: a plain warning while typing, not a refusal.
        await pick(page, 0, 'neon', 'neon-tetra');
        await page.getByTestId('event-field-fish.0.count').fill('10000');
        const warning = page.getByTestId('event-stocking-warning');
        await warning.waitFor();
        expect(await warning.innerText()).toMatch(/These fish would weigh about 2\.\d kg in 120 L/);
        await warning.evaluate((el) => el.scrollIntoView({ block: 'center' }));
        await screenshot(page, `plan-event-crowding-warning-${size}`);
        await page.getByTestId('event-field-fish.0.count').fill('8');
        await expect.poll(() => warning.count()).toBe(0);

        // Saved with both events; the stored event keeps its two groups.
        await page.getByTestId('plan-save-button').click();
        await page.getByTestId('plan-saved').waitFor({ timeout: 30_000 });
        const saved = (await (await context.request.get(`/api/plans/${plan.id}`)).json()) as { events: { fish: { species?: string; count: number }[] }[] };
        expect(saved.events[0]!.fish).toEqual([
          { species: 'neon-tetra', count: 10 },
          { species: 'bronze-corydoras', count: 6 },
        ]);

        // The livestock form warns the same way.
        await page.goto(`/tanks/${tank.id}`);
        await page.getByTestId('livestock-species-search').fill('neon');
        await page.getByTestId('livestock-species-option-neon-tetra').click();
        await page.getByTestId('livestock-count').fill('10000');
        await page.getByTestId('livestock-stocking-warning').waitFor();
        await page.getByTestId('livestock-add').evaluate((el) => el.scrollIntoView({ block: 'start' }));
        await screenshot(page, `livestock-crowding-warning-${size}`);
        expect(await seriousFindings(page), 'tank page with the crowding warning').toEqual([]);
      } finally {
        await context.close();
      }
    });
  }
});
