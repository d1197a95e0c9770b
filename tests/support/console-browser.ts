/**
 * The console's browser tests' one set-up: Debian's chromium (/usr/bin/chromium, never a downloaded one) driven by
 * playwright-core in a throw-away profile, against a service the test has already started (its base URL), with the
 * page's script errors collected, and the steps every console test takes (sign in, tab to a control, screenshot,
 * no sideways scroll). Screenshots go to test-output/console/ (not committed).
 */
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const CHROMIUM = '/usr/bin/chromium';
export const CONSOLE_SHOTS = fileURLToPath(new URL('../../test-output/console/', import.meta.url));

export interface ConsoleBrowserOptions {
  /** The service's base URL (`await app.listen(...)`). */
  base: string;
  /** Names the temporary browser profile ("console", "import"). */
  name: string;
  viewport: { width: number; height: number };
  /** Ceiling of each waited-for step; only catches hangs. */
  stepMs: number;
  acceptDownloads?: boolean;
  /** Also collect the page's console errors, except the 401/403/404 answers a test provokes on purpose. */
  consoleErrors?: boolean;
  /** Empty the screenshot folder first (the suite that writes most of them). */
  clearShots?: boolean;
}

export interface ConsoleBrowser {
  context: BrowserContext;
  page: Page;
  /** Script errors (and, with `consoleErrors`, console errors) the page reported so far. */
  pageErrors: string[];
  shot(name: string): Promise<void>;
  signIn(key: string): Promise<void>;
  /** Presses Tab until the focused element matches `selector` (keyboard-only navigation). */
  tabTo(selector: string, limit?: number): Promise<void>;
  /** The page must not scroll sideways (the narrow layout fits the window). */
  expectNoSidewaysScroll(): Promise<void>;
  close(): Promise<void>;
}

export async function openConsoleBrowser(options: ConsoleBrowserOptions): Promise<ConsoleBrowser> {
  if (!existsSync(CHROMIUM)) {
    throw new Error(`${CHROMIUM} is missing: install Debian's chromium (apt-get install -y chromium); the console tests never use a downloaded browser`);
  }
  if (options.clearShots) rmSync(CONSOLE_SHOTS, { recursive: true, force: true });
  mkdirSync(CONSOLE_SHOTS, { recursive: true });
  const profileDir = join(tmpdir(), `cpreg-${options.name}-profile-${process.pid}-${Date.now()}`);
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking'],
    viewport: options.viewport,
    ...(options.acceptDownloads ? { acceptDownloads: true } : {}),
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const pageErrors: string[] = [];
  page.on('pageerror', (error) => pageErrors.push(error.message));
  if (options.consoleErrors) {
    page.on('console', (message) => {
      if (message.type() === 'error' && !/status of 40[134] /.test(message.text())) pageErrors.push(message.text());
    });
  }
  return {
    context,
    page,
    pageErrors,
    async shot(name) {
      const size = page.viewportSize()!;
      await page.screenshot({ path: join(CONSOLE_SHOTS, `${name}-${size.width}x${size.height}.png`), fullPage: true });
    },
    async signIn(key) {
      await page.goto(`${options.base}/console/#/signin`);
      await page.fill('#api-key', key);
      await page.click('#sign-in');
      await page.waitForSelector('#search-box', { timeout: options.stepMs });
    },
    async tabTo(selector, limit = 40) {
      for (let i = 0; i < limit; i++) {
        await page.keyboard.press('Tab');
        if (await page.evaluate((sel) => document.activeElement?.matches(sel) ?? false, selector)) return;
      }
      throw new Error(`Tab never reached ${selector} in ${limit} presses`);
    },
    async expectNoSidewaysScroll() {
      const { scroll, client } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
      expect(scroll, `page is ${scroll}px wide in a ${client}px window`).toBeLessThanOrEqual(client + 1);
    },
    async close() {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}
