import { frictionFromLogLaw } from './log-law.js';
import type { Correlation, CorrelationInput, ReturnedQuantity } from './types.js';

/**
 * Pipe friction factors, all returning the Darcy factor f_D = dp*D/(L*rho*U^2/2). The Fanning
 * variants (f_F = f_D/4) are made from these in fanning.ts under their own explicit ids.
 *
 * Formulas as in check-values.md section 1.1, which names the printing each comes from; each
 * entry's `source` is the original publication. Citations marked "from memory" in a comment were
 * not seen in a stored copy.
 */

const DARCY: ReturnedQuantity = { symbol: 'f_D', name: 'Darcy friction factor f_D = dp*D/(L*rho*U^2/2)' };

const RE: CorrelationInput = { name: 'Re', meaning: 'Reynolds number rho*U*D/mu, with U the mean velocity and D the inner diameter' };
const ROUGHNESS: CorrelationInput = {
  name: 'roughness',
  meaning: 'relative roughness eps/D, equivalent sand-grain roughness over inner diameter (0 for a smooth pipe)',
};

/** Moody (1944), Trans. ASME 66:671-684: the chart that spans Colebrook's turbulent range (citation from memory). */
const MOODY_RANGE = 'Moody (1944), Trans. ASME 66:671-684: extent of the friction-factor chart (turbulent part)';

const TEN_TO_0_4 = Math.pow(10, 0.4);
const MCKEON_B = Math.pow(10, 0.537 / 1.93);

/** Re > 0 and 0 <= eps/D < 3.7, else NaN (the forms below have no meaning there). */
function roughArgs(x: readonly number[]): [number, number] | null {
  const re = x[0] ?? NaN;
  const rr = x[1] ?? NaN;
  return re > 0 && rr >= 0 && rr < 3.7 ? [re, rr] : null;
}

export const HAGEN_POISEUILLE: Correlation = {
  id: 'hagen-poiseuille',
  title: 'Hagen-Poiseuille laminar flow',
  family: 'pipe-friction',
  returns: DARCY,
  inputs: [RE],
  equation: { left: 'f_D', right: '64/Re' },
  words: 'sixty-four over the Reynolds number (exact for fully developed laminar flow in a circular tube)',
  // Hagen (1839), Poiseuille (1840): citations from memory; the form f = 64/Re is in every text.
  source: 'Hagen (1839), Ann. Phys. Chem. 46:423-442; Poiseuille (1840), C. R. Acad. Sci. 11:961-967, 1041-1048',
  range: [
    {
      input: 'Re',
      max: 2300,
      source: 'common practice (laminar-turbulent transition taken at Re = 2300); Avila et al. (2011), Science 333:192-196, put the onset of sustained turbulence at Re = 2040 +- 10',
    },
  ],
  rangeNote: 'Fully developed flow only: the entrance length (about 0.05*Re*D) adds pressure drop that 64/Re does not contain.',
  powerLaw: { Re: -1 },
  // Hagen-Poiseuille: f_D = 64/Re.
  value: (x) => {
    const re = x[0] ?? NaN;
    return re > 0 ? 64 / re : NaN;
  },
};

export const BLASIUS: Correlation = {
  id: 'blasius',
  title: 'Blasius smooth-pipe power law',
  family: 'pipe-friction',
  returns: DARCY,
  inputs: [RE],
  equation: { left: 'f_D', right: '0.3164*Re^(-0.25)' },
  words: '0.3164 times the Reynolds number to the power -1/4 (smooth pipe)',
  // Blasius (1913), Forschungsheft VDI 131 (citation from memory; formula as in check-values.md 1.1).
  source: 'Blasius (1913), Mitt. Forschungsarb. Ingenieurwes. (Forschungsheft VDI) 131:1-41',
  range: [
    {
      input: 'Re',
      min: 3000,
      max: 1e5,
      source: 'Re <= 1e5 as textbooks quote Blasius (1913), some give 2e5; Re >= 3000 as the ChEDL fluids library lists it (citing Hager 2003)',
    },
  ],
  rangeNote: 'Smooth pipes only: the form has no roughness term.',
  powerLaw: { Re: -0.25 },
  // Blasius (1913): f_D = 0.3164 Re^-0.25.
  value: (x) => {
    const re = x[0] ?? NaN;
    return re > 0 ? 0.3164 * Math.pow(re, -0.25) : NaN;
  },
};

export const COLEBROOK: Correlation = {
  id: 'colebrook',
  title: 'Colebrook-White turbulent pipe flow',
  family: 'pipe-friction',
  returns: DARCY,
  inputs: [RE, ROUGHNESS],
  equation: { left: '1/sqrt(f_D)', right: '-2*log10(roughness/3.7 + 2.51/(Re*sqrt(f_D)))' },
  words:
    'one over the root of f equals minus twice the decimal logarithm of (relative roughness over 3.7 plus 2.51 over (Re times the root of f)); implicit in f',
  // Colebrook (1939), J. Inst. Civ. Eng. 11(4):133-156, eq. (10); form as in Clamond (2009) eq. (1).
  source: 'Colebrook (1939), J. Inst. Civ. Eng. 11(4):133-156, eq. (10)',
  range: [
    { input: 'Re', min: 4000, max: 1e8, source: MOODY_RANGE },
    { input: 'roughness', min: 0, max: 0.05, source: MOODY_RANGE },
  ],
  rangeNote: 'Turbulent flow from smooth to fully rough; the reference for every explicit form below.',
  method:
    'Solved for 1/sqrt(f) by Newton steps on an increasing concave function (monotone, quadratic convergence) to the rounding level of a double (1e-15 relative); the Lambert-W closed form is not used because it overflows for (eps/D)*Re above about 5700.',
  // Colebrook (1939): 1/sqrt(f) = -2 log10((eps/D)/3.7 + 2.51/(Re sqrt(f))).
  value: (x) => {
    const r = roughArgs(x);
    return r === null ? NaN : frictionFromLogLaw(2, r[1] / 3.7, 2.51 / r[0]);
  },
};

export const HAALAND: Correlation = {
  id: 'haaland',
  title: 'Haaland explicit approximation to Colebrook',
  family: 'pipe-friction',
  returns: DARCY,
  inputs: [RE, ROUGHNESS],
  equation: { left: '1/sqrt(f_D)', right: '-1.8*log10((roughness/3.7)^1.11 + 6.9/Re)' },
  words: 'one over the root of f equals -1.8 times the decimal logarithm of ((relative roughness/3.7)^1.11 + 6.9/Re)',
  // Haaland (1983), J. Fluids Eng. 105(1):89-90, eq. (7) (equation number from memory).
  source: 'Haaland (1983), J. Fluids Eng. 105(1):89-90',
  range: [
    { input: 'Re', min: 4000, max: 1e8, source: 'Winning & Coole (2013), Flow Turbul. Combust. 90:1-27, range listed for Haaland (1983)' },
    { input: 'roughness', min: 0, max: 0.05, source: 'Winning & Coole (2013), lower end 1e-6 of their grid taken down to the smooth limit 0' },
  ],
  accuracy: 'Haaland claims +-1.5 % against Colebrook; measured here over a 200 x 200 log grid of its range: at most 1.42 %.',
  // Haaland (1983): 1/sqrt(f) = -1.8 log10(((eps/D)/3.7)^1.11 + 6.9/Re).
  value: (x) => {
    const r = roughArgs(x);
    if (r === null) return NaN;
    const inv = -1.8 * Math.log10(Math.pow(r[1] / 3.7, 1.11) + 6.9 / r[0]);
    return 1 / (inv * inv);
  },
};

export const SWAMEE_JAIN: Correlation = {
  id: 'swamee-jain',
  title: 'Swamee-Jain explicit approximation to Colebrook',
  family: 'pipe-friction',
  returns: DARCY,
  inputs: [RE, ROUGHNESS],
  equation: { left: 'f_D', right: '0.25/(log10(roughness/3.7 + 5.74/Re^0.9))^2' },
  words: '0.25 over the square of the decimal logarithm of (relative roughness/3.7 + 5.74/Re^0.9)',
  // Swamee & Jain (1976), J. Hydraul. Div. ASCE 102(5):657-664, eq. (12) (equation number from memory).
  source: 'Swamee & Jain (1976), J. Hydraul. Div. ASCE 102(5):657-664',
  range: [
    { input: 'Re', min: 5000, max: 1e8, source: 'Swamee & Jain (1976), as usually quoted' },
    { input: 'roughness', min: 0, max: 0.01, source: 'Swamee & Jain (1976), as usually quoted (1e-6 to 1e-2; taken down to the smooth limit 0)' },
  ],
  method: 'Pinned printing: 5.74/Re^0.9. The other printing, (6.97/Re)^0.9 = 5.7385/Re^0.9, differs by at most about 1e-4 relative.',
  accuracy:
    'Commonly quoted as within 1 % of Colebrook; that is not met at the low-Re, high-roughness corner: measured here 2.83 % at Re = 5000, eps/D = 0.01, and still 1.6 % for Re >= 2e4.',
  // Swamee & Jain (1976): f = 0.25 / [log10((eps/D)/3.7 + 5.74/Re^0.9)]^2.
  value: (x) => {
    const r = roughArgs(x);
    if (r === null) return NaN;
    const l = Math.log10(r[1] / 3.7 + 5.74 / Math.pow(r[0], 0.9));
    return 0.25 / (l * l);
  },
};

export const CHURCHILL_1977: Correlation = {
  id: 'churchill-1977',
  title: 'Churchill all-regime friction factor',
  family: 'pipe-friction',
  returns: DARCY,
  inputs: [RE, ROUGHNESS],
  equation: {
    left: 'f_D',
    right: '8*((8/Re)^12 + ((-2.457*ln((7/Re)^0.9 + 0.27*roughness))^16 + (37530/Re)^16)^(-1.5))^(1/12)',
  },
  words:
    '8 times [(8/Re)^12 + (A + B)^-1.5]^(1/12), with A = (-2.457 ln((7/Re)^0.9 + 0.27 eps/D))^16 and B = (37530/Re)^16: laminar, transition and turbulent in one form',
  // Churchill (1977), Chem. Eng. 84(24):91-92 (not Chem. Eng. J.; check-values.md 6.5).
  source: 'Churchill (1977), Chem. Eng. 84(24):91-92',
  range: [],
  rangeNote: 'Churchill states no range: the form joins 64/Re, the transition and Colebrook. In the transition (2100 < Re < 4000) any value is an interpolation.',
  accuracy: 'Measured here against Colebrook: at most 2.1 % for 1e4 <= Re <= 1e8, 1e-6 <= eps/D <= 1e-2, up to 3.2 % near Re = 4000; 64/Re to 1e-12 in laminar flow.',
  // Churchill (1977): f = 8[(8/Re)^12 + (A+B)^-1.5]^(1/12), A = [-2.457 ln((7/Re)^0.9 + 0.27 eps/D)]^16, B = (37530/Re)^16.
  value: (x) => {
    const r = roughArgs(x);
    if (r === null) return NaN;
    const [re, rr] = r;
    const a = Math.pow(-2.457 * Math.log(Math.pow(7 / re, 0.9) + 0.27 * rr), 16);
    const b = Math.pow(37530 / re, 16);
    return 8 * Math.pow(Math.pow(8 / re, 12) + Math.pow(a + b, -1.5), 1 / 12);
  },
};

export const PRANDTL_KARMAN: Correlation = {
  id: 'prandtl-karman',
  title: 'Prandtl-Karman smooth-pipe law',
  family: 'pipe-friction',
  returns: DARCY,
  inputs: [RE],
  equation: { left: '1/sqrt(f_D)', right: '2*log10(Re*sqrt(f_D)) - 0.8' },
  words: 'one over the root of f equals twice the decimal logarithm of (Re times the root of f), minus 0.8; implicit in f',
  // Prandtl (1935) with the constants fitted to Nikuradse (1932), VDI-Forschungsheft 356 (citation from memory).
  source: 'Prandtl (1935), in Durand (ed.), Aerodynamic Theory III; constants from Nikuradse (1932), VDI-Forschungsheft 356',
  range: [{ input: 'Re', min: 4000, source: 'common practice (turbulent flow); no upper bound stated' }],
  rangeNote: 'Smooth pipes. The smooth limit of Colebrook (roughness 0) is the same law with the constant 2 log10(2.51) = 0.79935 instead of 0.8.',
  method: 'Solved like Colebrook (same Newton iteration, A = 2, a = 0, b = 10^0.4/Re).',
  accuracy: 'Princeton Superpipe data (McKeon et al. 2004) sit 2 to 4 % above it for Re above 1e6.',
  // Prandtl-Karman: 1/sqrt(f) = 2 log10(Re sqrt(f)) - 0.8, i.e. x = -2 log10(10^0.4 x / Re).
  value: (x) => {
    const re = x[0] ?? NaN;
    return re > 0 ? frictionFromLogLaw(2, 0, TEN_TO_0_4 / re) : NaN;
  },
};

export const VON_KARMAN_ROUGH: Correlation = {
  id: 'von-karman-rough',
  title: 'von Karman fully rough limit',
  family: 'pipe-friction',
  returns: DARCY,
  inputs: [ROUGHNESS],
  equation: { left: '1/sqrt(f_D)', right: '-2*log10(roughness/3.7)' },
  words: 'one over the root of f equals minus twice the decimal logarithm of (relative roughness over 3.7); independent of Re',
  // von Karman (1930), Nachr. Ges. Wiss. Goettingen 58-76; Nikuradse (1933) rough-pipe data (citations from memory).
  source: 'von Karman (1930), Nachr. Ges. Wiss. Goettingen, Math.-Phys. Kl. 58-76; the Re -> infinity limit of Colebrook (1939)',
  range: [{ input: 'roughness', min: 1e-6, max: 0.05, source: MOODY_RANGE }],
  rangeNote: 'Only where the flow is fully rough (roughness Reynolds number Re*(eps/D)*sqrt(f/8) above about 70); it ignores Re.',
  // von Karman fully rough: 1/sqrt(f) = -2 log10((eps/D)/3.7).
  value: (x) => {
    const rr = x[0] ?? NaN;
    if (!(rr > 0 && rr < 3.7)) return NaN;
    const inv = -2 * Math.log10(rr / 3.7);
    return 1 / (inv * inv);
  },
};

export const MCKEON_2005: Correlation = {
  id: 'mckeon-2005',
  title: 'McKeon et al. smooth-pipe law (Princeton Superpipe)',
  family: 'pipe-friction',
  returns: DARCY,
  inputs: [RE],
  equation: { left: '1/sqrt(f_D)', right: '1.930*log10(Re*sqrt(f_D)) - 0.537' },
  words: 'one over the root of f equals 1.930 times the decimal logarithm of (Re times the root of f), minus 0.537; implicit in f',
  // McKeon, Zagarola & Smits (2005), J. Fluid Mech. 538:429-443, eq. (10) (constants from memory, corroborated
  // against the Princeton data: check-values.md 1.1).
  source: 'McKeon, Zagarola & Smits (2005), J. Fluid Mech. 538:429-443',
  range: [
    {
      input: 'Re',
      min: 3e5,
      max: 3.6e7,
      source: 'McKeon et al. (2005): fitted to the Superpipe data, Re 3e5 to 3.6e7',
    },
  ],
  rangeNote: 'Smooth pipes at high Re; below 3e5 it departs from Prandtl-Karman by up to 2 %.',
  method: 'Solved like Colebrook (same Newton iteration, A = 1.930, a = 0, b = 10^(0.537/1.930)/Re).',
  // McKeon et al. (2005): 1/sqrt(f) = 1.930 log10(Re sqrt(f)) - 0.537.
  value: (x) => {
    const re = x[0] ?? NaN;
    return re > 0 ? frictionFromLogLaw(1.93, 0, MCKEON_B / re) : NaN;
  },
};

/** The Darcy friction-factor forms, in the order they are listed. */
export const DARCY_CORRELATIONS: readonly Correlation[] = [
  HAGEN_POISEUILLE,
  BLASIUS,
  COLEBROOK,
  HAALAND,
  SWAMEE_JAIN,
  CHURCHILL_1977,
  PRANDTL_KARMAN,
  VON_KARMAN_ROUGH,
  MCKEON_2005,
];
