import * as vega from 'vega';
import { describe, expect, it } from 'vitest';
import { reportPlots, renderSvg } from '../../src/report/index.js';
import { compactNumbers, compileSpec } from '../../src/report/svg.js';
import { fixtureModel } from './fixture.js';

/**
 * renderSvg compiles each plot's shape once and puts the data back (svg.ts, compileShaped). The
 * reference here is the plain path with no cache: vega-lite's compile of the whole spec, data
 * inline, rendered by vega (vega-lite and vega documentation: compile, then View.toSVG).
 */
async function plainSvg(spec: Parameters<typeof compileSpec>[0]): Promise<string> {
  const view = new vega.View(vega.parse((await compileSpec(spec)) as never), { renderer: 'none' });
  try {
    return compactNumbers(await view.toSVG());
  } finally {
    view.finalize();
  }
}

describe('renderSvg with compiled shapes reused', () => {
  it('gives the same SVG as a fresh compilation, for every report plot, on two data sets of the same shape in turn', async () => {
    // fixtureModel(n) draws different points for each n: the second report reuses the first one's
    // compiled shapes with other data, and must not show the first one's points.
    for (const n of [120, 90, 120]) {
      for (const plot of reportPlots(fixtureModel(n))) {
        const cached = await renderSvg(plot.spec);
        // vega numbers clip paths from a counter shared by every render in the process: compare
        // without those numbers.
        const unnumbered = (svg: string) => svg.replace(/clip\d+/g, 'clip#');
        expect(unnumbered(cached), `${plot.id} (n = ${n})`).toBe(unnumbered(await plainSvg(plot.spec)));
      }
    }
  });

  it('the number of point marks follows the data, not an earlier plot of the same shape', async () => {
    const count = (svg: string) => (svg.match(/<path /g) ?? []).length;
    const [small] = reportPlots(fixtureModel(30));
    const [large] = reportPlots(fixtureModel(200));
    expect(count(await renderSvg(large!.spec))).toBeGreaterThan(count(await renderSvg(small!.spec)) + 100);
  });
});
