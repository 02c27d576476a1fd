import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { ReducedFile } from '../../src/reduce/index.js';
import { column, reduceTexts, studyOf } from './helpers.js';

/**
 * Open data: Stanton, T. E. and Pannell, J. R. (1914), "Similarity of motion in relation to the
 * surface friction of fluids", Phil. Trans. R. Soc. A 214:199-224, doi 10.1098/rsta.1914.0016;
 * compiled by A. Trettel (CC-BY-4.0), read from ../shared/reference/open-data/stanton-pannell-1914/.
 * The published raw readings are written into rig files (units in the header, the pipe diameter as
 * a # constant) and reduced by similis; the results are compared with the published Reynolds
 * numbers and friction coefficients (tau_w/(rho U^2), so Darcy f = 8 x the coefficient).
 *
 * Tolerances come from the printed digits: half a unit of the last significant digit of each
 * number (trailing zeros of the padded table not counted), added over the inputs and the
 * published result.
 */

const DIR = fileURLToPath(new URL('../../../shared/reference/open-data/stanton-pannell-1914/', import.meta.url));
const PRESENT = existsSync(DIR);
if (!PRESENT) console.warn(`stanton-pannell tests skipped: ${DIR} not found (the shared reference folder is absent)`);

/** Rows of a compiled CSV: cells trimmed and unquoted, with the file line of each row. */
function table(name: string): { line: number; cells: string[] }[] {
  return readFileSync(DIR + name, 'utf8')
    .trim()
    .split('\n')
    .slice(1)
    .map((l, i) => ({ line: i + 2, cells: l.split(',').map((c) => c.trim().replace(/"/g, '')).filter((c) => c !== '') }));
}

/** Half a unit in the last significant printed digit, relative to the value. */
function printedRel(text: string): number {
  const m = /^[+-]?(\d*)\.?(\d*)(?:[eE]([+-]?\d+))?$/.exec(text)!;
  const decimals = m[2]!.replace(/0+$/, '');
  const integer = m[1]!;
  const place = decimals.length > 0 ? -decimals.length : integer.length - integer.replace(/0+$/, '').length;
  return (0.5 * 10 ** (place + Number(m[3] ?? 0))) / Math.abs(Number(text));
}

const median = (xs: readonly number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 === 1 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};

describe.skipIf(!PRESENT)('reduceTable on Stanton & Pannell (1914) pipe friction data (skipped when ../shared is absent)', () => {
  const pipes = new Map(PRESENT ? table('pipes.csv').map((r) => [r.cells[0]!, r.cells[1]!]) : []);

  describe('thick oil in the 10.13 cm steel pipe: published density and kinematic viscosity per row', () => {
    const rows = PRESENT ? table('wall_shear_stress_measurements_thick_oil.csv') : [];
    const rig = `# Stanton & Pannell (1914), thick oil, steel pipe S\n# D = ${pipes.get('S')} cm\nU [cm/s],rho [g/cm^3],nu [cm^2/s],tau_w [dyn/cm^2]\n${rows
      .map((r) => [r.cells[0], r.cells[2], r.cells[4], r.cells[5]].join(','))
      .join('\n')}\n`;
    const study = studyOf('groups:\n  Re: U*D/nu\n  f: 8*tau_w/(rho*U^2)\n');
    const reduced = PRESENT ? reduceTexts({ 'oil.csv': rig }, study).reduced[0]! : undefined;
    it('Re = U D / nu reproduces the published Reynolds number of every row within its printed digits', () => {
      const re = column(reduced!, 'Re');
      rows.forEach((r, i) => {
        const [u, , , , nu, , , published] = r.cells as [string, string, string, string, string, string, string, string];
        const tol = printedRel(u) + printedRel(nu) + printedRel(pipes.get('S')!) + printedRel(published);
        expect(Math.abs(re[i]! / Number(published) - 1), `line ${r.line}`).toBeLessThanOrEqual(tol);
      });
    });
    it('f = 8 tau_w / (rho U^2) reproduces 8 x the published coefficient (printed as 100 x tau_w/(rho U^2))', () => {
      const f = column(reduced!, 'f');
      rows.forEach((r, i) => {
        const [u, , rho, , , tau, coefficient] = r.cells as [string, string, string, string, string, string, string];
        const tol = printedRel(tau) + printedRel(rho) + 2 * printedRel(u) + printedRel(coefficient);
        expect(Math.abs(f[i]! / ((8 * Number(coefficient)) / 100) - 1), `line ${r.line}`).toBeLessThanOrEqual(tol);
      });
    });
  });

  const all = PRESENT ? table('wall_shear_stress_measurements.csv') : [];
  /** One rig file per fluid and pipe, in the file's own units; returns the rows in file order. */
  function reduceFluid(fluid: string, studyYaml: string): { rows: typeof all; reduced: ReducedFile[] } {
    const rows = all.filter((r) => r.cells[5] === fluid);
    const files: Record<string, string> = {};
    const order: typeof all = [];
    for (const pipe of [...new Set(rows.map((r) => r.cells[6]!))]) {
      const mine = rows.filter((r) => r.cells[6] === pipe);
      order.push(...mine);
      files[`${fluid}-${pipe}.csv`] = `# ${fluid} in pipe ${pipe}\n# D = ${pipes.get(pipe)} cm\nU [cm/s],tau_w [dyn/cm^2],T [degC]\n${mine
        .map((r) => [r.cells[0], r.cells[1], r.cells[4]].join(','))
        .join('\n')}\n`;
    }
    return { rows: order, reduced: reduceTexts(files, studyOf(studyYaml)).reduced };
  }
  const joined = (reduced: ReducedFile[], name: string) => reduced.flatMap((r) => column(r, name));

  describe('water (191 rows, 4 brass pipes)', () => {
    // f with the CGS density of water, 1 g/cm^3, which the published coefficients imply
    // (line 2: 41.8 / 116.3^2 = 0.003090, printed 0.3090E-2). Re with the water viscosity of
    // Huber et al. (2009) at 0.1 MPa and the density of Tanaka et al. (2001), both from
    // check-values.md 3.2, computed by similis from the temperature column.
    const WATER = `
constants:
  rho_cgs: 1 g/cm^3
  mu_ref: 1e-6 Pa*s
  T_ref: 300 K
  rho_ref: 999.974950 kg/m^3
  T_zero: 273.15 K
  one_K: 1 K
derived:
  mu: mu_ref*(280.68*(T/T_ref)^-1.9 + 511.45*(T/T_ref)^-7.7 + 61.131*(T/T_ref)^-19.6 + 0.45903*(T/T_ref)^-40)
  rho: rho_ref*(1 - ((T - T_zero)/one_K - 3.983035)^2*((T - T_zero)/one_K + 301.797)/(522528.9*((T - T_zero)/one_K + 69.34881)))
groups:
  Re: rho*U*D/mu
  f: 8*tau_w/(rho_cgs*U^2)
`;
    const { rows, reduced } = PRESENT ? reduceFluid('Water', WATER) : { rows: [], reduced: [] };
    it('every row is reduced and keeps its line (4 files, lines 4 onwards)', () => {
      expect(reduced.reduce((s, r) => s + r.rowCount, 0)).toBe(191);
      expect(reduced[0]!.lines[0]).toBe(4);
    });
    it('f = 8 tau_w/(rho U^2) matches 8 x the published coefficient within the printed digits for >= 90 % of rows, median deviation < 0.2 %', () => {
      const f = joined(reduced, 'f');
      const deviations = rows.map((r, i) => Math.abs(f[i]! / (8 * Number(r.cells[2])) - 1));
      const within = rows.filter((r, i) => deviations[i]! <= printedRel(r.cells[1]!) + 2 * printedRel(r.cells[0]!) + printedRel(r.cells[2]!)).length;
      // 173 of 191 rows are within their rounding here; the rest include slips of the published
      // table itself (line 23: coefficient 0.4810E-2 where 23.9/22.3^2 = 0.0481, a factor of 10; line 157 likewise).
      expect(within / rows.length).toBeGreaterThanOrEqual(0.9);
      // A typical row's printed-digit tolerance is 0.2 to 0.8 %; the median deviation found is 0.11 %.
      expect(median(deviations)).toBeLessThan(2e-3);
    });
    it('Re with modern water properties is within 1.5 % of the published Re at the median, 5 % for >= 90 % of rows', () => {
      // The authors' 1914 viscosity table is not in the compiled data; modern values differ from it.
      const re = joined(reduced, 'Re');
      const ratios = rows.map((r, i) => re[i]! / Number(r.cells[3]));
      expect(Math.abs(median(ratios) - 1)).toBeLessThan(0.015);
      expect(ratios.filter((x) => Math.abs(x - 1) <= 0.05).length / rows.length).toBeGreaterThanOrEqual(0.9);
    });
  });

  describe('air (121 rows): density from the ideal gas law at 1 atm, viscosity from Sutherland', () => {
    // check-values.md 3.4: Sutherland, beta = 1.458e-6 kg/(m s K^0.5), S = 110.4 K (US Standard
    // Atmosphere 1976); specific gas constant of dry air 287.053 J/(kg K). The pressure of the
    // runs is not in the compiled data: 1 atm (101 325 Pa) is assumed.
    const AIR = `
constants:
  p_atm: 101325 Pa
  R_air: 287.053 J/(kg*K)
  beta: 1.458e-6 kg/(m*s*K^0.5)
  S: 110.4 K
derived:
  rho: p_atm/(R_air*T)
  mu: beta*T^1.5/(T + S)
groups:
  Re: rho*U*D/mu
  f: 8*tau_w/(rho*U^2)
`;
    const { rows, reduced } = PRESENT ? reduceFluid('Air', AIR) : { rows: [], reduced: [] };
    it('f and Re agree with the published values within 1.5 % at the median (assumed 1 atm and modern air properties)', () => {
      const f = joined(reduced, 'f');
      const re = joined(reduced, 'Re');
      expect(rows.length).toBe(121);
      expect(Math.abs(median(rows.map((r, i) => f[i]! / (8 * Number(r.cells[2])))) - 1)).toBeLessThan(0.015);
      expect(Math.abs(median(rows.map((r, i) => re[i]! / Number(r.cells[3]))) - 1)).toBeLessThan(0.015);
    });
  });
});
