#!/usr/bin/env node
/**
 * Takes the screenshot of the demo report shown in README.md: opens a report page in Debian's
 * chromium through playwright-core (never a downloaded browser), refuses every network request,
 * and saves a PNG.
 *
 * Usage: node scripts/screenshot.mjs [page.html] [out.png] [--height PX]
 *   default: reports/demo/pressure-drop/index.html -> docs/demo-index.png, 1240 x 1850 px (run `npm run demo` first)
 */
import { existsSync, mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';

const CHROMIUM = '/usr/bin/chromium';
const FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

const args = process.argv.slice(2);
const heightAt = args.indexOf('--height');
const height = heightAt >= 0 ? Number(args.splice(heightAt, 2)[1]) : 1850;
const page = resolve(args[0] ?? 'reports/demo/pressure-drop/index.html');
const out = resolve(args[1] ?? 'docs/demo-index.png');

if (!existsSync(CHROMIUM)) {
  process.stderr.write(`screenshot: ${CHROMIUM} not found; install Debian's chromium (apt-get install chromium)\n`);
  process.exit(2);
}
if (!existsSync(page)) {
  process.stderr.write(`screenshot: ${page} not found; run npm run demo first\n`);
  process.exit(2);
}
const browser = await chromium.launch({ executablePath: CHROMIUM, args: FLAGS, headless: true });
try {
  const context = await browser.newContext({ viewport: { width: 1240, height }, deviceScaleFactor: 1 });
  const blocked = [];
  await context.route('**/*', (route) => {
    const url = route.request().url();
    if (url.startsWith('file:')) return route.continue();
    blocked.push(url);
    return route.abort();
  });
  const tab = await context.newPage();
  const errors = [];
  tab.on('pageerror', (e) => errors.push(String(e)));
  tab.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  await tab.goto(pathToFileURL(page).href, { waitUntil: 'load' });
  mkdirSync(dirname(out), { recursive: true });
  await tab.screenshot({ path: out, fullPage: false });
  if (errors.length > 0 || blocked.length > 0) {
    process.stderr.write(`screenshot: the page had errors or network requests:\n${[...errors, ...blocked].join('\n')}\n`);
    process.exit(1);
  }
  process.stdout.write(`wrote ${out}\n`);
} finally {
  await browser.close();
}
