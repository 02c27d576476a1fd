import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { compileFormula, differentiate, evaluateAt, inferDimension, parseFormula } from '../../src/expr/index.js';
import {
  DENSITY,
  explainPropertyFailures,
  PRESSURE,
  PROPERTY_FUNCTIONS,
  PROPERTY_FUNCTIONS_INFO,
  TEMPERATURE,
  waterDensity,
  waterViscosity,
} from '../../src/properties/index.js';
import { Dimension } from '../../src/units/index.js';
import { expectRelClose } from '../units/tolerance.js';

const fns = PROPERTY_FUNCTIONS;
const parse = (text: string) => parseFormula(text, { functions: fns });
const VELOCITY = Dimension.of({ L: 1, T: -1 });
const LENGTH = Dimension.of({ L: 1 });
const dims = new Map([
  ['rho', DENSITY],
  ['U', VELOCITY],
  ['D', LENGTH],
  ['T', TEMPERATURE],
  ['p', PRESSURE],
]);

describe('PROPERTY_FUNCTIONS: dimension rules', () => {
  it('rho*U*D/water_viscosity(T) is dimensionless (a Reynolds number)', () => {
    const r = inferDimension(parse('rho*U*D/water_viscosity(T)'), dims, fns);
    expect(r.dimension.isDimensionless()).toBe(true);
  });

  it('U*D/water_kinematic_viscosity(T, p) and U*D*air_density(T, p)/air_viscosity(T) are dimensionless', () => {
    expect(inferDimension(parse('U*D/water_kinematic_viscosity(T, p)'), dims, fns).dimension.isDimensionless()).toBe(true);
    expect(inferDimension(parse('U*D*air_density(T, p)/air_viscosity(T)'), dims, fns).dimension.isDimensionless()).toBe(true);
  });

  it('water_density(p) is refused: the argument must be a temperature', () => {
    const f = parse('water_density(p)');
    expect(() => inferDimension(f, dims, fns)).toThrow(InputError);
    try {
      inferDimension(f, dims, fns);
    } catch (e) {
      const err = e as InputError;
      expect(err.kind).toBe('formula-dimension');
      expect(err.message).toBe('water_density needs an argument that is a temperature (T, absolute), found p (a pressure or stress, M L^-1 T^-2)');
      expect(err.where.column).toBe(15); // under the p
    }
  });

  it('water_density(T, T) is refused: the second argument must be a pressure', () => {
    expect(() => inferDimension(parse('water_density(T, T)'), dims, fns)).toThrow(/needs an argument that is a pressure/);
  });

  it('air_density needs both T and p (arity is checked when parsing)', () => {
    expect(() => parse('air_density(T)')).toThrow(/air_density takes 2 arguments, found 1/);
  });

  it('each function returns its stated dimension', () => {
    for (const info of PROPERTY_FUNCTIONS_INFO) {
      const call = `${info.name}(${info.argumentNames.join(', ')})`;
      expect(inferDimension(parse(call), dims, fns).dimension.equals(info.resultDimension), call).toBe(true);
    }
  });
});

describe('PROPERTY_FUNCTIONS: column evaluation', () => {
  it('gives NaN for an out-of-range row and values for the others; explainPropertyFailures names the reason', () => {
    const f = parse('rho*U*D/water_viscosity(T)');
    const t = new Float64Array([293.15, 400, 313.15]);
    const bound = compileFormula(f, { vectors: ['T'], scalars: ['rho', 'U', 'D'], params: [] }, fns).bind({
      n: 3,
      vectors: { T: t },
      scalars: { rho: 998.2, U: 1, D: 0.05 },
    });
    const re = bound.evaluate([]);
    expectRelClose(re[0]!, (998.2 * 0.05) / waterViscosity(293.15), 1e-14);
    expect(Number.isNaN(re[1]!)).toBe(true);
    expectRelClose(re[2]!, (998.2 * 0.05) / waterViscosity(313.15), 1e-14);

    const values = new Map<string, number>([['rho', 998.2], ['U', 1], ['D', 0.05], ['T', 400]]);
    const why = explainPropertyFailures(f, (n) => values.get(n));
    expect(why).toHaveLength(1);
    expect(why[0]!.callText).toBe('water_viscosity(T)');
    expect(why[0]!.argument).toBe('p');
    expect(why[0]!.message).toContain('not liquid');
    values.set('T', 300);
    expect(explainPropertyFailures(f, (n) => values.get(n))).toEqual([]);
  });

  it('uses 101.325 kPa when water functions get no pressure', () => {
    expect(evaluateAt(parse('water_density(T)'), new Map([['T', 293.15]]), fns)).toBe(waterDensity(293.15, 101325));
  });
});

describe('PROPERTY_FUNCTIONS: derivative rules (exact) against central differences', () => {
  // Central differences with h = 1e-3 K and 100 Pa: truncation and rounding both below 1e-6 relative
  // for these smooth functions (see water.test.ts).
  const points: readonly [number, number][] = [
    [283.15, 101325],
    [333.15, 5e5],
    [363.15, 2e5],
  ];
  for (const info of PROPERTY_FUNCTIONS_INFO.filter((i) => i.derivativeOf === undefined)) {
    for (const arg of info.argumentNames) {
      it(`d ${info.name}/d ${arg}`, () => {
        const f = parse(`${info.name}(${info.argumentNames.join(', ')})`);
        const d = differentiate(f, arg, fns);
        for (const [t, p] of points) {
          const at = (tt: number, pp: number) => evaluateAt(f, new Map([['T', tt], ['p', pp]]), fns);
          const h = arg === 'T' ? 1e-3 : 100;
          const numeric = arg === 'T' ? (at(t + h, p) - at(t - h, p)) / (2 * h) : (at(t, p + h) - at(t, p - h)) / (2 * h);
          const exact = evaluateAt(d, new Map([['T', t], ['p', p]]), fns);
          expectRelClose(exact, numeric, 1e-5, `${d.text} at ${t} K, ${p} Pa`);
        }
      });
    }
  }

  it('water_density differentiates to its companion: d/dT water_density(T) = water_density_dT(T)', () => {
    expect(differentiate(parse('water_density(T)'), 'T', fns).text).toBe('water_density_dT(T)');
  });

  it('the compiled Jacobian goes through the same rules (a parameter inside the temperature argument)', () => {
    const f = parse('water_viscosity(T + dT)');
    const compiled = compileFormula(f, { vectors: ['T'], scalars: [], params: ['dT'] }, fns);
    const bound = compiled.bind({ n: 2, vectors: { T: new Float64Array([293.15, 323.15]) }, scalars: {} });
    const out = new Float64Array(2);
    const jac = new Float64Array(2);
    bound.evaluateWithJacobian([0.5], out, jac);
    const dMu = parse('water_viscosity_dT(T)');
    for (const [i, t] of [293.65, 323.65].entries()) {
      expectRelClose(jac[i]!, evaluateAt(dMu, new Map([['T', t]]), fns), 1e-12, `row ${i}`);
    }
  });

  it('a second derivative is refused with formula-not-differentiable', () => {
    const d = differentiate(parse('water_density(T)'), 'T', fns);
    expect(() => differentiate(d, 'T', fns)).toThrow(/second derivatives of the property functions are not available/);
  });
});
