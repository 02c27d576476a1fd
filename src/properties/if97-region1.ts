/**
 * IAPWS-IF97 region 1 (compressed liquid water): the dimensionless Gibbs free energy and the
 * properties derived from it, in SI units (T in K, p in Pa).
 *
 * Source: IAPWS, Revised Release on the IAPWS Industrial Formulation 1997 for the Thermodynamic
 * Properties of Water and Steam (IAPWS R7-97, 2012), section 5: eq. (7) for gamma, Table 2 for
 * the coefficients, Table 3 for the property relations, Table 4 for the derivatives of gamma.
 * The coefficients below were checked against a stored open implementation (R package
 * `pipenostics`, `R/if97vtp1.R`, "Region 1. Table 2").
 *
 * Range of the release: 273.15 K <= T <= 623.15 K and p_s(T) <= p <= 100 MPa.
 */

/** Specific gas constant of ordinary water used by IF97, J/(kg K) (IAPWS R7-97(2012), eq. 1). */
export const IF97_R_J_PER_KG_K = 461.526;
/** Reducing pressure of region 1, Pa (IAPWS R7-97(2012), eq. 7: p* = 16.53 MPa). */
const P_STAR_PA = 16.53e6;
/** Reducing temperature of region 1, K (IAPWS R7-97(2012), eq. 7: T* = 1386 K). */
const T_STAR_K = 1386;

// IAPWS R7-97(2012), Table 2: exponents I_i, J_i and coefficients n_i of eq. (7), i = 1..34.
const I = [0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8, 21, 23, 29, 30, 31, 32];
const J = [-2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10, -8, -11, -6, -29, -31, -38, -39, -40, -41];
const N = [
  0.14632971213167, -0.84548187169114, -0.3756360367204e1, 0.33855169168385e1, -0.95791963387872, 0.15772038513228,
  -0.16616417199501e-1, 0.81214629983568e-3, 0.28319080123804e-3, -0.60706301565874e-3, -0.18990068218419e-1,
  -0.32529748770505e-1, -0.21841717175414e-1, -0.5283835796993e-4, -0.47184321073267e-3, -0.30001780793026e-3,
  0.47661393906987e-4, -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4, -0.28270797985312e-5,
  -0.85205128120103e-9, -0.22425281908e-5, -0.65171222895601e-6, -0.14341729937924e-12, -0.40516996860117e-6,
  -0.12734301741641e-8, -0.17424871230634e-9, -0.68762131295531e-18, 0.14478307828521e-19, 0.26335781662795e-22,
  -0.11947622640071e-22, 0.18228094581404e-23, -0.93537087292458e-25,
];

/** gamma and its first and second derivatives at one state (IAPWS R7-97(2012), Table 4). */
export interface Region1Gibbs {
  /** Reduced pressure pi = p/p* and inverse reduced temperature tau = T* / T. */
  readonly pi: number;
  readonly tau: number;
  readonly gamma: number;
  readonly gammaPi: number;
  readonly gammaPiPi: number;
  readonly gammaTau: number;
  readonly gammaTauTau: number;
  readonly gammaPiTau: number;
}

// Scratch power tables, filled by fillPowers for one (a, b) at a time: a^0..a^32, b^0..b^17 and
// b^-0..b^-41 by repeated multiplication (about 90 products instead of 68 calls of Math.pow;
// the rounding error grows by at most ~41 ulps, far below the 9 digits of the check values).
const A_POW = new Float64Array(33);
const B_POS = new Float64Array(18);
const B_NEG = new Float64Array(42);

function fillPowers(a: number, b: number): void {
  A_POW[0] = 1;
  for (let k = 1; k < A_POW.length; k++) A_POW[k] = A_POW[k - 1]! * a;
  B_POS[0] = 1;
  for (let k = 1; k < B_POS.length; k++) B_POS[k] = B_POS[k - 1]! * b;
  const inv = 1 / b;
  B_NEG[0] = 1;
  for (let k = 1; k < B_NEG.length; k++) B_NEG[k] = B_NEG[k - 1]! * inv;
}

const bPow = (j: number): number => (j >= 0 ? B_POS[j]! : B_NEG[-j]!);

/**
 * The dimensionless Gibbs free energy of region 1 and its derivatives (IAPWS R7-97(2012),
 * eq. 7 and Table 4). No range check: callers check the state first.
 * @example region1Gibbs(300, 3e6).gammaPi // => 0.119643... (v = R T gammaPi / p* = 1.00215168e-3 m^3/kg)
 */
export function region1Gibbs(temperatureK: number, pressurePa: number): Region1Gibbs {
  const pi = pressurePa / P_STAR_PA;
  const tau = T_STAR_K / temperatureK;
  const a = 7.1 - pi;
  const b = tau - 1.222;
  fillPowers(a, b);
  let gamma = 0;
  let gammaPi = 0;
  let gammaPiPi = 0;
  let gammaTau = 0;
  let gammaTauTau = 0;
  let gammaPiTau = 0;
  for (let k = 0; k < N.length; k++) {
    const i = I[k]!;
    const j = J[k]!;
    // term = n a^i b^j; its derivatives divide by a and b (a >= 1.05 and b >= 1.0 in region 1).
    const term = N[k]! * A_POW[i]! * bPow(j);
    gamma += term;
    gammaPi -= (i * term) / a;
    gammaPiPi += (i * (i - 1) * term) / (a * a);
    gammaTau += (j * term) / b;
    gammaTauTau += (j * (j - 1) * term) / (b * b);
    gammaPiTau -= (i * j * term) / (a * b);
  }
  return { pi, tau, gamma, gammaPi, gammaPiPi, gammaTau, gammaTauTau, gammaPiTau };
}

/**
 * gamma_pi alone (the hot path of density): IAPWS R7-97(2012), Table 4.
 * @example region1GammaPi(300, 3e6) // => 0.119643... (see region1Gibbs)
 */
function region1GammaPi(temperatureK: number, pressurePa: number): number {
  const a = 7.1 - pressurePa / P_STAR_PA;
  const b = T_STAR_K / temperatureK - 1.222;
  fillPowers(a, b);
  let sum = 0;
  for (let k = 8; k < N.length; k++) {
    // Terms 1-8 have I = 0 and do not contribute to gamma_pi.
    const i = I[k]!;
    sum -= N[k]! * i * A_POW[i - 1]! * bPow(J[k]!);
  }
  return sum;
}

/**
 * Specific volume of region 1, m^3/kg: v = R T gamma_pi / p* (IAPWS R7-97(2012), Table 3).
 * No range check.
 * @example region1SpecificVolume(300, 3e6) // => 1.00215168e-3 (IF97 Table 5)
 */
export function region1SpecificVolume(temperatureK: number, pressurePa: number): number {
  return (IF97_R_J_PER_KG_K * temperatureK * region1GammaPi(temperatureK, pressurePa)) / P_STAR_PA;
}

/**
 * Density of region 1, kg/m^3 (1/v). No range check.
 * @example region1Density(293.15, 101325) // => 998.2061 (check-values.md 3.2)
 */
export function region1Density(temperatureK: number, pressurePa: number): number {
  return 1 / region1SpecificVolume(temperatureK, pressurePa);
}

/** Density and its partial derivatives, from one evaluation of gamma. */
export interface DensityWithDerivatives {
  readonly densityKgPerM3: number;
  /** (d rho / d T) at constant p, kg/(m^3 K). */
  readonly dDensityDTemperature: number;
  /** (d rho / d p) at constant T, kg/(m^3 Pa) = s^2/m^2. */
  readonly dDensityDPressure: number;
}

/**
 * Density with its exact partial derivatives: with v = (R/p*) T gamma_pi(pi, tau), tau = T* / T,
 * (dv/dT)_p = (R/p*)(gamma_pi - tau gamma_pitau) and (dv/dp)_T = R T gamma_pipi / p*^2
 * (differentiating the relations of IAPWS R7-97(2012), Table 3); d rho = -rho^2 dv. No range check.
 * @example region1DensityWithDerivatives(293.15, 101325).dDensityDTemperature // => -0.20624 kg/(m^3 K)
 */
export function region1DensityWithDerivatives(temperatureK: number, pressurePa: number): DensityWithDerivatives {
  const g = region1Gibbs(temperatureK, pressurePa);
  const v = (IF97_R_J_PER_KG_K * temperatureK * g.gammaPi) / P_STAR_PA;
  const dvdT = (IF97_R_J_PER_KG_K * (g.gammaPi - g.tau * g.gammaPiTau)) / P_STAR_PA;
  const dvdp = (IF97_R_J_PER_KG_K * temperatureK * g.gammaPiPi) / (P_STAR_PA * P_STAR_PA);
  const rho = 1 / v;
  return { densityKgPerM3: rho, dDensityDTemperature: -rho * rho * dvdT, dDensityDPressure: -rho * rho * dvdp };
}

/** The caloric and acoustic properties of IAPWS R7-97(2012), Table 3, in SI units. */
export interface Region1State {
  readonly specificVolumeM3PerKg: number;
  readonly enthalpyJPerKg: number;
  readonly internalEnergyJPerKg: number;
  readonly entropyJPerKgK: number;
  readonly isobaricHeatCapacityJPerKgK: number;
  readonly speedOfSoundMPerS: number;
}

/**
 * All Table 3 properties of region 1 at (T, p). No range check. Used to verify the
 * implementation against the release's Table 5 (v, h, u, s, cp, w).
 * @example region1State(300, 3e6).enthalpyJPerKg // => 115331.273 (IF97 Table 5: 0.115331273e3 kJ/kg)
 */
export function region1State(temperatureK: number, pressurePa: number): Region1State {
  const g = region1Gibbs(temperatureK, pressurePa);
  const rt = IF97_R_J_PER_KG_K * temperatureK;
  const { pi, tau } = g;
  const cpOverR = -tau * tau * g.gammaTauTau;
  const x = g.gammaPi - tau * g.gammaPiTau;
  const w2 = (rt * g.gammaPi * g.gammaPi) / ((x * x) / (tau * tau * g.gammaTauTau) - g.gammaPiPi);
  return {
    specificVolumeM3PerKg: (rt * g.gammaPi) / P_STAR_PA,
    enthalpyJPerKg: rt * tau * g.gammaTau,
    internalEnergyJPerKg: rt * (tau * g.gammaTau - pi * g.gammaPi),
    entropyJPerKgK: IF97_R_J_PER_KG_K * (tau * g.gammaTau - g.gamma),
    isobaricHeatCapacityJPerKgK: IF97_R_J_PER_KG_K * cpOverR,
    speedOfSoundMPerS: Math.sqrt(w2),
  };
}
