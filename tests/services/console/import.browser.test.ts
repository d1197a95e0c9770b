/**
 * The console's import page in a real browser: Debian's chromium (/usr/bin/chromium, never a downloaded one) driven
 * by playwright-core against the service started in this process over an empty embedded database. Files made by
 * independent writers (tests/services/contract-files/support.ts: pdf-lib, the `docx` package) are chosen with
 * the keyboard, imported as a job, and the page shows the contracts with their parties linked to counterparties and
 * the files not imported with their reasons, at 1280×800 and 390×844. Screenshots go to test-output/console/.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../services/api/app.ts';
import { createApiKey } from '../../../services/api/auth/keys.ts';
import { openTestDatabase, type TestDatabase } from '../../support/index.ts';
import { openConsoleBrowser, type ConsoleBrowser } from '../../support/console-browser.ts';
import { docxFile, imageOnlyPdf, inventedContract, pdfLibPdf } from '../contract-files/support.ts';

const STEP_MS = 30_000;

let database: TestDatabase;
let app: FastifyInstance;
let base: string;
let writeKey: string;
let readKey: string;
let browser: ConsoleBrowser;
let page: Page;
let pageErrors: string[];

beforeAll(async () => {
  database = await openTestDatabase('pglite');
  app = await buildApp({ db: database.db, backend: 'pglite', rateLimitPerMinute: false });
  writeKey = (await createApiKey(database.db, { scope: 'write', label: 'legal operations (import test)' })).secret;
  readKey = (await createApiKey(database.db, { scope: 'read', label: 'finance viewer (import test)' })).secret;
  base = await app.listen({ port: 0, host: '127.0.0.1' });
  browser = await openConsoleBrowser({ base, name: 'import', viewport: { width: 1280, height: 800 }, stepMs: STEP_MS });
  page = browser.page;
  pageErrors = browser.pageErrors;
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await app?.close();
  await database?.close();
});

describe('import page in chromium', () => {
  it('imports chosen files with the keyboard and links each party to its counterparty; rejected files show their reasons', async () => {
    await browser.signIn(writeKey);
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
    await browser.tabTo('#import-start');
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
    await browser.expectNoSidewaysScroll();
    await browser.shot('import-done');
    // Follow a party's link to its counterparty with the keyboard.
    await page.focus('#import-contracts a[href^="#/counterparty/"]');
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => location.hash.startsWith('#/counterparty/'), null, { timeout: STEP_MS });
    await page.waitForSelector('main h1', { timeout: STEP_MS });
    expect(pageErrors).toEqual([]);
  });

  it('fits a 390×844 window and tells a read-only key it may not import', async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    await browser.signIn(readKey);
    await page.goto(`${base}/console/#/import`);
    await page.waitForSelector('main h1', { timeout: STEP_MS });
    expect(await page.isDisabled('#import-start')).toBe(true);
    expect(await page.textContent('main')).toContain('may read but not post contracts');
    await browser.expectNoSidewaysScroll();
    await browser.shot('import-read-only');
    await browser.signIn(writeKey);
    await page.goto(`${base}/console/#/import`);
    await page.waitForSelector('#import-files', { timeout: STEP_MS });
    await page.setInputFiles('#import-files', [{ name: 'supply.txt', mimeType: 'text/plain', buffer: Buffer.from(inventedContract()) }]);
    await page.click('#import-start');
    await page.waitForSelector('#import-summary', { timeout: 60_000 });
    await browser.expectNoSidewaysScroll();
    await browser.shot('import-done');
    expect(pageErrors).toEqual([]);
  });
});
