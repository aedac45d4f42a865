import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { DEMO_LESSONS } from '../../server/demo-lessons';
import { VIEWPORTS, launchBrowser, newPage, screenshot, signIn } from './support';

const mentor = DEMO_PEOPLE.find((p) => p.key === 'mentor')!;
// Written by the demo mentor; tests/browser/lesson.test.ts opens a different one ("big-purchase").
const lesson = DEMO_LESSONS.find((l) => l.key === 'filter-rinsed-in-tap-water')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Puts the demo lesson's words back through the API with the page's session (so reruns start clean). */
async function restoreWords(page: Page, id: string) {
  const status = await page.evaluate(
    async ({ id, body }) => (await fetch(`/api/lessons/${id}`, { method: 'PATCH', headers: { 'content-type': 'application/json', 'x-shoalshift-csrf': '1' }, body: JSON.stringify(body) })).status,
    { id, body: { title: lesson.title, summary: lesson.summary, steps: lesson.steps } },
  );
  expect(status).toBe(200);
}

describe('editing a saved lesson’s words', () => {
  it('the mentor who wrote it rewords a step, sees an empty title refused under the field, saves, reloads and sees the new words (no serious axe findings)', async () => {
    const { context, page } = await newPage(browser, 'phone');
    await signIn(page, mentor);
    await page.goto('/lessons');
    await page.getByTestId('screen-lessons').getByText(lesson.title).click();
    await page.getByTestId('lesson-title').waitFor();
    const id = new URL(page.url()).pathname.split('/').pop()!;

    try {
      await page.getByTestId('lesson-edit-open').click();
      expect(await page.getByTestId('lesson-edit-scenario-note').innerText()).toMatch(/tank and its timeline stay as they are/);
      expect(await page.getByTestId('lesson-edit-title').inputValue()).toBe(lesson.title);

      // An empty title: the message sits under the title field, and nothing is sent.
      await page.getByTestId('lesson-edit-title').fill('');
      await page.getByTestId('lesson-edit-save').click();
      const titleError = page.getByTestId('lesson-edit-title-error');
      expect(await titleError.innerText()).toContain('Use at least 3 characters.');
      const field = (await page.getByTestId('lesson-edit-title').boundingBox())!;
      const message = (await titleError.boundingBox())!;
      expect(message.y).toBeGreaterThanOrEqual(field.y + field.height - 1);
      expect(await page.getByTestId('lesson-edit-error').innerText()).toContain('Check Title');
      await screenshot(page, 'lesson-edit-error-banner-phone');
      await page.getByTestId('lesson-edit-scenario-note').scrollIntoViewIfNeeded();
      await screenshot(page, 'lesson-edit-error-phone');

      // Cancel puts the saved words back.
      await page.getByTestId('lesson-edit-cancel').click();
      await page.getByTestId('lesson-edit-open').click();
      expect(await page.getByTestId('lesson-edit-title').inputValue()).toBe(lesson.title);

      // Reword the second step's title and save.
      const newTitle = `Chlorine and a hard squeeze (${Date.now() % 100000})`;
      await page.getByTestId('lesson-step-1-title').fill(newTitle);
      await page.getByTestId('lesson-edit-save').click();
      await page.getByTestId('lesson-edit-saved').waitFor();
      expect(await page.getByTestId('lesson-step-1').innerText()).toContain(newTitle);

      await page.reload();
      await page.getByTestId('lesson-title').waitFor();
      expect(await page.getByTestId('lesson-step-1').innerText()).toContain(newTitle);
      expect(await page.getByTestId('lesson-title').innerText()).toBe(lesson.title);
      await screenshot(page, 'lesson-edit-saved-phone');

      // Wide: the editor open beside the same lesson.
      await page.setViewportSize(VIEWPORTS.wide);
      await page.getByTestId('lesson-edit-open').click();
      expect(await page.getByTestId('lesson-step-1-title').inputValue()).toBe(newTitle);
      await screenshot(page, 'lesson-edit-open-wide');
      const axe = await new AxeBuilder({ page: page as never }).include('[data-testid="lesson-edit-card"]').analyze();
      const serious = axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(', ')}`);
      expect(serious).toEqual([]);
      await page.getByTestId('lesson-edit-cancel').click();
    } finally {
      await restoreWords(page, id);
      await context.close();
    }
  }, 40_000);
});
