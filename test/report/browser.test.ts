import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { vegaRuntime } from '../../src/cli/vega-runtime.js';
import { renderReportHtml } from '../../src/report/index.js';
import { fixtureModel, HOSTILE } from './fixture.js';

/**
 * The report opened in a real browser: Debian's chromium driven by playwright-core (never a
 * downloaded browser). Locally, without chromium, the test is skipped with a message; in CI
 * (CI=true) a missing chromium is a failure, since .ci/run installs it.
 */
const CHROMIUM = '/usr/bin/chromium';
const FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];
const haveChromium = existsSync(CHROMIUM);
const outDir = fileURLToPath(new URL('../../test-output/', import.meta.url));

if (!haveChromium) {
  if (process.env['CI']) throw new Error(`CI=true but ${CHROMIUM} is missing: .ci/run must install Debian's chromium`);
  console.warn(`browser tests skipped: ${CHROMIUM} not found (install Debian's chromium to run them)`);
}

describe.skipIf(!haveChromium)('report page in chromium', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await chromium.launch({ executablePath: CHROMIUM, args: FLAGS, headless: true });
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('opens from file with no console error, no network request, every plot drawn, hostile text shown as text', async () => {
    mkdirSync(outDir, { recursive: true });
    const file = `${outDir}report-fixture.html`;
    writeFileSync(file, await renderReportHtml(fixtureModel()));
    const page = await browser.newPage({ viewport: { width: 900, height: 1200 } });
    const consoleErrors: string[] = [];
    const requests: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') consoleErrors.push(m.text());
    });
    page.on('pageerror', (e) => consoleErrors.push(String(e)));
    page.on('request', (r) => {
      if (!r.url().startsWith('file:')) requests.push(r.url());
    });
    const url = pathToFileURL(file).href;
    await page.goto(url, { waitUntil: 'load' });

    expect(consoleErrors).toEqual([]);
    expect(requests).toEqual([]);
    // No script ran: the hostile strings would set window.__pwned.
    expect(await page.evaluate(() => (globalThis as { __pwned?: number }).__pwned)).toBeUndefined();
    expect(await page.locator('script, img').count()).toBe(0);
    expect(await page.locator('h1').innerText()).toContain('<script>window.__pwned = 1</script>');

    for (const id of ['main', 'parity', 'residuals-fitted', 'residuals-groups', 'normal-quantiles']) {
      const box = await page.locator(`#plot-${id} svg`).first().boundingBox();
      expect(box, id).not.toBeNull();
      expect(box!.width, id).toBeGreaterThan(100);
      expect(box!.height, id).toBeGreaterThan(100);
    }
    // Points carry their file:line as an SVG <title> tooltip.
    const titles = await page.locator('#plot-main svg title').allTextContents();
    expect(titles.length).toBe(120);
    expect(titles[0]).toBe(`${HOSTILE}.csv:8`);

    await page.screenshot({ path: `${outDir}report-fixture.png`, fullPage: true });
    await page.close();
  });

  it('--interactive: the inlined runtime draws live plots, still with no network request and no error', async () => {
    mkdirSync(outDir, { recursive: true });
    const file = `${outDir}report-interactive.html`;
    const runtime = await vegaRuntime();
    writeFileSync(file, await renderReportHtml(fixtureModel(), { interactiveRuntime: runtime }));
    const page = await browser.newPage({ viewport: { width: 900, height: 1200 } });
    const problems: string[] = [];
    const requests: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') problems.push(m.text());
    });
    page.on('pageerror', (e) => problems.push(String(e)));
    page.on('request', (r) => {
      if (!r.url().startsWith('file:')) requests.push(r.url());
    });
    await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
    // vega's live SVG renderer marks its root <svg> with class "marks"; wait until every plot has one.
    await page.waitForFunction("document.querySelectorAll('.plot > svg.marks').length >= 5", undefined, { timeout: 10_000 });
    expect(problems).toEqual([]);
    expect(requests).toEqual([]);
    expect(await page.locator('.plot[data-error]').count()).toBe(0);
    expect(await page.evaluate(() => (globalThis as { __pwned?: number }).__pwned)).toBeUndefined();
    await page.close();
  });
});
