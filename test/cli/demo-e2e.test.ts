import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

/**
 * The demo campaigns end to end, as a user runs them: the built binary (dist/, built by the global
 * setup) with its worker threads, `similis demo` in a fresh folder, then the campaign of the copper
 * tubes alone. The truth is the generator's own statement (data-demo/*\/truth.json, written by
 * data-demo/generate-demo.mjs): invented data, Blasius (1913) and Schiller & Naumann (1933) laws.
 * The index pages are opened in Debian's chromium (pattern of test/report/browser.test.ts).
 */

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const BIN = join(ROOT, 'dist/cli/main.js');
const CHROMIUM = '/usr/bin/chromium';
const FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

const truth = (scenario: string) => JSON.parse(readFileSync(join(ROOT, 'data-demo', scenario, 'truth.json'), 'utf8'));
const loopTruth = truth('pressure-drop');
const settleTruth = truth('settling');

interface Param {
  name: string;
  estimate: number;
  low: number;
  high: number;
}
interface IndexFile {
  label: string;
  failure: unknown;
  parameters: Param[];
  agreement: { disagrees: boolean } | null;
  exclusions: { cause: string; reason: string; lines: number[] }[];
}
interface Index {
  files: IndexFile[];
  pooled: { parameters: Param[] };
}

const cwd = mkdtempSync(join(tmpdir(), 'similis-demo-'));
let demo: { status: number | null; stdout: string; stderr: string; seconds: number };
const index = (campaign: string): Index => JSON.parse(readFileSync(join(cwd, 'reports/demo', campaign, 'index.json'), 'utf8'));
const covers = (p: Param | undefined, value: number) => p !== undefined && p.low <= value && value <= p.high;

beforeAll(() => {
  const started = Date.now();
  const r = spawnSync(process.execPath, [BIN, 'demo', '--quiet'], { cwd, encoding: 'utf8' });
  demo = { status: r.status, stdout: r.stdout, stderr: r.stderr, seconds: (Date.now() - started) / 1000 };
}, 120_000);
afterAll(() => rmSync(cwd, { recursive: true, force: true }));

describe('similis demo (built binary, worker threads)', () => {
  it('writes both campaigns and the page linking them, and says where it is', () => {
    expect(demo.status, demo.stderr).toBe(0);
    expect(demo.stdout).toContain('Open reports/demo/index.html in a browser');
    for (const f of ['index.html', 'pressure-drop/index.html', 'pressure-drop/pooled.html', 'settling/index.html', 'settling/pooled.json']) {
      expect(existsSync(join(cwd, 'reports/demo', f)), f).toBe(true);
    }
    for (const t of loopTruth.tubes as { file: string }[]) {
      expect(existsSync(join(cwd, 'reports/demo/pressure-drop/files', t.file.replace(/\.csv$/, '.html'))), t.file).toBe(true);
    }
  });

  it('pressure-drop: each copper tube covers the truth a = -0.25 (Blasius 1913); the steel tubes are flagged file-disagrees', () => {
    const idx = index('pressure-drop');
    expect(idx.files.every((f) => f.failure === null)).toBe(true);
    for (const name of loopTruth.smoothTubes.files as string[]) {
      const f = idx.files.find((x) => x.label.endsWith(`/${name}`))!;
      expect(covers(f.parameters.find((p) => p.name === 'a'), loopTruth.smoothTubes.a), name).toBe(true);
    }
    const flagged = idx.files.filter((f) => f.agreement?.disagrees === true).map((f) => f.label.split('/').pop());
    for (const name of loopTruth.roughTubes.files as string[]) expect(flagged, name).toContain(name);
    expect(demo.stderr).toContain('[file-disagrees]');
  });

  it('pressure-drop: every row spoiled on purpose is left out with its line and reason', () => {
    const idx = index('pressure-drop');
    const words: Record<string, string> = {
      'blank-dp': 'missing value in column dp (empty cell)',
      'temperature-dropout': 'water_density: T = 173.25 K',
      'na-flow': "missing value in column Q ('NA')",
      'flow-dropout': 'division by zero',
    };
    let checked = 0;
    for (const tube of loopTruth.tubes as { file: string; bad: { row: number; kind: string }[] }[]) {
      const text = readFileSync(join(ROOT, 'data-demo/pressure-drop', tube.file), 'utf8').split('\n');
      const f = idx.files.find((x) => x.label.endsWith(`/${tube.file}`))!;
      for (const b of tube.bad) {
        // The row's label is the tube letter and its number (D12); its line is found in the file itself.
        const label = `${tube.file[5]!.toUpperCase()}${String(b.row).padStart(2, '0')},`;
        const line = text.findIndex((l) => l.startsWith(label)) + 1;
        expect(line, label).toBeGreaterThan(0);
        const group = f.exclusions.find((e) => e.lines.includes(line));
        expect(group?.reason, `${tube.file} line ${line}`).toContain(words[b.kind]);
        checked++;
      }
    }
    expect(checked).toBe(4);
  });

  it('settling: the pooled 95 % intervals of a, b and c contain the truth (Schiller & Naumann 1933: 0.15, 0.687, 0)', () => {
    const pooled = index('settling').pooled.parameters;
    expect(covers(pooled.find((p) => p.name === 'a'), settleTruth.a)).toBe(true);
    expect(covers(pooled.find((p) => p.name === 'b'), settleTruth.b)).toBe(true);
    expect(covers(pooled.find((p) => p.name === 'c'), settleTruth.c)).toBe(true);
    const missed = (settleTruth.runs as { file: string; missedGate: number | null }[]).find((r) => r.missedGate !== null)!;
    const f = index('settling').files.find((x) => x.label.endsWith(`/${missed.file}`))!;
    expect(f.exclusions.map((e) => e.reason).join(' ')).toContain("missing value in column t (empty cell)");
  });

  it('the copper tubes alone: the pooled 95 % intervals of C, a and b contain the truth (Blasius 1913 with the invented (L/D/60)^-0.04)', () => {
    const files = (loopTruth.smoothTubes.files as string[]).map((f) => join(ROOT, 'data-demo/pressure-drop', f));
    const r = spawnSync(process.execPath, [BIN, 'batch', ...files, '--study', join(ROOT, 'data-demo/pressure-drop/study.yaml'), '--out', 'copper', '--jobs', '2', '--quiet'], { cwd, encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const pooled = (JSON.parse(readFileSync(join(cwd, 'copper/index.json'), 'utf8')) as Index).pooled.parameters;
    expect(covers(pooled.find((p) => p.name === 'C'), loopTruth.smoothTubes.C)).toBe(true);
    expect(covers(pooled.find((p) => p.name === 'a'), loopTruth.smoothTubes.a)).toBe(true);
    expect(covers(pooled.find((p) => p.name === 'b'), loopTruth.smoothTubes.b)).toBe(true);
  });
});

const haveChromium = existsSync(CHROMIUM);
if (!haveChromium) {
  if (process.env['CI']) throw new Error(`CI=true but ${CHROMIUM} is missing: .ci/run must install Debian's chromium`);
  console.warn(`demo browser test skipped: ${CHROMIUM} not found (install Debian's chromium to run it)`);
}

describe.skipIf(!haveChromium)('the demo pages in chromium', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await chromium.launch({ executablePath: CHROMIUM, args: FLAGS, headless: true });
  });
  afterAll(async () => {
    await browser?.close();
  });

  it.each(['index.html', 'pressure-drop/index.html', 'settling/index.html'])('%s opens from file with no console error and no network request, every plot drawn', async (page) => {
    const tab = await browser.newPage({ viewport: { width: 1200, height: 1400 } });
    const errors: string[] = [];
    const requests: string[] = [];
    tab.on('console', (m) => {
      if (m.type() === 'error') errors.push(m.text());
    });
    tab.on('pageerror', (e) => errors.push(String(e)));
    tab.on('request', (r) => {
      if (!r.url().startsWith('file:')) requests.push(r.url());
    });
    await tab.goto(pathToFileURL(join(cwd, 'reports/demo', page)).href, { waitUntil: 'load' });
    expect(errors).toEqual([]);
    expect(requests).toEqual([]);
    expect(await tab.locator('script').count()).toBe(0);
    // Every link on the page leads to a file that exists.
    const links = await tab.locator("a").evaluateAll((as) => as.map((a) => (a as unknown as { href: string }).href));
    expect(links.length).toBeGreaterThan(1);
    for (const href of links) expect(existsSync(fileURLToPath(href)), href).toBe(true);
    if (page !== 'index.html') {
      const figures = tab.locator('#parameter-plots figure svg');
      expect(await figures.count()).toBeGreaterThanOrEqual(2);
      const box = await figures.first().boundingBox();
      expect(box!.width).toBeGreaterThan(300);
    }
    await tab.close();
  });
});
