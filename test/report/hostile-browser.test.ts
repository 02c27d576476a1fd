import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tmpFolder } from '../cli/tmp-folder.js';

/**
 * Hostile text from every input a user controls, through `similis fit --out` and `similis batch
 * --out` (in-process), then every page opened in Debian's chromium: no script runs (a page-level
 * trap and a dialog listener), no request leaves the page (every request other than the page
 * itself and data: URLs is recorded and refused), and the hostile text is shown as text.
 * Skipped without chromium, as test/report/browser.test.ts.
 */
const CHROMIUM = '/usr/bin/chromium';
const FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];
const haveChromium = existsSync(CHROMIUM);

/** Each piece would set window.__pwned if it ran; the bidi override would reorder what follows it. */
const HOSTILE = `<script>window.__pwned=1</script> "onload="window.__pwned=2" '</style><img src=x onerror="window.__pwned=3"> <a href="javascript:window.__pwned=4">go</a> \u202Eevil`;
/** A file name (no '/'): markup and a bidi override. */
const HOSTILE_FILE = `<img src=x onerror=window.__pwned=5> "q'\u202Etube.csv`;

const demo = (name: string) => readFileSync(fileURLToPath(new URL(`../../data-demo/pressure-drop/${name}`, import.meta.url)), 'utf8');

/** A demo tube file (invented data) with a hostile # comment and hostile run labels. */
function hostileRig(name: string): string {
  return demo(name)
    .split('\n')
    .map((l) => (l.startsWith('# rig:') ? `${l}\n# note: ${HOSTILE}` : /^[A-Z]\d\d,/.test(l) ? `"${HOSTILE.replace(/"/g, '""')} ${l.slice(0, 3)}"${l.slice(3)}` : l))
    .join('\n');
}

const STUDY = demo('study.yaml')
  .replace(/^title: .*$/m, `title: ${JSON.stringify(`${HOSTILE} (invented data)`)}`)
  .replace("data: ['*.csv']", "data: ['runs/*.csv']")
  // study text shown in the report: a hostile comment in the formulas section
  .replace('# Reynolds number', `# ${HOSTILE.replace(/#/g, '')}`);

const folder = tmpFolder({
  'study.yaml': STUDY,
  [`runs/${HOSTILE_FILE}`]: hostileRig('tube-a.csv'),
  'runs/tube-b.csv': hostileRig('tube-b.csv'),
  'runs/tube-c.csv': hostileRig('tube-c.csv'),
});
afterAll(() => folder.remove());

describe.skipIf(!haveChromium)('hostile text in reports, in chromium', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await chromium.launch({ executablePath: CHROMIUM, args: FLAGS, headless: true });
  });
  afterAll(async () => {
    await browser?.close();
  });

  async function openSafely(file: string): Promise<{ text: string; problems: string[] }> {
    const page = await browser.newPage();
    const problems: string[] = [];
    const url = pathToFileURL(file).href;
    page.on('dialog', (d) => {
      problems.push(`dialog: ${d.message()}`);
      void d.dismiss();
    });
    page.on('pageerror', (e) => problems.push(`page error: ${String(e)}`));
    await page.route('**/*', async (route) => {
      const u = route.request().url();
      if (u === url || u.startsWith('data:')) return route.continue();
      problems.push(`request: ${u}`);
      return route.abort();
    });
    // A trap set before any script of the page: a script that ran would leave a mark.
    await page.addInitScript(() => {
      const w = globalThis as unknown as Record<string, unknown>;
      for (const k of ['alert', 'confirm', 'prompt']) w[k] = () => void (w['__pwned'] = `${k} called`);
    });
    await page.goto(url, { waitUntil: 'load' });
    // Clicking the links of the page must not run code either (javascript: URLs).
    for (const a of await page.locator('a[href^="javascript:" i]').all()) problems.push(`javascript: link ${await a.getAttribute('href')}`);
    const pwned = await page.evaluate(() => (globalThis as { __pwned?: unknown }).__pwned);
    if (pwned !== undefined) problems.push(`script ran: __pwned = ${String(pwned)}`);
    const injected = await page.locator('img[src="x"], img[onerror], [onload], script:not([type="application/json"])').count();
    if (injected > 0) problems.push(`${injected} injected elements`);
    const text = await page.locator('body').innerText();
    await page.close();
    return { text, problems };
  }

  it('fit --out: NAME.html runs nothing, requests nothing, shows the hostile title and file name as text', async () => {
    const r = await folder.run('fit', '--study', 'study.yaml', '--out', 'rep/one');
    expect(r.code, r.err).toBe(0);
    const { text, problems } = await openSafely(folder.path('rep/one.html'));
    expect(problems).toEqual([]);
    expect(text).toContain('<script>window.__pwned=1</script>');
    expect(text).toContain('<img src=x onerror="window.__pwned=3">');
    expect(text).toContain(HOSTILE_FILE.slice(0, 20));
  });

  it('batch --out: index.html, pooled.html and every files/*.html run nothing, request nothing, show the text', async () => {
    const r = await folder.run('batch', 'runs', '--study', 'study.yaml', '--out', 'camp', '--quiet');
    expect(r.code, r.err).toBe(0);
    const pages = ['camp/index.html', 'camp/pooled.html', ...readdirSync(folder.path('camp/files')).filter((f) => f.endsWith('.html')).map((f) => `camp/files/${f}`)];
    expect(pages.length).toBe(5);
    for (const p of pages) {
      const { text, problems } = await openSafely(folder.path(p));
      expect(problems, p).toEqual([]);
      expect(text, p).toContain('<script>window.__pwned=1</script>');
      if (p === 'camp/index.html') expect(text, p).toContain(HOSTILE_FILE.slice(0, 20));
    }
  });
});
