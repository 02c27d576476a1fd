/**
 * logSpaceStart: the start of a power law fitted in linear space is the least-squares solution in
 * log space, ln y = ln C + sum s_k a_k ln x_k (+ ln of the known factors). Checked against the
 * normal equations (X^T W X) b = X^T W z of that log design, solved independently with mathjs 15
 * (adequate for these well-conditioned designs: condition of X^T X below 1e5, so a relative
 * agreement of 1e-9 leaves room for both algorithms' rounding and no room for a wrong design).
 */
import { describe, expect, it } from 'vitest';
import { parseFormula } from '../../src/expr/index.js';
import { detectPowerProduct } from '../../src/fit/index.js';
import { logSpaceStart } from '../../src/fit/log-start.js';
import { mathjs } from '../expr/mathjs.js';
import { SEED } from '../seed.js';
import { SeededRandom } from './random.js';

const n = 300;
const rng = new SeededRandom(SEED + 31);
const re = Float64Array.from({ length: n }, () => rng.logUniform(1e3, 1e5));
const ld = Float64Array.from({ length: n }, () => rng.logUniform(10, 200));
const noise = Float64Array.from({ length: n }, () => Math.exp(0.05 * rng.normal()));

/** Weighted normal-equation solution for design rows x and response z. */
function normalEquations(x: number[][], z: number[], w?: Float64Array): number[] {
  const xw = x.map((row, i) => row.map((v) => v * (w === undefined ? 1 : w[i]!)));
  const xt = mathjs.transpose(x);
  return mathjs.multiply(mathjs.inv(mathjs.multiply(xt, xw)), mathjs.multiply(mathjs.transpose(xw), z)) as number[];
}

function expectClose(actual: ArrayLike<number>, expected: readonly number[]): void {
  expected.forEach((e, j) => expect(Math.abs(actual[j]! - e)).toBeLessThanOrEqual(1e-9 * Math.abs(e)));
}

describe('logSpaceStart', () => {
  it('C*Re^a*LD^b: C = exp(b0), a = b1, b = b2 of the log design [1, ln Re, ln LD] (unweighted and weighted)', () => {
    const f = Float64Array.from(re, (r, i) => 0.3164 * r ** -0.25 * ld[i]! ** 0.05 * noise[i]!);
    const pp = detectPowerProduct(parseFormula('C*Re^a*LD^b'), new Set(['C', 'a', 'b']))!;
    const x = Array.from({ length: n }, (_, i) => [1, Math.log(re[i]!), Math.log(ld[i]!)]);
    const z = Array.from(f, Math.log);
    const b = normalEquations(x, z);
    const s = logSpaceStart(pp, [re, ld], undefined, f, undefined, ['C', 'a', 'b'], Float64Array.of(1, 0, 0))!;
    expectClose(s.start, [Math.exp(b[0]!), b[1]!, b[2]!]);
    // The factor it keeps for the design checks is that of [1, ln Re, ln LD]: R^T R = X^T X.
    const xtx = mathjs.multiply(mathjs.transpose(x), x) as number[][];
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        let rtr = 0;
        for (let k = 0; k < 3; k++) rtr += s.design!.factor[k + i * 3]! * s.design!.factor[k + j * 3]!;
        expect(Math.abs(rtr - xtx[i]![j]!)).toBeLessThanOrEqual(1e-12 * Math.abs(xtx[i]![i]! * xtx[j]![j]!) ** 0.5);
      }
    }
    const sw = Float64Array.from({ length: n }, (_, i) => 0.5 + (i % 4));
    const weighted = logSpaceStart(pp, [re, ld], undefined, f, sw, ['C', 'a', 'b'], Float64Array.of(1, 0, 0))!;
    const bw = normalEquations(x, z, sw.map((v) => v * v));
    expectClose(weighted.start, [Math.exp(bw[0]!), bw[1]!, bw[2]!]);
    expect(weighted.design).toBeUndefined();
  });

  it('64/Re^a with a parameter order of its own: a = -slope of ln(y/64) on ln Re; C-free, so no design factor', () => {
    const y = Float64Array.from(re, (r, i) => (64 / r ** 0.98) * noise[i]!);
    const pp = detectPowerProduct(parseFormula('64/Re^a'), new Set(['a']))!;
    const known = new Float64Array(n).fill(64);
    const b = normalEquations(Array.from({ length: n }, (_, i) => [-Math.log(re[i]!)]), Array.from(y, (v) => Math.log(v / 64)));
    const s = logSpaceStart(pp, [re], known, y, undefined, ['a'], Float64Array.of(1))!;
    expectClose(s.start, [b[0]!]);
    expect(s.design).toBeUndefined();
  });

  it('is undefined when log space is impossible (a value <= 0) or the log design is rank deficient (a constant group)', () => {
    const pp = detectPowerProduct(parseFormula('C*Re^a*LD^b'), new Set(['C', 'a', 'b']))!;
    const f = Float64Array.from(re, (r) => 0.3 * r ** -0.25);
    f[17] = -1;
    expect(logSpaceStart(pp, [re, ld], undefined, f, undefined, ['C', 'a', 'b'], Float64Array.of(1, 0, 0))).toBeUndefined();
    f[17] = 0.01;
    const constant = new Float64Array(n).fill(50);
    expect(logSpaceStart(pp, [re, constant], undefined, f, undefined, ['C', 'a', 'b'], Float64Array.of(1, 0, 0))).toBeUndefined();
  });
});
