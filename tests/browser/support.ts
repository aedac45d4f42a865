import { existsSync, mkdirSync } from 'node:fs';
import path from 'node:path';
import { AxeBuilder } from '@axe-core/playwright';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

/** The two sizes every page is checked at. */
export const VIEWPORTS = {
  phone: { width: 390, height: 844 },
  wide: { width: 1280, height: 800 },
} as const;
export type ViewportName = keyof typeof VIEWPORTS;

export const BASE_URL = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3101';
export const MAIL_URL = process.env.E2E_MAIL_URL ?? 'http://127.0.0.1:2536';
export const SCREENSHOT_DIR = path.resolve(__dirname, '../../test-results/screenshots');

// Debian's wrapper script prints a harmless shell warning; the binary behind it does not.
const EXECUTABLE = ['/usr/lib/chromium/chromium', '/usr/bin/chromium'].find((p) => existsSync(p));

// Without the background-networking flags Chromium keeps trying hosts this machine cannot reach.
const ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export async function launchBrowser(): Promise<Browser> {
  if (!EXECUTABLE) throw new Error('Chromium not found: the test command installs it (apt-get install chromium).');
  return chromium.launch({ executablePath: EXECUTABLE, args: ARGS, headless: true });
}

export async function newPage(
  browser: Browser,
  size: ViewportName,
  colorScheme: 'light' | 'dark' = 'light',
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: VIEWPORTS[size], colorScheme, baseURL: BASE_URL });
  const page = await context.newPage();
  return { context, page };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Signs in through the form; resolves once the home screen shows. */
export async function signIn(page: Page, person: { email: string; password: string }): Promise<void> {
  await page.goto('/sign-in');
  await page.getByTestId('sign-in-email').fill(person.email);
  await page.getByTestId('sign-in-password').fill(person.password);
  await page.getByTestId('sign-in-submit').click();
  await page.getByTestId('screen-home').waitFor();
}

/** The local e-mail fake's captured messages, newest first. */
export async function mailbox(): Promise<{ to: string; subject: string; text: string }[]> {
  const res = await fetch(`${MAIL_URL}/messages`);
  return ((await res.json()) as { messages: { to: string; subject: string; text: string }[] }).messages;
}

/** The newest link in an e-mail to `to` matching `pattern`, waiting up to 5 s for it to arrive. */
export async function mailedLink(to: string, pattern: RegExp): Promise<string> {
  for (let i = 0; i < 50; i++) {
    const link = (await mailbox()).filter((m) => m.to.includes(to)).map((m) => pattern.exec(m.text)?.[0]).find(Boolean);
    if (link) return link;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no e-mail to ${to} with a link matching ${pattern}`);
}

/**
 * Signs up through the form and finishes with the e-mailed link, as a newcomer does; resolves
 * once the new keeper's empty home shows.
 */
export async function signUp(page: Page, person: { displayName: string; email: string; password: string }): Promise<void> {
  await page.goto('/sign-up');
  await page.getByTestId('sign-up-name').fill(person.displayName);
  await page.getByTestId('sign-up-email').fill(person.email);
  await page.getByTestId('sign-up-password').fill(person.password);
  await page.getByTestId('sign-up-submit').click();
  await page.getByTestId('sign-up-sent').waitFor();
  const link = new URL(await mailedLink(person.email, /https?:\/\/\S+\/confirm-sign-up\?token=[\w-]+/));
  await page.goto(link.pathname + link.search);
  await page.getByTestId('confirm-sign-up-submit').click();
  await page.getByTestId('home-empty').waitFor();
}

/** Serious and critical axe findings (WCAG 2.x A/AA rules and best practices), as short lines. */
export async function seriousFindings(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page: page as never }).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(', ')}`);
}
