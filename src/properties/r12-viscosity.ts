/**
 * IAPWS R12-08: the 2008 formulation for the viscosity of ordinary water substance, as a function
 * of temperature and density, without the critical enhancement (mu_2 = 1).
 *
 * Source: IAPWS, Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary Water
 * Substance (R12-08), eq. (11) for mu_0 and eq. (12) for mu_1; coefficients H_i and H_ij as in
 * Huber et al., J. Phys. Chem. Ref. Data 38:101-125 (2009), Tables 2 and 3. The coefficients were checked
 * against two stored open implementations (R packages `rpmodel`, `R/calc_viscosity_h2o.R`, and
 * `pipenostics`, `R/r12dv.R`), which agree with each other.
 *
 * mu_2 = 1 is what the release recommends for industrial use; the critical enhancement matters
 * only close to the critical point (about 645.91 K < T < 650.77 K, from memory), far outside the
 * liquid range used here.
 */

/** Reference constants of R12-08, eq. (1)-(3): T* = 647.096 K, rho* = 322.0 kg/m^3, mu* = 1.00e-6 Pa s. */
const T_STAR_K = 647.096;
const RHO_STAR_KG_PER_M3 = 322.0;
const MU_STAR_PA_S = 1.0e-6;

// R12-08 eq. (11): H_0 .. H_3 (Huber et al. 2009, Table 2).
const H0 = [1.67752, 2.20462, 0.6366564, -0.241605];

// R12-08 eq. (12): H_ij (Huber et al. 2009, Table 3), i = 0..5 (powers of 1/Tbar - 1), j = 0..6 (powers of rhobar - 1).
const H: readonly (readonly number[])[] = [
  [0.520094, 0.222531, -0.281378, 0.161913, -0.0325372, 0, 0],
  [0.0850895, 0.999115, -0.906851, 0.257399, 0, 0, 0],
  [-1.08374, 1.88797, -0.772479, 0, 0, 0, 0],
  [-0.289555, 1.26613, -0.489837, 0, 0.0698452, 0, -0.00435673],
  [0, 0, -0.25704, 0, 0, 0.00872102, 0],
  [0, 0.120573, 0, 0, 0, 0, -0.000593264],
];

/** Viscosity with its partial derivatives with respect to temperature and density. */
export interface ViscosityWithDerivatives {
  readonly viscosityPaS: number;
  /** (d mu / d T) at constant density, Pa s / K. */
  readonly dViscosityDTemperature: number;
  /** (d mu / d rho) at constant temperature, Pa s m^3/kg. */
  readonly dViscosityDDensity: number;
}

/** mu_0 / (1 uPa s) = 100 sqrt(Tbar) / sum_i H_i Tbar^-i (R12-08 eq. 11), by Horner in 1/Tbar. */
function mu0(tBar: number): number {
  const r = 1 / tBar;
  return (100 * Math.sqrt(tBar)) / (H0[0]! + r * (H0[1]! + r * (H0[2]! + r * H0[3]!)));
}

/**
 * Dynamic viscosity of water, Pa s, from T in K and density in kg/m^3 (R12-08, eq. 2 with
 * mu_2 = 1). No range check (the release covers 273.15 K to 1173.15 K for the fluid states).
 * @example r12Viscosity(298.15, 998) // => 889.735100e-6 (R12-08 verification table, mu_2 = 1)
 */
export function r12Viscosity(temperatureK: number, densityKgPerM3: number): number {
  const tBar = temperatureK / T_STAR_K;
  const rhoBar = densityKgPerM3 / RHO_STAR_KG_PER_M3;
  const x = 1 / tBar - 1;
  const y = rhoBar - 1;
  // S = sum_i x^i sum_j H_ij y^j (R12-08 eq. 12), Horner in y inside, in x outside.
  let s = 0;
  for (let i = H.length - 1; i >= 0; i--) {
    const row = H[i]!;
    let inner = 0;
    for (let j = row.length - 1; j >= 0; j--) inner = inner * y + row[j]!;
    s = s * x + inner;
  }
  return mu0(tBar) * Math.exp(rhoBar * s) * MU_STAR_PA_S;
}

/**
 * Viscosity and its exact partial derivatives: ln mu = ln mu_0(Tbar) + rhobar * S(Tbar, rhobar),
 * S = sum_i sum_j H_ij (1/Tbar - 1)^i (rhobar - 1)^j (R12-08 eqs. 11-12), differentiated term by
 * term. No range check.
 * @example r12ViscosityWithDerivatives(293.15, 998.2061).dViscosityDTemperature // => -2.4673e-5 Pa s/K (at constant density)
 */
export function r12ViscosityWithDerivatives(temperatureK: number, densityKgPerM3: number): ViscosityWithDerivatives {
  const tBar = temperatureK / T_STAR_K;
  const rhoBar = densityKgPerM3 / RHO_STAR_KG_PER_M3;

  // D = sum_i H_i r^i with r = 1/Tbar; d ln mu_0/d Tbar = 1/(2 Tbar) - (dD/dr)(dr/dTbar)/D, dr/dTbar = -r^2
  const r = 1 / tBar;
  const d = H0[0]! + r * (H0[1]! + r * (H0[2]! + r * H0[3]!));
  const dDdr = H0[1]! + r * (2 * H0[2]! + r * 3 * H0[3]!);
  const dLnMu0DTBar = 0.5 / tBar + (dDdr * r * r) / d;

  // S = sum_i x^i P_i(y), P_i(y) = sum_j H_ij y^j (R12-08 eq. 12); Horner for values and derivatives.
  const x = r - 1;
  const y = rhoBar - 1;
  let s = 0;
  let dSdX = 0;
  let dSdY = 0;
  for (let i = H.length - 1; i >= 0; i--) {
    const row = H[i]!;
    let pi = 0;
    let dPi = 0;
    for (let j = row.length - 1; j >= 0; j--) {
      dPi = dPi * y + pi;
      pi = pi * y + row[j]!;
    }
    dSdX = dSdX * x + s;
    s = s * x + pi;
    dSdY = dSdY * x + dPi;
  }
  const mu = mu0(tBar) * Math.exp(rhoBar * s) * MU_STAR_PA_S;
  // dx/dTbar = -1/Tbar^2
  const dLnMuDTBar = dLnMu0DTBar - rhoBar * dSdX * r * r;
  const dLnMuDRhoBar = s + rhoBar * dSdY;
  return {
    viscosityPaS: mu,
    dViscosityDTemperature: (mu * dLnMuDTBar) / T_STAR_K,
    dViscosityDDensity: (mu * dLnMuDRhoBar) / RHO_STAR_KG_PER_M3,
  };
}
