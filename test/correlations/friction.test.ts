import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  BLASIUS,
  CHURCHILL_1977,
  COLEBROOK,
  correlationAt,
  findCorrelation,
  HAALAND,
  HAGEN_POISEUILLE,
  MCKEON_2005,
  PRANDTL_KARMAN,
  solveLogLaw,
  SWAMEE_JAIN,
  VON_KARMAN_ROUGH,
} from '../../src/correlations/index.js';
import { SEED } from '../seed.js';
import { colebrookByLambertW, expectRel } from './helpers.js';

// Every friction test pins which factor it expects: all values below are Darcy f_D unless the
// name says Fanning (check-values.md, preamble: f_F = f_D/4).

describe('correlationAt(COLEBROOK): solved values, check-values.md 1.2 (40-digit solutions [C])', () => {
  // Tolerance rel 1e-9: the values are printed to 12 significant digits, and check-values.md 1.2
  // asks rel 1e-9 of a tool that solves Colebrook to 1e-12.
  const table: [number, number, number, string][] = [
    [4000, 0, 0.0399070140556, '[C]'],
    [10000, 0, 0.0308829503535, '[C]; Lambert-W closed form 0.030882950353 [C]'],
    [1e5, 0, 0.0179897730843, '[C]'],
    [1e5, 1e-4, 0.0185138660775, '[C]; [S] fluids docstring Colebrook(1E5, 1E-4) = 0.018513866077471'],
    [1e5, 1e-3, 0.0221745359445, '[C]'],
    [1e5, 1e-2, 0.0385035435273, '[C]'],
    [1e6, 0, 0.011645040998, '[C]'],
    [1e6, 1e-4, 0.0134414376925, '[C]'],
    [1e6, 1e-3, 0.0199434658405, '[C]'],
    [1e7, 0, 0.00810266943087, '[C]; [S] fluids docstring Prandtl_von_Karman_Nikuradse(1E7) = 0.008102669430'],
    [1e7, 1e-4, 0.0121660809589, '[C]'],
    [1e8, 0, 0.00594046635164, '[C]'],
    [4000, 1e-3, 0.0409103898628, '[C]'],
    [4000, 5e-2, 0.0769868348892, '[C]'],
  ];
  for (const [re, rr, f, src] of table) {
    it(`Re = ${re}, eps/D = ${rr}: f_D = ${f} (${src})`, () => {
      expectRel(correlationAt(COLEBROOK, { Re: re, roughness: rr }), f, 1e-9);
    });
  }

  it('matches the fluids docstring value 0.018513866077471 at Re 1e5, eps/D 1e-4 to rel 1e-12 ([S], printed to 14 digits)', () => {
    expectRel(correlationAt(COLEBROOK, { Re: 1e5, roughness: 1e-4 }), 0.018513866077471, 1e-12);
  });

  it('fully rough limit: Colebrook at Re = 1e12 tends to von Karman, f_D(eps/D = 1e-4) = 0.011979797083255311 ([S] fluids docstring von_Karman(1E-4))', () => {
    expectRel(correlationAt(VON_KARMAN_ROUGH, { roughness: 1e-4 }), 0.011979797083255311, 1e-14);
    // At Re = 1e12 the viscous term 2.51/(Re sqrt f) is 2.3e-11 against 2.7e-5: a 1e-6 relative effect.
    expectRel(correlationAt(COLEBROOK, { Re: 1e12, roughness: 1e-4 }), 0.011979797083255311, 2e-6);
  });
});

describe('solveLogLaw: an independent route and the residual (issue 6: Colebrook to 1e-12 relative)', () => {
  it('agrees with the Lambert-W closed form to 1e-12 relative where that form is well conditioned (a/b < 100) (check-values.md 1.1 and 3.5)', () => {
    fc.assert(
      fc.property(fc.double({ min: 3, max: 8, noNaN: true }), fc.double({ min: -7, max: -1, noNaN: true }), (lgRe, lgRough) => {
        const re = 10 ** lgRe;
        const rr = 10 ** lgRough;
        fc.pre((rr / 3.7) / (2.51 / re) < 100);
        expectRel(correlationAt(COLEBROOK, { Re: re, roughness: rr }), colebrookByLambertW(re, rr), 1e-12);
      }),
      { seed: SEED, numRuns: 400 },
    );
  });

  it('smooth pipe: agrees with f = (ln10/2)^2 / W(ln10 Re/5.02)^2 (check-values.md 1.1, the explicit Lambert-W form of the 2.51 smooth law) to 1e-12', () => {
    for (const re of [4e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e10]) {
      expectRel(correlationAt(COLEBROOK, { Re: re, roughness: 0 }), colebrookByLambertW(re, 0), 1e-12, `Re ${re}`);
    }
  });

  it('leaves a residual of Colebrook below 1e-14 relative everywhere, including where the closed form overflows ((eps/D) Re up to 5e7)', () => {
    fc.assert(
      fc.property(fc.double({ min: 2, max: 10, noNaN: true }), fc.double({ min: -8, max: Math.log10(0.05), noNaN: true }), (lgRe, lgRough) => {
        const re = 10 ** lgRe;
        const rr = 10 ** lgRough;
        const f = correlationAt(COLEBROOK, { Re: re, roughness: rr });
        const x = 1 / Math.sqrt(f);
        // Colebrook (1939): 1/sqrt(f) + 2 log10((eps/D)/3.7 + 2.51/(Re sqrt f)) = 0.
        const residual = x + 2 * Math.log10(rr / 3.7 + 2.51 / (re * Math.sqrt(f)));
        expect(Math.abs(residual) / x).toBeLessThan(1e-14);
      }),
      { seed: SEED, numRuns: 500 },
    );
  });

  it('returns NaN where the law has no root: eps/D >= 3.7 gives a >= 1; Re <= 0; NaN input', () => {
    expect(solveLogLaw(2, 1, 1e-5)).toBeNaN();
    expect(correlationAt(COLEBROOK, { Re: 0, roughness: 0 })).toBeNaN();
    expect(correlationAt(COLEBROOK, { Re: NaN, roughness: 0 })).toBeNaN();
    expect(correlationAt(COLEBROOK, { Re: 1e5, roughness: -1e-3 })).toBeNaN();
  });
});

describe('explicit approximations, check-values.md 1.3 ("evaluate" tolerance rel 1e-9)', () => {
  const table: [number, number, number, number, number][] = [
    // Re, eps/D, Haaland, Swamee-Jain (5.74 printing), Churchill 1977: all [C]
    [1e5, 1e-4, 0.018265053, 0.0184524453, 0.0184626246],
    [1e5, 0, 0.0178249392, 0.0178625779, 0.0178748216],
    [1e5, 1e-3, 0.021966214, 0.0223424122, 0.0223432355],
    [1e5, 1e-2, 0.0385385059, 0.0387509318, 0.0387335575],
    [1e6, 1e-4, 0.0133261595, 0.0135077028, 0.0135082027],
    [1e7, 1e-4, 0.0121659465, 0.0122135637, 0.0122097379],
    [4000, 0, 0.0404228493, 0.0405514907, 0.040589733],
  ];
  for (const [re, rr, h, sj, ch] of table) {
    it(`Re = ${re}, eps/D = ${rr}: Haaland ${h}, Swamee-Jain ${sj}, Churchill ${ch} ([C]; printed to 9-10 digits, so rel 5e-9)`, () => {
      expectRel(correlationAt(HAALAND, { Re: re, roughness: rr }), h, 5e-9, 'Haaland');
      expectRel(correlationAt(SWAMEE_JAIN, { Re: re, roughness: rr }), sj, 5e-9, 'Swamee-Jain');
      expectRel(correlationAt(CHURCHILL_1977, { Re: re, roughness: rr }), ch, 5e-9, 'Churchill');
    });
  }

  it('Haaland(1e5, 1e-4) = 0.018265053014793857 and Churchill = 0.018462624566280075 ([S] fluids docstrings, 17 digits: rel 1e-14)', () => {
    expectRel(correlationAt(HAALAND, { Re: 1e5, roughness: 1e-4 }), 0.018265053014793857, 1e-14);
    expectRel(correlationAt(CHURCHILL_1977, { Re: 1e5, roughness: 1e-4 }), 0.018462624566280075, 1e-14);
  });

  it('Swamee-Jain: the pinned 5.74/Re^0.9 printing is 1.1e-6 from the (6.97/Re)^0.9 printing of the fluids docstring, 0.018452424431901808 ([S]; check-values.md 1.1)', () => {
    const ours = correlationAt(SWAMEE_JAIN, { Re: 1e5, roughness: 1e-4 });
    const rel = Math.abs(ours / 0.018452424431901808 - 1);
    // check-values.md 1.1: "1.1e-6 at Re 1e5, eps/D 1e-4"; 6.97^0.9 = 5.7385 rather than 5.74.
    expect(rel).toBeGreaterThan(0.9e-6);
    expect(rel).toBeLessThan(1.3e-6);
  });

  it('Churchill in other regimes: f(1000, 1e-4) = 0.064 = 64/Re to 1e-12, f(3000, 1e-4) = 0.0430489926 ([C]; [S] web-e4k example page 0.064, 0.043049)', () => {
    expectRel(correlationAt(CHURCHILL_1977, { Re: 1000, roughness: 1e-4 }), 0.064, 1e-12);
    expectRel(correlationAt(CHURCHILL_1977, { Re: 3000, roughness: 1e-4 }), 0.0430489926, 5e-9);
    // web-e4k lists f(1e5, 1e-2) = 0.0387336 (7 digits).
    expectRel(correlationAt(CHURCHILL_1977, { Re: 1e5, roughness: 1e-2 }), 0.0387336, 1.5e-6);
  });
});

describe('smooth-pipe laws side by side, check-values.md 1.4 ([C], printed to 7 significant digits: rel 1e-6)', () => {
  const table: [number, number, number, number, number | null][] = [
    // Re, Colebrook eps=0, Prandtl-Karman (-0.8), McKeon 2005, Blasius
    [4000, 0.03990701, 0.03991588, 0.03911049, 0.03978519],
    [10000, 0.03088295, 0.0308891, 0.03055242, 0.03164],
    [30000, 0.02348295, 0.0234871, 0.02344491, 0.0240412],
    [100000, 0.01798977, 0.01799259, 0.01810561, 0.01779248],
    [300000, 0.01446303, 0.01446509, 0.01464371, 0.01351936],
    [1e6, 0.01164504, 0.01164654, 0.01185512, null],
    [1e7, 0.00810267, 0.00810355, 0.0083162, null],
    [35540000, 0.00679183, 0.00679251, 0.00699549, null],
  ];
  for (const [re, col, pk, mck, bl] of table) {
    it(`Re = ${re}: Colebrook ${col}, Prandtl-Karman ${pk}, McKeon ${mck}${bl === null ? '' : `, Blasius ${bl}`}`, () => {
      // 8 significant digits printed as 7 after the leading zeros: half a unit is at most 1.5e-7 of 0.0034; use 1e-6.
      expectRel(correlationAt(COLEBROOK, { Re: re, roughness: 0 }), col, 1e-6, 'Colebrook');
      expectRel(correlationAt(PRANDTL_KARMAN, { Re: re }), pk, 1e-6, 'Prandtl-Karman');
      expectRel(correlationAt(MCKEON_2005, { Re: re }), mck, 1e-6, 'McKeon');
      if (bl !== null) expectRel(correlationAt(BLASIUS, { Re: re }), bl, 1e-6, 'Blasius');
    });
  }

  it('Blasius(1e4) = 0.03164 exactly ([S] fluids docstring)', () => {
    expectRel(correlationAt(BLASIUS, { Re: 1e4 }), 0.03164, 1e-15);
  });

  it('Hagen-Poiseuille: f_D = 64/2000 = 0.032 exactly (check-values.md 1.2, laminar row)', () => {
    expect(correlationAt(HAGEN_POISEUILLE, { Re: 2000 })).toBe(0.032);
  });

  it('Prandtl-Karman (-0.8) and the Colebrook smooth limit (2 log10 2.51 = 0.79935) differ by at most 0.03 % (check-values.md 1.1 and 1.4)', () => {
    for (const re of [4e3, 1e4, 1e5, 1e6, 1e7, 1e8]) {
      const d = correlationAt(PRANDTL_KARMAN, { Re: re }) / correlationAt(COLEBROOK, { Re: re, roughness: 0 }) - 1;
      expect(d).toBeGreaterThan(0);
      expect(d).toBeLessThan(3e-4);
    }
  });
});

describe('Fanning variants: f_F = f_D/4 under their own ids (check-values.md preamble and 6.3)', () => {
  it('colebrook-fanning(1e5, 1e-4) = 0.0185138660775/4 = 0.004628466519375 ([C] of 1.2 divided by 4)', () => {
    expectRel(correlationAt(findCorrelation('colebrook-fanning'), { Re: 1e5, roughness: 1e-4 }), 0.0185138660775 / 4, 1e-9);
  });
  it('hagen-poiseuille-fanning is 16/Re: 0.008 at Re = 2000 (Fanning form of Hagen-Poiseuille, common practice)', () => {
    expect(correlationAt(findCorrelation('hagen-poiseuille-fanning'), { Re: 2000 })).toBe(0.008);
  });
  it('every Darcy form has a -fanning twin returning f_F, and no other family has one', () => {
    const darcy = ['hagen-poiseuille', 'blasius', 'colebrook', 'haaland', 'swamee-jain', 'churchill-1977', 'prandtl-karman', 'von-karman-rough', 'mckeon-2005'];
    for (const id of darcy) {
      expect(findCorrelation(id).returns.symbol).toBe('f_D');
      expect(findCorrelation(`${id}-fanning`).returns.symbol).toBe('f_F');
    }
    expect(() => findCorrelation('stokes-fanning')).toThrow(/not a handbook correlation/);
  });
});
