import { Dimension } from '../units/index.js';

/**
 * Kinds of quantity: what a variable is, beyond its dimension. The named-group catalogue is
 * written in kinds (a Reynolds number combines a density, a velocity, a length and a dynamic
 * viscosity), and the automatic choice of repeating variables prefers some kinds to others.
 *
 * Where several kinds share a dimension (pressure, stress and modulus; kinematic viscosity and the
 * two diffusivities; flow velocity, settling velocity and speed of sound; gravity and another
 * acceleration) the kind comes, in this order, from an explicit hint (`--var g=m/s^2:gravity`),
 * from the unit for temperatures (degC is a temperature, delta_degC a difference), from the
 * variable's name (the `names` patterns below), or else from the dimension's default kind.
 * Dimensions as in the SI Brochure 9th ed. (2019), Tables 4-6 (derived quantities).
 */

export type KindId =
  | 'density'
  | 'particle-density'
  | 'density-difference'
  | 'dynamic-viscosity'
  | 'kinematic-viscosity'
  | 'thermal-diffusivity'
  | 'mass-diffusivity'
  | 'velocity'
  | 'settling-velocity'
  | 'sound-speed'
  | 'mass-transfer-coefficient'
  | 'volume-flow'
  | 'mass-flow'
  | 'length'
  | 'diameter'
  | 'radius'
  | 'particle-diameter'
  | 'roughness'
  | 'height'
  | 'area'
  | 'volume'
  | 'gravity'
  | 'acceleration'
  | 'pressure'
  | 'pressure-difference'
  | 'stress'
  | 'modulus'
  | 'force'
  | 'energy'
  | 'torque'
  | 'power'
  | 'surface-tension'
  | 'stiffness'
  | 'frequency'
  | 'rotational-speed'
  | 'time'
  | 'temperature'
  | 'temperature-difference'
  | 'thermal-expansion'
  | 'heat-transfer-coefficient'
  | 'conductivity'
  | 'solid-conductivity'
  | 'specific-heat'
  | 'specific-energy'
  | 'heat-flux'
  | 'specific-weight'
  | 'buoyancy-weight'
  | 'mass'
  | 'dimensionless'
  | 'other';

export interface QuantityKind {
  readonly id: KindId;
  /** Words for output: 'fluid density', 'settling (terminal) velocity'. */
  readonly words: string;
  readonly dimension: Dimension;
  /** Names that select this kind among the kinds of its dimension (tested in table order). */
  readonly names?: RegExp;
  /** The kind taken for this dimension when neither a hint nor a name decides. */
  readonly isDefault?: boolean;
  /** The default is a guess between distinct quantities: the output says "assumed". */
  readonly guess?: boolean;
  /**
   * Preference as a repeating variable, lower first (see repeating.ts): density 1, velocity or
   * flow rate 2, rotational speed 3, diameter 4, other lengths 5, viscosity 5-6, ... 99 never.
   */
  readonly preference: number;
}

const D = (e: Parameters<typeof Dimension.of>[0]): Dimension => Dimension.of(e);
const DENSITY = D({ M: 1, L: -3 });
const DIFFUSIVITY = D({ L: 2, T: -1 });
const VELOCITY = D({ L: 1, T: -1 });
const LENGTH = D({ L: 1 });
const ACCELERATION = D({ L: 1, T: -2 });
const PRESSURE = D({ M: 1, L: -1, T: -2 });
const ENERGY = D({ M: 1, L: 2, T: -2 });
const SURFACE_TENSION = D({ M: 1, T: -2 });
const FREQUENCY = D({ T: -1 });
const TEMPERATURE = D({ Θ: 1 });
const CONDUCTIVITY = D({ M: 1, L: 1, T: -3, Θ: -1 });
const SPECIFIC_WEIGHT = D({ M: 1, L: -2, T: -2 });

/** The kinds, grouped by dimension; within a dimension, named kinds before the default. */
export const KINDS: readonly QuantityKind[] = [
  // Densities: rho_p, rho_s (particle, solid); drho, delta_rho (a difference); else the fluid's.
  { id: 'particle-density', words: 'particle or body density', dimension: DENSITY, names: /^(rho|ρ)_?(p|s|b|part\w*|solid\w*|sph\w*|body|ball)$/i, preference: 3 },
  { id: 'density-difference', words: 'density difference', dimension: DENSITY, names: /^(d|Δ|delta_?)(rho|ρ)\w*$/i, preference: 8 },
  { id: 'density', words: 'fluid density', dimension: DENSITY, isDefault: true, preference: 1 },
  { id: 'dynamic-viscosity', words: 'dynamic viscosity', dimension: D({ M: 1, L: -1, T: -1 }), isDefault: true, preference: 5 },
  // L^2 T^-1: nu is a kinematic viscosity, alpha a thermal diffusivity, D_AB a mass diffusivity.
  { id: 'thermal-diffusivity', words: 'thermal diffusivity', dimension: DIFFUSIVITY, names: /^(alpha|α|a_?th|kappa|κ|chi)(_\w*)?$/i, preference: 9 },
  { id: 'mass-diffusivity', words: 'mass diffusivity', dimension: DIFFUSIVITY, names: /^(D|Dm|D_?AB|D_?ab|D_?m|D_?12|D_?eff|Dc|diff\w*)$/, preference: 9 },
  { id: 'kinematic-viscosity', words: 'kinematic viscosity', dimension: DIFFUSIVITY, names: /^(nu|ν|kin\w*)(_\w*)?$/i, isDefault: true, guess: true, preference: 6 },
  // Velocities: Vt, u_t, w_s settle; c, a are speeds of sound; k_m, k_c transfer mass.
  { id: 'settling-velocity', words: 'settling (terminal) velocity', dimension: VELOCITY, names: /^((u|v|w)_?(t|s|set\w*|term\w*|inf_?t)|settl\w*|term\w*)$/i, preference: 2 },
  { id: 'sound-speed', words: 'speed of sound', dimension: VELOCITY, names: /^(c|a|c_?s|c_?0|a_?0|c_?sound|sound\w*)$/, preference: 7 },
  { id: 'mass-transfer-coefficient', words: 'mass-transfer coefficient', dimension: VELOCITY, names: /^(k_?m|k_?c|h_?m|k_?L|k_?G)$/, preference: 9 },
  { id: 'velocity', words: 'flow velocity', dimension: VELOCITY, isDefault: true, preference: 2 },
  { id: 'volume-flow', words: 'volume flow rate', dimension: D({ L: 3, T: -1 }), isDefault: true, preference: 2 },
  { id: 'mass-flow', words: 'mass flow rate', dimension: D({ M: 1, T: -1 }), isDefault: true, preference: 3 },
  // Lengths: d_p is a particle diameter, D or d a diameter, r a radius, eps or ks a roughness,
  // h, H, z a height or depth; any other name a length.
  { id: 'particle-diameter', words: 'particle diameter', dimension: LENGTH, names: /^(d|D)_?(p|s|b|part\w*|sph\w*|ball|bub\w*|drop\w*|32)$/, preference: 4 },
  { id: 'diameter', words: 'diameter', dimension: LENGTH, names: /^((D|d)(_?(h|i|o|t|in|out|pipe|tube|imp\w*|rotor|\d))?|diam\w*|dia|bore)$/, preference: 4 },
  { id: 'radius', words: 'radius', dimension: LENGTH, names: /^((r|R)(_?(h|i|o|in|out|\d))?|rad\w*)$/, preference: 4 },
  { id: 'roughness', words: 'roughness height', dimension: LENGTH, names: /^(eps\w*|ε\w*|k_?s|rough\w*|e)$/i, preference: 20 },
  { id: 'height', words: 'height, depth or head', dimension: LENGTH, names: /^(h|H|z|Z|head\w*|height\w*|depth\w*|(h|H)_?\w+)$/, preference: 6 },
  { id: 'length', words: 'length', dimension: LENGTH, isDefault: true, preference: 5 },
  { id: 'area', words: 'area', dimension: D({ L: 2 }), isDefault: true, preference: 6 },
  { id: 'volume', words: 'volume', dimension: D({ L: 3 }), isDefault: true, preference: 6 },
  // Accelerations: a, acc... is another acceleration; anything else is taken as gravity.
  { id: 'acceleration', words: 'acceleration (not gravity)', dimension: ACCELERATION, names: /^(a|acc\w*|a_\w+)$/i, preference: 12 },
  { id: 'gravity', words: 'acceleration of gravity', dimension: ACCELERATION, names: /^(g|g_?\w+|grav\w*)$/, isDefault: true, guess: true, preference: 8 },
  // Pressures: dp, delta_p a difference; tau, sigma a stress; E, K a modulus; pv a vapour pressure.
  { id: 'pressure-difference', words: 'pressure difference', dimension: PRESSURE, names: /^((d|Δ|delta_?)p\w*|p_?(drop|loss)\w*)$/i, preference: 10 },
  { id: 'stress', words: 'stress (shear or normal)', dimension: PRESSURE, names: /^(tau\w*|τ\w*|shear\w*|sigma\w*|σ\w*)$/i, preference: 12 },
  { id: 'modulus', words: 'elastic or bulk modulus', dimension: PRESSURE, names: /^(E|K|E_\w+|K_\w+|modulus\w*|bulk\w*|young\w*)$/, preference: 12 },
  { id: 'pressure', words: 'pressure', dimension: PRESSURE, isDefault: true, preference: 10 },
  { id: 'force', words: 'force (drag, lift, thrust, weight)', dimension: D({ M: 1, L: 1, T: -2 }), isDefault: true, preference: 11 },
  { id: 'torque', words: 'torque', dimension: ENERGY, names: /^(T|Tq|M|tau|τ|torque\w*|T_\w+|M_\w+)$/, preference: 11 },
  { id: 'energy', words: 'energy or work', dimension: ENERGY, isDefault: true, preference: 11 },
  { id: 'power', words: 'power', dimension: D({ M: 1, L: 2, T: -3 }), isDefault: true, preference: 11 },
  { id: 'stiffness', words: 'spring stiffness', dimension: SURFACE_TENSION, names: /^(k|k_\w+|stiff\w*)$/, preference: 12 },
  { id: 'surface-tension', words: 'surface tension', dimension: SURFACE_TENSION, isDefault: true, guess: true, preference: 7 },
  // T^-1: N, n, omega, rpm a rotational speed; anything else a frequency.
  { id: 'rotational-speed', words: 'rotational speed', dimension: FREQUENCY, names: /^(N|n|omega|ω|Omega|Ω|rpm|rps|speed|(N|n|omega|ω)_\w+)$/, preference: 3 },
  { id: 'frequency', words: 'frequency', dimension: FREQUENCY, isDefault: true, preference: 6 },
  { id: 'time', words: 'time or period', dimension: D({ T: 1 }), isDefault: true, preference: 7 },
  // Temperatures: the unit decides first (degC absolute, delta_degC difference); then dT, ΔT.
  { id: 'temperature-difference', words: 'temperature difference', dimension: TEMPERATURE, names: /^(d|Δ|delta_?)(T|θ|theta)\w*$/i, isDefault: true, guess: true, preference: 9 },
  { id: 'temperature', words: 'temperature', dimension: TEMPERATURE, names: /^(T|θ|theta|temp)(_?\w*)?$/i, preference: 10 },
  { id: 'thermal-expansion', words: 'thermal expansion coefficient', dimension: D({ Θ: -1 }), isDefault: true, preference: 12 },
  { id: 'heat-transfer-coefficient', words: 'heat-transfer coefficient', dimension: D({ M: 1, T: -3, Θ: -1 }), isDefault: true, preference: 10 },
  { id: 'solid-conductivity', words: 'thermal conductivity of a solid', dimension: CONDUCTIVITY, names: /^(k|λ|lambda)_?(s|w|solid\w*|wall|sol\w*)$/i, preference: 9 },
  { id: 'conductivity', words: 'thermal conductivity of the fluid', dimension: CONDUCTIVITY, isDefault: true, preference: 9 },
  { id: 'specific-heat', words: 'specific heat capacity', dimension: D({ L: 2, T: -2, Θ: -1 }), isDefault: true, preference: 9 },
  { id: 'specific-energy', words: 'specific energy (g*H, energy per unit mass)', dimension: D({ L: 2, T: -2 }), isDefault: true, preference: 9 },
  { id: 'heat-flux', words: 'heat flux', dimension: D({ M: 1, T: -3 }), isDefault: true, preference: 10 },
  { id: 'buoyancy-weight', words: 'buoyancy per unit volume (drho*g)', dimension: SPECIFIC_WEIGHT, names: /^((d|Δ|delta_?)(rho|ρ)_?g|(d|Δ|delta_?)(gamma|γ)|buoy\w*)$/i, preference: 8 },
  { id: 'specific-weight', words: 'specific weight (rho*g)', dimension: SPECIFIC_WEIGHT, isDefault: true, preference: 8 },
  { id: 'mass', words: 'mass', dimension: D({ M: 1 }), isDefault: true, preference: 8 },
  { id: 'dimensionless', words: 'dimensionless', dimension: Dimension.NONE, isDefault: true, preference: 99 },
];

const BY_ID = new Map<string, QuantityKind>(KINDS.map((k) => [k.id, k]));

/** The kind with this id, or undefined. @example kindById('gravity')?.words // => 'acceleration of gravity' */
export function kindById(id: string): QuantityKind | undefined {
  return BY_ID.get(id);
}

/** The kinds that have this dimension, named kinds first. @example kindsOf(L T^-2).map((k) => k.id) // => ['acceleration', 'gravity'] */
export function kindsOf(dimension: Dimension): QuantityKind[] {
  return KINDS.filter((k) => k.dimension.equals(dimension));
}

/** The kind of a dimension no table entry has: 'other', described by the caller. @example otherKind(L^5 T^-1, 'of dimension L^5 T^-1').id // => 'other' */
export function otherKind(dimension: Dimension, words: string): QuantityKind {
  return { id: 'other', words, dimension, preference: 15 };
}
