import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PEOPLE } from '../../server/demo-people';
import { GUESS_STEP } from '../../components/lessons/lesson-builder-model';
import { launchBrowser, newPage, screenshot, signIn, type ViewportName } from './support';

const mentor = DEMO_PEOPLE.find((p) => p.key === 'mentor')!;
const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});


/** The builder's fields for a short single lesson: a bigger tank, thirty barbs on day 1, a first step. */
async function fillLesson(page: Page, title: string) {
  await page.getByTestId('lesson-new-title').fill(title);
  await page.getByTestId('lesson-new-summary').fill('A settled 150 L tank with eight neon tetras gets thirty cherry barbs in one go.');
  await page.getByTestId('lesson-tank-volume').fill('150');
  await page.getByTestId('event-field-day').fill('1');
  await page.getByTestId('event-fish-0-species-search').fill('cherry');
  await page.getByTestId('event-fish-0-species-option-cherry-barb').click();
  await page.getByTestId('event-field-fish.0.count').fill('30');
  await page.getByTestId('event-submit').click();
  await page.getByTestId('event-0').waitFor();
  await page.getByTestId('lesson-step-0-title').fill('The purchase');
  await page.getByTestId('lesson-step-0-body').fill('Thirty cherry barbs arrive at once. The nitrifiers need days to catch up with the new waste.');
}

/** Screenshots of the long form, one per part, scrolled into view. */
async function shots(page: Page, size: ViewportName, parts: readonly string[]) {
  for (const part of parts) {
    await page.getByTestId(part).evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await screenshot(page, `lesson-builder-${part.replace('lesson-new-', '')}-${size}`);
  }
}

describe('building a lesson from scratch', () => {
  it('the mentor builds a single lesson on a phone, sees a field error, saves and lands on the lesson', async () => {
    const { context, page } = await newPage(browser, 'phone');
    await signIn(page, mentor);
    await page.goto('/lessons');
    await page.getByTestId('lessons-new').click();
    await page.getByTestId('screen-lesson-new').waitFor();

    // Saving an empty form: the title's message sits right under the title field.
    await page.getByTestId('lesson-new-submit').click();
    const titleError = page.getByTestId('lesson-new-title-error');
    await titleError.waitFor();
    expect(await titleError.innerText()).toBe('Error: Use at least 3 characters.');
    const input = (await page.getByTestId('lesson-new-title').boundingBox())!;
    const message = (await titleError.boundingBox())!;
    expect(message.y).toBeGreaterThanOrEqual(input.y + input.height - 1);
    expect(message.y - (input.y + input.height)).toBeLessThan(24);
    expect(await page.getByTestId('lesson-events-error').innerText()).toContain('Add at least one event');
    // Beside the save button, far below on a phone: where to look.
    expect(await page.getByTestId('lesson-new-error').innerText()).toContain('Check Title, What happens when, Step 1');
    await screenshot(page, 'lesson-builder-save-error-phone');
    await page.getByTestId('lesson-new-title').scrollIntoViewIfNeeded();
    await screenshot(page, 'lesson-builder-errors-phone');

    const title = `Thirty barbs in one go ${Date.now().toString(36)}`;
    await fillLesson(page, title);
    // Typing clears that field's message.
    expect(await titleError.count()).toBe(0);
    const summary = page.getByTestId('lesson-preview-fast-summary');
    await expect.poll(() => summary.innerText()).toMatch(/^Nitrite peaks at [\d.]+ mg N\/L on day \d+/);
    await shots(page, 'phone', ['lesson-new-about', 'lesson-new-tank-card', 'lesson-tank-fish', 'lesson-new-timeline-card', 'lesson-new-preview-card', 'lesson-new-steps-card']);

    await page.getByTestId('lesson-new-submit').click();
    await page.waitForURL(/\/lessons\/[0-9a-f-]{36}$/);
    expect(await page.getByTestId('lesson-title').innerText()).toBe(title);
    expect(await page.getByTestId('lesson-step-0').innerText()).toContain('1. The purchase');
    expect(await page.getByTestId('lesson-step-1').innerText()).toContain(`2. ${GUESS_STEP.title}`);
    await page.getByTestId('lesson-guess').waitFor();
    await page.getByTestId('lesson-reveal').waitFor();
    await screenshot(page, 'lesson-builder-saved-phone');
    await context.close();
  }, 60_000);

  it('on a wide screen the form sits beside the live preview, with no serious axe findings or page errors', async () => {
    const { context, page } = await newPage(browser, 'wide');
    await signIn(page, mentor);
    // From here on (the sign-in page's own "who is signed in?" check answers 401 by design).
    const problems: string[] = [];
    page.on('pageerror', (e) => problems.push(e.message));
    page.on('console', (m) => {
      if (m.type() === 'error') problems.push(m.text());
    });
    // From the club page: its "New lesson" link opens the builder for that club.
    await page.goto('/clubs');
    await page.getByTestId('club-link').first().click();
    await page.getByTestId('club-new-lesson').click();
    await page.getByTestId('lesson-new-wide').waitFor();
    expect(page.url()).toMatch(/\/lessons\/new\?club=[0-9a-f-]{36}$/);
    await page.getByTestId('lesson-new-kind-compare').click();
    await fillLesson(page, 'Thirty barbs: at once or in stages');
    await page.getByTestId('lesson-split-submit').click();
    await page.getByTestId('lesson-preview-staged-summary').waitFor();
    await page.getByTestId('lesson-preview-which-staged').click();
    await page.getByTestId('lesson-preview-chart-staged').waitFor();
    const form = (await page.getByTestId('lesson-new-about').boundingBox())!;
    const preview = (await page.getByTestId('lesson-new-preview-card').boundingBox())!;
    expect(preview.x).toBeGreaterThan(form.x + form.width - 1);
    await page.getByTestId('lesson-new-about').evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await screenshot(page, 'lesson-builder-wide');
    // Scrolled down to the staged timeline, the preview stays beside it.
    await shots(page, 'wide', ['lesson-new-timeline-card']);
    expect((await page.getByTestId('lesson-new-preview-card').boundingBox())!.y).toBeLessThan(100);
    const axe = await new AxeBuilder({ page: page as never }).include('[data-testid="screen-lesson-new"]').analyze();
    const serious = axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(', ')}`);
    expect(serious).toEqual([]);
    expect(problems).toEqual([]);
    await context.close();
  }, 60_000);

  it('a plain club member sees no way to build a lesson', async () => {
    const { context, page } = await newPage(browser, 'phone');
    await signIn(page, member);
    await page.goto('/lessons');
    await page.getByTestId('lesson-link').first().waitFor();
    expect(await page.getByTestId('lessons-new').count()).toBe(0);
    await page.goto('/clubs');
    await page.getByTestId('club-link').first().click();
    await page.getByTestId('club-name').waitFor();
    expect(await page.getByTestId('club-new-lesson').count()).toBe(0);
    await page.goto('/lessons/new');
    await page.getByTestId('lesson-new-not-allowed').waitFor();
    await context.close();
  }, 30_000);
});
