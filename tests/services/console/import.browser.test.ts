/**
 * The console's import page in a real browser: Debian's chromium (/usr/bin/chromium, never a downloaded one) driven
 * by playwright-core against the service started in this process over an empty embedded database. Files made by
 * independent writers (tests/services/contract-files/documents.ts: pdf-lib, the `docx` package) are chosen with
 * the keyboard, imported as a job, and the page shows the contracts with their parties linked to counterparties and
 * the files not imported with their reasons, at 1280×800 and 390×844. Screenshots go to test-output/console/.
 */
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../services/api/app.ts';
import { createApiKey } from '../../../services/api/auth/keys.ts';
import { openTestDatabase, type TestDatabase } from '../../support/index.ts';
import { docxFile, imageOnlyPdf, inventedContract, pdfLibPdf } from '../contract-files/documents.ts';

const CHROMIUM = '/usr/bin/chromium';
const SHOTS = fileURLToPath(new URL('../../../test-output/console/', import.meta.url));
const STEP_MS = 30_000;

let database: TestDatabase;
let app: FastifyInstance;
let base: string;
let writeKey: string;
let readKey: string;
let profileDir: string;
let context: BrowserContext;
let page: Page;
const pageErrors: string[] = [];

async function shot(name: string): Promise<void> {
  const size = page.viewportSize()!;
  await page.screenshot({ path: join(SHOTS, `${name}-${size.width}x${size.height}.png`), fullPage: true });
}

async function signIn(key: string): Promise<void> {
  await page.goto(`${base}/console/#/signin`);
  await page.fill('#api-key', key);
  await page.click('#sign-in');
  await page.waitForSelector('#search-box', { timeout: STEP_MS });
}

async function tabTo(selector: string, limit = 40): Promise<void> {
  for (let i = 0; i < limit; i++) {
    await page.keyboard.press('Tab');
    if (await page.evaluate((sel) => document.activeElement?.matches(sel) ?? false, selector)) return;
  }
  throw new Error(`Tab never reached ${selector} in ${limit} presses`);
}

async function expectNoSidewaysScroll(): Promise<void> {
  const { scroll, client } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
  expect(scroll, `page is ${scroll}px wide in a ${client}px window`).toBeLessThanOrEqual(client + 1);
}

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: install Debian's chromium (apt-get install -y chromium)`);
  mkdirSync(SHOTS, { recursive: true });
  database = await openTestDatabase('pglite');
  app = await buildApp({ db: database.db, backend: 'pglite', rateLimitPerMinute: false });
  writeKey = (await createApiKey(database.db, { scope: 'write', label: 'legal operations (import test)' })).secret;
  readKey = (await createApiKey(database.db, { scope: 'read', label: 'finance viewer (import test)' })).secret;
  base = await app.listen({ port: 0, host: '127.0.0.1' });
  profileDir = join(tmpdir(), `cpreg-import-profile-${process.pid}-${Date.now()}`);
  context = await chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking'],
    viewport: { width: 1280, height: 800 },
  });
  page = context.pages()[0] ?? (await context.newPage());
  page.on('pageerror', (error) => pageErrors.push(error.message));
}, 120_000);

afterAll(async () => {
  await context?.close();
  await app?.close();
  await database?.close();
  if (profileDir) rmSync(profileDir, { recursive: true, force: true });
});

describe('import page in chromium', () => {
  it('imports chosen files with the keyboard and links each party to its counterparty; rejected files show their reasons', async () => {
    await signIn(writeKey);
    await page.goto(`${base}/console/#/import`);
    await page.waitForSelector('main h1', { timeout: STEP_MS });
    expect(await page.title()).toBe('Import contract files · cpreg console');
    expect(await page.textContent('#import-caution')).toContain('Extraction and party parsing are proposals; the signed document stands.');
    await page.setInputFiles('#import-files', [
      { name: 'supply.pdf', mimeType: 'application/pdf', buffer: await pdfLibPdf(inventedContract()) }, // pdf-lib
      {
        name: 'service.docx',
        mimeType: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document',
        buffer: await docxFile(inventedContract('Brindlecombe Tools Ltd')),
      }, // docx
      { name: 'scan.pdf', mimeType: 'application/pdf', buffer: await imageOnlyPdf() }, // pdf-lib
    ]);
    expect(await page.textContent('#import-picked')).toContain('3 files chosen');
    // Keyboard only from here: Tab to the button, Enter.
    await page.focus('#import-files');
    await tabTo('#import-start');
    await page.keyboard.press('Enter');
    await page.waitForSelector('#import-summary', { timeout: 60_000 });
    expect(await page.textContent('#import-summary')).toContain('3 files read: 2 imported (2 new, 0 new versions), 0 unchanged, 1 not imported.');
    const rows = await page.$$eval('#import-contracts tbody tr', (trs) => trs.map((tr) => tr.textContent ?? ''));
    expect(rows).toHaveLength(2);
    expect(rows.join('\n')).toContain('Quillmoor Fabrication Ltd (Supplier) → Quillmoor Fabrication Ltd');
    const links = await page.$$eval('#import-contracts a[href^="#/counterparty/"]', (as) => as.map((a) => a.getAttribute('href')));
    expect(links.length).toBe(4);
    const rejected = await page.$$eval('#import-rejects tbody tr', (trs) => trs.map((tr) => [tr.getAttribute('data-reason'), tr.textContent ?? '']));
    expect(rejected).toEqual([['no_text_layer', expect.stringContaining('no OCR is attempted')]]);
    await expectNoSidewaysScroll();
    await shot('import-done');
    // Follow a party's link to its counterparty with the keyboard.
    await page.focus('#import-contracts a[href^="#/counterparty/"]');
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => location.hash.startsWith('#/counterparty/'), null, { timeout: STEP_MS });
    await page.waitForSelector('main h1', { timeout: STEP_MS });
    expect(pageErrors).toEqual([]);
  });

  it('fits a 390×844 window and tells a read-only key it may not import', async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    await signIn(readKey);
    await page.goto(`${base}/console/#/import`);
    await page.waitForSelector('main h1', { timeout: STEP_MS });
    expect(await page.isDisabled('#import-start')).toBe(true);
    expect(await page.textContent('main')).toContain('may read but not post contracts');
    await expectNoSidewaysScroll();
    await shot('import-read-only');
    await signIn(writeKey);
    await page.goto(`${base}/console/#/import`);
    await page.waitForSelector('#import-files', { timeout: STEP_MS });
    await page.setInputFiles('#import-files', [{ name: 'supply.txt', mimeType: 'text/plain', buffer: Buffer.from(inventedContract()) }]);
    await page.click('#import-start');
    await page.waitForSelector('#import-summary', { timeout: 60_000 });
    await expectNoSidewaysScroll();
    await shot('import-done');
    expect(pageErrors).toEqual([]);
  });
});
