import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { SEED } from '../seed.js';
import { escapeHtml, MAX_PLOTTED_POINTS, renderReportHtml, reportPlots } from '../../src/report/index.js';
import { html } from '../../src/report/escape.js';
import { pointTitles } from '../../src/report/svg-titles.js';
import { compactNumbers } from '../../src/report/svg.js';
import { fixtureModel } from './fixture.js';

describe('escapeHtml', () => {
  it('escapes the five HTML specials and the backtick (OWASP XSS prevention rule #1: common practice)', () => {
    expect(escapeHtml(`<a href="x" onclick='y'>&\``)).toBe('&lt;a href=&quot;x&quot; onclick=&#39;y&#39;&gt;&amp;&#96;');
  });
  it('html`` escapes every interpolated value, arrays included', () => {
    expect(html`<td>${'a<b'}</td>${['<i>', '&']}`.value).toBe('<td>a&lt;b</td>&lt;i&gt;&amp;');
  });
});

describe('pointTitles', () => {
  it('turns a point label into an SVG <title> child', () => {
    expect(pointTitles('<path aria-label="a.csv:3" role="graphics-symbol" aria-roledescription="symbol mark" d="M0,0"/>')).toBe(
      '<path d="M0,0"><title>a.csv:3</title></path>',
    );
  });
});

describe('compactNumbers', () => {
  it('rounds geometry to 0.01 px and leaves text alone', () => {
    expect(compactNumbers('<g transform="translate(100,33.333333333333336)"><text x="1.23456">0.0355</text></g>')).toBe(
      '<g transform="translate(100,33.33)"><text x="1.23">0.0355</text></g>',
    );
  });

  it('rounds negative coordinates and path data, leaves other attributes (stroke-width, aria) and short decimals alone', () => {
    expect(compactNumbers('<path d="M-1.23456,2.5L3.14159,-0.004" stroke-width="1.23456" aria-label="x 1.23456" y1="0.12"/>')).toBe(
      '<path d="M-1.23,2.5L3.14,0" stroke-width="1.23456" aria-label="x 1.23456" y1="0.12"/>',
    );
  });

  it('gives what one regular expression over the whole text gives, on random SVG-like text (property test, seeded)', () => {
    // The plain specification of the rounding (the first implementation): the scan must agree.
    const reference = (svg: string): string =>
      svg.replace(/ (transform|d|x|y|x1|x2|y1|y2|width|height)="([^"]*)"/g, (_m, attr: string, value: string) => ` ${attr}="${value.replace(/-?\d+\.\d{3,}/g, (m) => String(Math.round(Number(m) * 100) / 100))}"`);
    const piece = fc.constantFrom(' ', '"', '=', '="', ' d="', ' x="', ' x1="', ' width="', 'stroke-width="', ' transform="translate(', '-', '.', ',', '<text>', '</text>', 'a', 'M', '1', '23', '4567');
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 40 }), (parts) => {
        const svg = parts.join('');
        expect(compactNumbers(svg)).toBe(reference(svg));
      }),
      { seed: SEED, numRuns: 2000 },
    );
  });
});

describe('reportPlots: residuals against each group', () => {
  it('leaves out the panel of a group that has one value in the data (the L/D of one tube) and names it in the caption', () => {
    const model = fixtureModel(60);
    const hostile = model.groups[1]!.name;
    const oneTube = { ...model, points: model.points.map((p) => ({ ...p, groups: { ...p.groups, [hostile]: 50 } })) };
    const panels = (m: typeof model) => (reportPlots(m).find((p) => p.id === 'residuals-groups')!.spec as unknown as { concat: unknown[] }).concat.length;
    expect(panels(model)).toBe(2);
    expect(panels(oneTube)).toBe(1);
    expect(reportPlots(oneTube).find((p) => p.id === 'residuals-groups')!.caption).toContain(`No panel for ${hostile} = 50`);
  });
});

describe('renderReportHtml', () => {
  it('puts the sections in reading order, with the cautions near the top', async () => {
    const page = await renderReportHtml(fixtureModel());
    const order = ['class="verdict', 'class="cautions"', 'id="correlation"', 'id="domain"', 'id="plots"', 'id="residual-plots"', 'id="goodness"', 'id="flagged"', 'id="excluded"', 'id="warnings"', 'id="provenance"'];
    const positions = order.map((s) => page.indexOf(s));
    for (const [i, p] of positions.entries()) expect(p, order[i]).toBeGreaterThan(0);
    expect([...positions].sort((a, b) => a - b)).toEqual(positions);
  });

  it('has no script, no external reference and no unescaped user text', async () => {
    const page = await renderReportHtml(fixtureModel());
    expect(page).not.toMatch(/<script/i);
    expect(page).not.toMatch(/<img/i);
    expect(page).not.toMatch(/(src|href)\s*=\s*["']?(https?:)?\/\//i);
    expect(page).not.toMatch(/url\((?!#)/i); // only same-document references (SVG clip paths)
    expect(page).toContain('&lt;script&gt;window.__pwned = 1&lt;/script&gt;');
    expect(page).toContain("default-src 'none'");
  });

  it('shows the flagged point with its file and line, and the excluded row with its reason', async () => {
    const page = await renderReportHtml(fixtureModel());
    const flaggedSection = page.slice(page.indexOf('id="flagged"'), page.indexOf('id="excluded"'));
    expect(flaggedSection).toContain('.csv:15'); // point i = 7 is 20 % off (fixture.ts)
    expect(flaggedSection).toContain('outlier');
    expect(page.slice(page.indexOf('id="excluded"'))).toContain('missing value in column dp');
  });

  it('thins 100,000 points to a faithful subsample that keeps every flagged point, page under 5 MB', async () => {
    const model = fixtureModel(100_000);
    const flagged = model.points.filter((p) => p.flags.length > 0).length;
    for (const plot of reportPlots(model)) {
      const json = JSON.stringify(plot.spec);
      const shown = (json.match(/"source":/g) ?? []).length;
      expect(shown, plot.id).toBeLessThanOrEqual(plot.id === 'residuals-groups' ? 2 * (MAX_PLOTTED_POINTS + flagged) : MAX_PLOTTED_POINTS + flagged);
    }
    const main = reportPlots(model)[0]!;
    expect(main.caption).toMatch(/Showing [\d,]+ of 100,000 points/);
    const page = await renderReportHtml(model);
    expect(page.length).toBeLessThan(5 * 1024 * 1024);
    // every flagged point is still drawn in the main plot, with its file:line as a <title>
    const mainFigure = page.slice(page.indexOf('id="plot-main"'), page.indexOf('id="plot-parity"'));
    for (const [i, p] of model.points.entries()) {
      if (p.flags.length > 0) expect(mainFigure, p.source).toContain(`.csv:${i + 8}</title>`);
    }
  });
});
