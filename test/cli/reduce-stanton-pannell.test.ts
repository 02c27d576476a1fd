/**
 * Open data through `similis reduce`: Stanton, T. E. and Pannell, J. R. (1914), "Similarity of
 * motion in relation to the surface friction of fluids", Phil. Trans. R. Soc. A 214:199-224,
 * doi 10.1098/rsta.1914.0016; compiled by A. Trettel (CC-BY-4.0), read from
 * ../shared/reference/open-data/stanton-pannell-1914/. The 191 water rows are written as rig files
 * with the published bulk velocity [cm/s], wall shear stress [dyn/cm^2] and temperature [degC] and
 * the pipe diameter as a # constant; the study computes density and viscosity from the temperature
 * alone (water_density(T): IAPWS-IF97 region 1; water_viscosity(T): IAPWS R12-08), and the results
 * are compared with the published Reynolds numbers and 8 x the published friction coefficient
 * (their coefficient is tau_w/(rho U^2) = f_D/8; check-values.md 6.3).
 */
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { EXIT } from '../../src/cli/io.js';
import { tmpFolder } from './tmp-folder.js';

const DIR = fileURLToPath(new URL('../../../shared/reference/open-data/stanton-pannell-1914/', import.meta.url));
const PRESENT = existsSync(DIR);
if (!PRESENT) console.warn(`similis reduce on Stanton & Pannell skipped: ${DIR} not found (the shared reference folder is absent)`);

/** Rows of a compiled CSV: cells trimmed and unquoted, with the line of each row in the compiled file. */
function table(name: string): { line: number; cells: string[] }[] {
  return readFileSync(DIR + name, 'utf8')
    .trim()
    .split('\n')
    .slice(1)
    .map((l, i) => ({ line: i + 2, cells: l.split(',').map((c) => c.trim().replace(/"/g, '')).filter((c) => c !== '') }));
}

const STUDY = `title: Stanton and Pannell (1914), water in brass pipes
data: [pipe-*.csv]
derived:
  rho: water_density(T)
  mu: water_viscosity(T)
groups:
  Re: rho*U*D/mu
  f: 8*tau_w/(rho*U^2)
`;

function stats(xs: readonly number[]): { n: number; mean: number; sd: number } {
  const n = xs.length;
  const mean = xs.reduce((a, b) => a + b, 0) / n;
  return { n, mean, sd: Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1)) };
}

describe.skipIf(!PRESENT)('similis reduce on the Stanton & Pannell (1914) water rows (skipped when ../shared is absent)', () => {
  const pipes = new Map(PRESENT ? table('pipes.csv').map((r) => [r.cells[0]!, r.cells[1]!]) : []);
  const water = PRESENT ? table('wall_shear_stress_measurements.csv').filter((r) => r.cells[5] === 'Water') : [];
  const files: Record<string, string> = { 'study.yaml': STUDY };
  /** The compiled rows in the order the reduced output lists them (files in name order, rows in line order). */
  const order: typeof water = [];
  const pipeIds = [...new Set(water.map((r) => r.cells[6]!))].sort((a, b) => `pipe-${a}.csv`.localeCompare(`pipe-${b}.csv`));
  for (const pipe of pipeIds) {
    const mine = water.filter((r) => r.cells[6] === pipe);
    order.push(...mine);
    files[`pipe-${pipe}.csv`] = `# Stanton & Pannell (1914), water, brass pipe ${pipe}\n# D = ${pipes.get(pipe)} cm\nU [cm/s],tau_w [dyn/cm^2],T [degC]\n${mine
      .map((r) => [r.cells[0], r.cells[1], r.cells[4]].join(','))
      .join('\n')}\n`;
  }
  const folder = tmpFolder(PRESENT ? files : {});
  afterAll(() => folder.remove());
  const run = PRESENT ? folder.run('reduce', '--study', 'study.yaml', '--json') : Promise.resolve({ code: -1, out: '{}', err: '' });

  it('reduces all 191 rows of the 4 brass pipes, none excluded: every temperature is inside the IAPWS range', async () => {
    const r = await run;
    expect(r.code).toBe(EXIT.ok);
    const doc = JSON.parse(r.out) as { rows: unknown[]; excluded: unknown[] };
    expect(water.length).toBe(191);
    expect(pipeIds.length).toBe(4);
    expect(doc.rows.length).toBe(191);
    expect(doc.excluded).toEqual([]);
  });

  it('Re = water_density(T) U D / water_viscosity(T) reproduces the published Reynolds numbers: mean ratio within 1 %, s.d. below 2 %', async () => {
    const doc = JSON.parse((await run).out) as { rows: { Re: number; line: number; file: string }[] };
    const ratios = doc.rows.map((x, i) => x.Re / Number(order[i]!.cells[3]));
    const s = stats(ratios);
    console.log(`Stanton & Pannell water, Re (similis) / Re (1914): mean ${s.mean.toFixed(4)}, s.d. ${(100 * s.sd).toFixed(2)} % over ${s.n} rows`);
    // Acceptance bounds of ours: the 1914 water viscosities differ from IAPWS R12-08 by about 1 %
    // (from memory); the published Re are printed to 4 digits.
    expect(Math.abs(s.mean - 1)).toBeLessThan(0.01);
    expect(s.sd).toBeLessThan(0.02);
  });

  it('f = 8 tau_w/(rho U^2) is 8 x the published coefficient within 10 % for 187 of 191 rows (mean within 0.3 %, s.d. below 1 %); two rows are off by a factor of 10', async () => {
    const doc = JSON.parse((await run).out) as { rows: { f: number }[] };
    const ratios = doc.rows.map((x, i) => x.f / (8 * Number(order[i]!.cells[2])));
    const inside = ratios.filter((x) => Math.abs(x - 1) <= 0.1);
    const s = stats(inside);
    const outside = order.map((r, i) => ({ line: r.line, ratio: ratios[i]! })).filter((o) => Math.abs(o.ratio - 1) > 0.1);
    console.log(
      `Stanton & Pannell water, f (similis) / 8 x coefficient (1914): ${s.n} of ${ratios.length} rows within 10 %, mean ${s.mean.toFixed(4)}, s.d. ${(100 * s.sd).toFixed(2)} %; ` +
        `outside: ${outside.map((o) => `line ${o.line} (${o.ratio.toFixed(3)})`).join(', ')}`,
    );
    expect(s.n).toBe(187);
    // The coefficient is printed to 4 digits, tau_w to 3-4 and U to 4-5: together 0.1 to 0.5 % per row.
    expect(Math.abs(s.mean - 1)).toBeLessThan(0.003);
    expect(s.sd).toBeLessThan(0.01);
    // Lines 23 and 157 of the compiled file: the published shear stress is 10 x what the published
    // coefficient and Reynolds number imply (pipe 1, U 22.30 cm/s, tau_w 23.9 dyn/cm^2, coefficient
    // 0.4810E-2 at Re 5060; pipe 17, U 1670 cm/s, tau_w 58700, coefficient 0.2100E-2 at Re 132000);
    // Blasius (1913), f_D = 0.3164 Re^-0.25, gives f_D/8 = 0.0047 and 0.0021 there, as printed.
    const tenfold = outside.filter((o) => Math.abs(o.ratio / 10 - 1) < 0.01).map((o) => o.line);
    expect([...tenfold].sort((a, b) => a - b)).toEqual([23, 157]);
    // The other two (lines 65 and 188: ratios 0.897 and 0.627) are not a factor of 10.
    expect(outside.map((o) => o.line).sort((a, b) => a - b)).toEqual([23, 65, 157, 188]);
  });
});
