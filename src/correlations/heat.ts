import type { Correlation, CorrelationInput, ReturnedQuantity } from './types.js';

/**
 * Turbulent forced convection in a circular tube, returning the Nusselt number Nu = h*D/k, so that
 * a heated-section rig runs through the same reduce / fit / compare workflow as a friction rig.
 * Formulas and stated ranges as printed in Rohsenow, Hartnett & Cho (1998), Handbook of Heat
 * Transfer, 3rd ed., McGraw-Hill, and carried in the docstrings of the open ChEDL `ht` library
 * (`ht/conv_internal.py`), where the worked values used in the tests were seen.
 */

const NU: ReturnedQuantity = { symbol: 'Nu', name: 'Nusselt number h*D/k, with h the mean heat transfer coefficient' };
const RE: CorrelationInput = { name: 'Re', meaning: 'Reynolds number rho*U*D/mu at the bulk temperature' };
const PR: CorrelationInput = { name: 'Pr', meaning: 'Prandtl number cp*mu/k at the bulk temperature' };
const ROHSENOW = 'Rohsenow, Hartnett & Cho (1998), Handbook of Heat Transfer, 3rd ed.';

/** Re > 0 and Pr > 0, else null. */
function rePr(x: readonly number[]): [number, number] | null {
  const re = x[0] ?? NaN;
  const pr = x[1] ?? NaN;
  return re > 0 && pr > 0 ? [re, pr] : null;
}

function dittusBoelter(id: string, exponent: number, which: string): Correlation {
  return {
    id,
    title: `Dittus-Boelter, fluid being ${which}`,
    family: 'heat-transfer',
    returns: NU,
    inputs: [RE, PR],
    equation: { left: 'Nu', right: `0.023*Re^0.8*Pr^${exponent}` },
    words: `0.023 times Re^0.8 times Pr^${exponent} (fluid being ${which})`,
    // Dittus & Boelter (1930), Univ. Calif. Publ. Eng. 2(13):443-461, reprinted in Int. Commun. Heat Mass
    // Transf. 12 (1985) 3-22; coefficient 0.023 as revised by McAdams (original 0.0243 heating, 0.0265 cooling).
    source: 'Dittus & Boelter (1930), Univ. Calif. Publ. Eng. 2(13):443-461 (reprint: Int. Commun. Heat Mass Transf. 12 (1985) 3-22); coefficient 0.023 as revised by McAdams',
    range: [
      { input: 'Re', min: 1e4, source: ROHSENOW },
      { input: 'Pr', min: 0.6, max: 160, source: ROHSENOW },
    ],
    rangeNote: 'Fully developed flow (L/D >= 10) and moderate wall-to-bulk temperature differences.',
    accuracy: 'Errors up to about 25 % are usual (Incropera & DeWitt, Fundamentals of Heat and Mass Transfer; from memory).',
    powerLaw: { Re: 0.8, Pr: exponent },
    // Dittus-Boelter (McAdams coefficient): Nu = 0.023 Re^0.8 Pr^n, n = 0.4 heating, 0.3 cooling.
    value: (x) => {
      const r = rePr(x);
      return r === null ? NaN : 0.023 * Math.pow(r[0], 0.8) * Math.pow(r[1], exponent);
    },
  };
}

export const DITTUS_BOELTER = dittusBoelter('dittus-boelter', 0.4, 'heated');
export const DITTUS_BOELTER_COOLING = dittusBoelter('dittus-boelter-cooling', 0.3, 'cooled');

export const SIEDER_TATE: Correlation = {
  id: 'sieder-tate',
  title: 'Sieder-Tate, with wall viscosity correction',
  family: 'heat-transfer',
  returns: NU,
  inputs: [
    RE,
    PR,
    {
      name: 'viscosityRatio',
      meaning: 'bulk over wall viscosity mu_b/mu_w',
      default: { formula: '1', words: '1 (no wall correction)' },
    },
  ],
  equation: { left: 'Nu', right: '0.027*Re^0.8*Pr^(1/3)*viscosityRatio^0.14' },
  words: '0.027 times Re^0.8 times the cube root of Pr times (bulk/wall viscosity)^0.14',
  // Sieder & Tate (1936), Ind. Eng. Chem. 28(12):1429-1435 (form as in Rohsenow et al. 1998; some texts print 0.023).
  source: 'Sieder & Tate (1936), Ind. Eng. Chem. 28(12):1429-1435',
  range: [
    { input: 'Re', min: 1e4, source: 'Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, eq. 8.61 (from memory)' },
    { input: 'Pr', min: 0.7, max: 16700, source: 'Incropera & DeWitt, eq. 8.61 (from memory)' },
  ],
  rangeNote: 'Fully developed flow (L/D >= 10); for large property variations with temperature.',
  method: 'Pinned coefficient 0.027 (Rohsenow et al. 1998); some texts print 0.023, 15 % lower.',
  powerLaw: { Re: 0.8, Pr: 1 / 3, viscosityRatio: 0.14 },
  // Sieder & Tate (1936): Nu = 0.027 Re^0.8 Pr^(1/3) (mu_b/mu_w)^0.14.
  value: (x) => {
    const r = rePr(x);
    const ratio = Number.isNaN(x[2] ?? NaN) ? 1 : (x[2] as number);
    return r === null || !(ratio > 0) ? NaN : 0.027 * Math.pow(r[0], 0.8) * Math.cbrt(r[1]) * Math.pow(ratio, 0.14);
  },
};

export const GNIELINSKI: Correlation = {
  id: 'gnielinski',
  title: 'Gnielinski, transition and turbulent',
  family: 'heat-transfer',
  returns: NU,
  inputs: [
    RE,
    PR,
    {
      name: 'f_D',
      meaning: 'Darcy friction factor of the tube',
      default: {
        formula: '(1.82*log10(Re) - 1.64)^(-2)',
        words: 'the smooth-tube factor of Filonenko (1954), (1.82 log10 Re - 1.64)^-2, as Gnielinski recommends',
      },
    },
  ],
  equation: { left: 'Nu', right: '(f_D/8)*(Re - 1000)*Pr/(1 + 12.7*sqrt(f_D/8)*(Pr^(2/3) - 1))' },
  words: '(f/8)(Re - 1000) Pr over (1 + 12.7 sqrt(f/8)(Pr^(2/3) - 1)), with f the Darcy friction factor',
  // Gnielinski (1976), Int. Chem. Eng. 16:359-368.
  source: 'Gnielinski (1976), Int. Chem. Eng. 16:359-368',
  range: [
    { input: 'Re', min: 2300, max: 5e6, source: ROHSENOW },
    { input: 'Pr', min: 0.5, max: 2000, source: ROHSENOW },
  ],
  rangeNote: 'Fully developed flow. Some texts start it at Re = 3000 (Incropera & DeWitt, eq. 8.62).',
  // Gnielinski (1976): Nu = (f/8)(Re - 1000)Pr / (1 + 12.7 (f/8)^0.5 (Pr^(2/3) - 1));
  // Filonenko (1954) smooth tube, Teploenergetika 1(4):40-44 (citation from memory): f = (1.82 log10 Re - 1.64)^-2.
  value: (x) => {
    const r = rePr(x);
    if (r === null) return NaN;
    const [re, pr] = r;
    const given = x[2] ?? NaN;
    const l = 1.82 * Math.log10(re) - 1.64;
    const fD = Number.isNaN(given) ? 1 / (l * l) : given;
    if (!(fD > 0)) return NaN;
    const e = fD / 8;
    return (e * (re - 1000) * pr) / (1 + 12.7 * Math.sqrt(e) * (Math.pow(pr, 2 / 3) - 1));
  },
};

/** The heat-transfer correlations, in the order they are listed. */
export const HEAT_CORRELATIONS: readonly Correlation[] = [DITTUS_BOELTER, DITTUS_BOELTER_COOLING, SIEDER_TATE, GNIELINSKI];
