import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Rational } from '../../src/common/rational.js';
import { SEED } from '../seed.js';
import { column, reduceTexts, studyOf } from './helpers.js';

/**
 * The same measurements logged in US customary units and in SI must give the same groups to
 * 1e-12 relative (the issue's requirement). The SI file is written here from the US file with the
 * exact factors of NIST SP 811 (2008) Appendix B.9, in exact rational arithmetic, printed to 30
 * significant digits: it does not go through the unit engine under test.
 */

/** NIST SP 811 (2008) B.9, all exact by definition. */
const SP811 = {
  inch_m: Rational.parse('0.0254'),
  foot_m: Rational.parse('0.3048'),
  gallon_m3: Rational.parse('0.003785411784'),
  minute_s: Rational.of(60),
  pound_kg: Rational.parse('0.45359237'),
  poundForce_N: Rational.parse('4.4482216152605'),
};
const PSI_PA = SP811.poundForce_N.div(SP811.inch_m.powInt(2));
const GPM_M3S = SP811.gallon_m3.div(SP811.minute_s);
const LB_FT3_KGM3 = SP811.pound_kg.div(SP811.foot_m.powInt(3));
const LB_FTS_PAS = SP811.pound_kg.div(SP811.foot_m);
/** SP 811 B.9: T/K = (t/degF + 459.67)/1.8. */
const degFToK = (t: Rational) => t.add(Rational.parse('459.67')).div(Rational.parse('1.8'));

/** An exact rational as a decimal with `digits` significant digits (truncated). */
function decimal(r: Rational, digits = 30): string {
  const negative = r.num < 0n;
  let num = negative ? -r.num : r.num;
  const den = r.den;
  let exponent = 0;
  const limit = 10n ** BigInt(digits);
  while (num / den >= limit) {
    num /= 10n;
    exponent++;
  }
  while (num / den < limit / 10n && num !== 0n) {
    num *= 10n;
    exponent--;
  }
  return `${negative ? '-' : ''}${(num / den).toString()}e${exponent}`;
}

const STUDY = studyOf(`
constants:
  T0: 293.15 K
derived:
  U: 4*Q/(pi*D^2)
groups:
  Re: rho*U*D/mu
  f: dp*D/(L*0.5*rho*U^2)
  LD: L/D
  theta: T/T0
`);

const row = fc.tuple(
  fc.integer({ min: 1, max: 400 }).map((k) => Rational.of(k, 8)), // gpm, in steps of 1/8
  fc.integer({ min: 1, max: 100_000 }).map((k) => Rational.of(k, 1000)), // psi
  fc.integer({ min: 330, max: 2000 }).map((k) => Rational.of(k, 10)), // degF
);

describe('reduceTable: US customary and SI files of the same data', () => {
  it('give the same Re, f, L/D and T/T0 to 1e-12 relative (NIST SP 811 B.9 factors)', () => {
    fc.assert(
      fc.property(fc.array(row, { minLength: 1, maxLength: 20 }), (rows) => {
        const d = Rational.parse('0.75');
        const l = Rational.of(12);
        const rho = Rational.parse('62.3');
        const mu = Rational.parse('0.00066');
        const us = `# D = 0.75 in\n# L = 12 ft\n# rho = 62.3 lb/ft^3\n# mu = 6.6e-4 lb/(ft*s)\nQ [gal/min],dp [psi],T [degF]\n${rows
          .map(([q, p, t]) => `${decimal(q)},${decimal(p)},${decimal(t)}`)
          .join('\n')}\n`;
        const si = `# D = ${decimal(d.mul(SP811.inch_m))} m\n# L = ${decimal(l.mul(SP811.foot_m))} m\n# rho = ${decimal(rho.mul(LB_FT3_KGM3))} kg/m^3\n# mu = ${decimal(
          mu.mul(LB_FTS_PAS),
        )} Pa*s\nQ [m^3/s],dp [Pa],T [K]\n${rows.map(([q, p, t]) => `${decimal(q.mul(GPM_M3S))},${decimal(p.mul(PSI_PA))},${decimal(degFToK(t))}`).join('\n')}\n`;
        const { reduced } = reduceTexts({ 'us.csv': us, 'si.csv': si }, STUDY);
        for (const name of ['U', 'Re', 'f', 'LD', 'theta']) {
          const a = column(reduced[0]!, name);
          const b = column(reduced[1]!, name);
          a.forEach((x, i) => expect(Math.abs(x - b[i]!), `${name} row ${i}: ${x} vs ${b[i]}`).toBeLessThanOrEqual(1e-12 * Math.abs(b[i]!)));
        }
      }),
      { seed: SEED, numRuns: 50 },
    );
  });
});
