import { InputError, type SourceSpan, type Warning } from '../common/errors.js';
import { rangeViolations, type RangeViolation } from './evaluate.js';
import { brentRoot } from './root.js';
import type { Correlation } from './types.js';

/**
 * Terminal (settling) velocity of a smooth rigid sphere from a drag law, for settling rigs that
 * measure velocity.
 *
 * Force balance: weight minus buoyancy equals drag, (rho_p - rho_f) g pi d^3/6 = C_D (rho_f V^2/2) pi d^2/4.
 * With Re = rho_f V d/mu and the Archimedes number Ar = rho_f (rho_p - rho_f) g d^3 / mu^2 this is
 *     C_D(Re) * Re^2 = (4/3) Ar
 * (check-values.md 2.4; Stokes limit V = g d^2 (rho_p - rho_f)/(18 mu), Perry's Handbook 8th ed.),
 * one equation in Re alone. It is solved in s = ln Re: h(s) = ln C_D(e^s) + 2 s - ln(4 Ar/3).
 * The bracket comes from a scan on a log grid (8 points per decade) from below the Stokes solution
 * (Re = Ar/1000; every law here tends to 24/Re, which puts the root near Ar/18) up to
 * max(1e7, 10 sqrt(Ar)) (C_D above 0.05 puts the root below 5.2 sqrt(Ar)); Brent's method then
 * finds the root in the first bracket. The first (lowest) root is the one a particle released
 * from rest reaches; a drag law with a drag crisis (Morrison) can have more, and then a warning
 * says so.
 */

export interface SettlingInput {
  readonly diameterM: number;
  readonly particleDensityKgM3: number;
  readonly fluidDensityKgM3: number;
  readonly viscosityPaS: number;
  /** Default: standard gravity 9.80665 m/s^2 (3rd CGPM, 1901). */
  readonly gravityMPerS2?: number;
}

export interface SettlingResult {
  readonly velocityMPerS: number;
  readonly reynolds: number;
  readonly archimedes: number;
  readonly dragCoefficient: number;
  /** The drag law used. */
  readonly id: string;
  /** Bounds of the drag law's stated range that the solution violates. */
  readonly outsideRange: readonly RangeViolation[];
  /** 'outside-range', 'settling-multiple-solutions'. */
  readonly warnings: readonly Warning[];
}

/** Standard acceleration of gravity, exact by definition (3rd CGPM, 1901; SI Brochure 9th ed.). */
export const STANDARD_GRAVITY = 9.80665;

const STEPS_PER_DECADE = 8;

/**
 * Terminal velocity of a sphere settling under a drag law.
 *
 * @throws {InputError} 'settling-bad-input' for a non-positive or non-finite property;
 *   'settling-not-sinking' when the particle is not denser than the fluid;
 *   'settling-not-drag' when the correlation is not a sphere drag law;
 *   'settling-no-solution' when C_D Re^2 = 4Ar/3 has no root in the scanned range.
 * @example
 *   terminalVelocity({ diameterM: 70e-6, particleDensityKgM3: 2600, fluidDensityKgM3: 1000, viscosityPaS: 1e-3 }, STOKES)
 *   // => velocityMPerS 0.0042713 (check-values.md 2.4, sand grain in water)
 */
export function terminalVelocity(input: SettlingInput, drag: Correlation, where: SourceSpan = {}): SettlingResult {
  const g = input.gravityMPerS2 ?? STANDARD_GRAVITY;
  checkInputs(input, g, drag, where);
  const { diameterM: d, particleDensityKgM3: rhoP, fluidDensityKgM3: rhoF, viscosityPaS: mu } = input;
  // Archimedes number Ar = rho_f (rho_p - rho_f) g d^3 / mu^2 (check-values.md 2.4).
  const ar = (rhoF * (rhoP - rhoF) * g * d * d * d) / (mu * mu);
  const target = Math.log((4 / 3) * ar);
  const h = (s: number): number => Math.log(drag.value([Math.exp(s)])) + 2 * s - target;

  const sLo = Math.log(Math.min(1e-9, ar / 1000));
  const sHi = Math.log(Math.max(1e7, 10 * Math.sqrt(ar)));
  const step = Math.LN10 / STEPS_PER_DECADE;
  const brackets: [number, number][] = [];
  let prevS = sLo;
  let prevH = h(sLo);
  for (let s = sLo + step; s < sHi + step / 2; s += step) {
    const hs = h(s);
    if (Number.isFinite(prevH) && Number.isFinite(hs) && prevH < 0 !== hs < 0) brackets.push([prevS, s]);
    prevS = s;
    prevH = hs;
  }
  const first = brackets[0];
  if (first === undefined) {
    throw new InputError('settling-no-solution', `'${drag.id}' gives no Reynolds number with C_D*Re^2 = 4*Ar/3 (Ar = ${ar.toPrecision(4)}) between ${Math.exp(sLo).toPrecision(2)} and ${Math.exp(sHi).toPrecision(2)}`, where);
  }
  const s = brentRoot(h, first[0], first[1], 1e-14);
  const re = Math.exp(s);
  const cd = drag.value([re]);
  const outsideRange = rangeViolations(drag, { Re: re });
  const warnings: Warning[] = outsideRange.map((v) => ({
    code: 'outside-range',
    message: `the settling Reynolds number ${re.toPrecision(4)} is outside the range of '${drag.id}' (${v.bound.source})`,
    where,
  }));
  if (brackets.length > 1) {
    warnings.push({
      code: 'settling-multiple-solutions',
      message: `'${drag.id}' balances the weight at ${brackets.length} Reynolds numbers (a drag crisis); the lowest, ${re.toPrecision(4)}, is the one reached from rest`,
      where,
    });
  }
  return { velocityMPerS: (re * mu) / (rhoF * d), reynolds: re, archimedes: ar, dragCoefficient: cd, id: drag.id, outsideRange, warnings };
}

function checkInputs(input: SettlingInput, g: number, drag: Correlation, where: SourceSpan): void {
  if (drag.family !== 'sphere-drag') {
    throw new InputError('settling-not-drag', `'${drag.id}' is not a sphere drag law; use one of the sphere-drag correlations`, where);
  }
  const named: [string, number][] = [
    ['diameter', input.diameterM],
    ['particle density', input.particleDensityKgM3],
    ['fluid density', input.fluidDensityKgM3],
    ['viscosity', input.viscosityPaS],
    ['gravity', g],
  ];
  for (const [name, v] of named) {
    if (!(v > 0 && Number.isFinite(v))) {
      throw new InputError('settling-bad-input', `the ${name} must be a positive finite number, got ${v}`, where);
    }
  }
  if (!(input.particleDensityKgM3 > input.fluidDensityKgM3)) {
    throw new InputError(
      'settling-not-sinking',
      `the particle (${input.particleDensityKgM3} kg/m^3) is not denser than the fluid (${input.fluidDensityKgM3} kg/m^3): it does not settle`,
      where,
    );
  }
}
