/**
 * Web benchmark (issue 5 part B): (1) gzip size of the JavaScript the exported web app loads
 * first (the <script> files index.html names), target ≤ 450 KB; (2) in Chromium at phone size,
 * the forecast chart's redraw time while a finger drags the plan's fish-count slider, from the
 * app's own performance measures (render start → commit of the chart; the browser engine run
 * is reported beside it), target ≤ 16 ms median.
 * Run: npm run bench:web — WEB_DIST (default dist/) for (1); BENCH_BASE_URL (a running server
 * over the seeded demo, e.g. http://127.0.0.1:3202) for (2).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { DEMO_PEOPLE } from '../server/demo-people';
import { launchBrowser, newPage } from '../tests/browser/support';

const JS_TARGET_KB = 450;
const REDRAW_TARGET_MS = 16;

function quantile(xs: number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  if (s.length === 0) return NaN;
  const i = (s.length - 1) * q;
  const lo = Math.floor(i);
  return s[lo] + (s[Math.ceil(i)] - s[lo]) * (i - lo);
}

function initialJs(dist: string): void {
  const html = readFileSync(path.join(dist, 'index.html'), 'utf8');
  const srcs = [...html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g)].map((m) => m[1]);
  let raw = 0;
  let gz = 0;
  for (const src of srcs) {
    const body = readFileSync(path.join(dist, src.replace(/^\//, '')));
    raw += body.length;
    gz += gzipSync(body, { level: 9 }).length;
  }
  const kb = gz / 1024;
  console.log(`initial JS (${srcs.length} file${srcs.length === 1 ? '' : 's'}): ${(raw / 1024).toFixed(0)} KB raw, ${kb.toFixed(0)} KB gzip (target ≤ ${JS_TARGET_KB} KB) ${kb <= JS_TARGET_KB ? 'ok' : 'OVER'}`);
}

async function redraw(baseUrl: string): Promise<void> {
  const member = DEMO_PEOPLE.find((p) => p.key === 'member')!;
  process.env.E2E_BASE_URL = baseUrl;
  const browser = await launchBrowser();
  try {
    const { page } = await newPage(browser, 'phone');
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByTestId('sign-in-email').fill(member.email);
    await page.getByTestId('sign-in-password').fill(member.password);
    await page.getByTestId('sign-in-submit').click();
    await page.getByTestId('tank-list').waitFor();
    await page.goto(`${baseUrl}/plans`);
    await page.getByTestId('plans-list').locator('[data-testid^="plans-item-"]').first().click();
    await page.locator('[data-testid="chart-panel-ammonia"] svg path').first().waitFor({ timeout: 30_000 });
    const slider = page.getByTestId('fish-count-slider');
    await slider.scrollIntoViewIfNeeded();
    const box = (await slider.boundingBox())!;
    const y = box.y + box.height / 2;
    await page.evaluate(() => performance.clearMeasures());
    // Two slow sweeps across the track, 60 moves each, one frame apart: a finger dragging.
    await page.mouse.move(box.x + 4, y);
    await page.mouse.down();
    for (const [from, to] of [
      [0.02, 0.6],
      [0.6, 0.1],
    ]) {
      for (let i = 0; i <= 60; i++) {
        await page.mouse.move(box.x + box.width * (from + ((to - from) * i) / 60), y);
        await page.waitForTimeout(16);
      }
    }
    await page.mouse.up();
    await page.waitForTimeout(300);
    const got = await page.evaluate(() => ({
      chart: performance.getEntriesByName('shoalshift:chart-redraw').map((e) => e.duration),
      compute: performance.getEntriesByName('shoalshift:forecast-compute').map((e) => e.duration),
    }));
    const med = quantile(got.chart, 0.5);
    console.log(
      `chart redraw while dragging (${got.chart.length} redraws): median ${med.toFixed(1)} ms, p95 ${quantile(got.chart, 0.95).toFixed(1)} ms (target ≤ ${REDRAW_TARGET_MS} ms median) ${med <= REDRAW_TARGET_MS ? 'ok' : 'OVER'}`,
    );
    console.log(`forecast engine run in the browser (${got.compute.length} runs): median ${quantile(got.compute, 0.5).toFixed(1)} ms, p95 ${quantile(got.compute, 0.95).toFixed(1)} ms`);
  } finally {
    await browser.close();
  }
}

async function main(): Promise<void> {
  initialJs(path.resolve(process.env.WEB_DIST ?? 'dist'));
  const base = process.env.BENCH_BASE_URL;
  if (base) await redraw(base);
  else console.log('chart redraw: skipped (set BENCH_BASE_URL to a running server with the demo seed)');
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : String(e));
  process.exit(1);
});
