import { describe, expect, it } from 'vitest';
import { pointGroups, readDesignPoint, type PredictionRecipe } from '../../src/predict/index.js';

/**
 * pointGroups and readDesignPoint: a design point given as measured quantities with units, turned
 * into the correlation's groups exactly as the study computes them (water properties included).
 * Expected values from ../shared/reference/check-values.md section 3.2 (water at 40 degC,
 * 0.101325 MPa: IF97 density 992.2243 kg/m^3, R12-08 viscosity 652.73 uPa s) and NIST SP 811
 * (2008) Appendix B.9 for the units.
 */

const pipe: PredictionRecipe = {
  response: 'f',
  model: 'C*Re^a*LD^b',
  fit: { space: 'log', parameters: ['C', 'a', 'b'], names: ['ln C', 'a', 'b'], theta: [Math.log(0.37), -0.25, -0.04], covariance: [[1e-3, 0, 0], [0, 1e-5, 0], [0, 0, 1e-5]], logCoefficient: 'C' },
  residualVariance: 2e-4,
  dof: 100,
  level: 0.95,
  n: 103,
  maxLeverage: 0.1,
  predictors: ['Re', 'LD'],
  ranges: [
    { name: 'Re', min: 4000, max: 8e4 },
    { name: 'LD', min: 25, max: 200 },
  ],
  constants: [],
  steps: [
    { name: 'rho', role: 'derived', formula: 'water_density(T)', siUnit: 'kg m^-3' },
    { name: 'mu', role: 'derived', formula: 'water_viscosity(T)', siUnit: 'Pa s' },
    { name: 'U', role: 'derived', formula: '4*Q/(pi*D^2)', siUnit: 'm s^-1' },
    { name: 'Re', role: 'group', formula: 'rho*U*D/mu', siUnit: '1' },
    { name: 'f', role: 'group', formula: 'dp*D/(L*0.5*rho*U^2)', siUnit: '1' },
    { name: 'LD', role: 'group', formula: 'L/D', siUnit: '1' },
  ],
  inputs: [
    { name: 'T', kind: 'column', siUnit: 'K' },
    { name: 'Q', kind: 'column', siUnit: 'm^3 s^-1' },
    { name: 'D', kind: 'file-constant', siUnit: 'm', values: [{ file: 'a.csv', valueSI: 0.008 }, { file: 'b.csv', valueSI: 0.012 }] },
    { name: 'L', kind: 'file-constant', siUnit: 'm', values: [{ file: 'a.csv', valueSI: 1.2 }, { file: 'b.csv', valueSI: 1.2 }] },
    { name: 'dp', kind: 'column', siUnit: 'Pa' },
  ],
  cautions: [],
};

describe('readDesignPoint', () => {
  it('reads groups and quantities with units (degC offset and L/min factor: NIST SP 811 B.8, B.9)', () => {
    const e = readDesignPoint('Re=5e4,LD=120');
    expect(e.map((x) => [x.name, x.quantity.valueSI])).toEqual([
      ['Re', 50000],
      ['LD', 120],
    ]);
    const q = readDesignPoint('Q=30 L/min,T=40 degC');
    expect(q[0]!.quantity.valueSI).toBeCloseTo(30 / 60000, 18);
    expect(q[1]!.quantity.valueSI).toBeCloseTo(313.15, 12);
  });

  it.each([
    ['Re5e4', 'predict-at'],
    ['Re=5e4,Re=6e4', 'predict-at'],
    ['Re=', 'predict-at'],
    ['Q=30 furlongs', 'unit-unknown'],
  ])('refuses %s with kind %s', (text, kind) => {
    expect(() => readDesignPoint(text)).toThrow(expect.objectContaining({ kind }));
  });
});

describe('pointGroups', () => {
  it('computes Re and L/D from Q, T, D and L with the water properties (check-values.md 3.2, 40 degC)', () => {
    const g = pointGroups(pipe, readDesignPoint('Q=30 L/min,T=40 degC,D=16 mm,L=1.6 m'));
    const rho = 992.2243; // kg/m^3, IF97 at 40 degC
    const mu = 652.73e-6; // Pa s, R12-08 at 40 degC
    const d = 0.016;
    const u = (4 * (30 / 60000)) / (Math.PI * d * d);
    // rel 1e-5: the viscosity is printed to 5 digits
    expect(g.groups.get('Re')! / ((rho * u * d) / mu)).toBeCloseTo(1, 5);
    expect(g.groups.get('LD')).toBeCloseTo(100, 12);
    expect(g.computed.map((c) => c.name)).toEqual(['rho', 'mu', 'U', 'Re', 'LD']); // f (needs dp) is not computed
  });

  it('takes a file constant shared by every file (L) and says so', () => {
    const g = pointGroups(pipe, readDesignPoint('Q=30 L/min,T=40 degC,D=16 mm'));
    expect(g.assumed).toEqual([{ name: 'L', valueSI: 1.2, siUnit: 'm' }]);
    expect(g.groups.get('LD')).toBeCloseTo(75, 12);
  });

  it('refuses to guess a file constant that differs between files (D)', () => {
    expect(() => pointGroups(pipe, readDesignPoint('Q=30 L/min,T=40 degC'))).toThrow(expect.objectContaining({ kind: 'predict-name', message: expect.stringContaining('D differs between the files') }));
  });

  it('refuses a unit that measures something else than the data did (a mass flow for Q)', () => {
    expect(() => pointGroups(pipe, readDesignPoint('Q=30 kg/s,T=40 degC,D=16 mm'))).toThrow(expect.objectContaining({ kind: 'predict-unit' }));
  });

  it('refuses a name that is neither a group nor an input', () => {
    expect(() => pointGroups(pipe, readDesignPoint('Q=30 L/min,V=3 m/s'))).toThrow(expect.objectContaining({ kind: 'predict-name' }));
  });

  it('explains a water temperature outside the property range (IAPWS-IF97 region 1 ends at 273.15 K)', () => {
    expect(() => pointGroups(pipe, readDesignPoint('Q=30 L/min,T=-10 degC,D=16 mm'))).toThrow(
      expect.objectContaining({ kind: 'predict-not-finite', message: expect.stringContaining('273.15 K') }),
    );
  });

  it('takes groups given directly, and refuses a group with a unit', () => {
    expect(pointGroups(pipe, readDesignPoint('Re=3e4,LD=100')).groups).toEqual(new Map([['Re', 3e4], ['LD', 100]]));
    expect(() => pointGroups(pipe, readDesignPoint('Re=3e4 m,LD=100'))).toThrow(expect.objectContaining({ kind: 'predict-unit' }));
  });
});
