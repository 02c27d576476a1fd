import {
  BODY_LENGTHS,
  coefficient,
  DENSITIES,
  DIAMETERS,
  FREQUENCIES,
  GRAVITY,
  LENGTHS,
  term,
  VELOCITIES,
  type NamedGroup,
} from './catalogue-terms.js';

/**
 * Named groups of fluid flow, forces and machines. Definitions as in the stored page
 * "Dimensionless numbers in fluid mechanics" (en.wikipedia.org) and ISO 80000-11:2019
 * (characteristic numbers; from memory), unless an entry names another source.
 */

const WIKI = 'Wikipedia, "Dimensionless numbers in fluid mechanics" (stored page); ISO 80000-11:2019 (from memory)';
const PUMP = 'pump groups with repeating D, N, rho: Q/(N D^3), gH/(N^2 D^2), P/(rho N^3 D^5) (stored page "Buckingham pi theory", scribd 853418031)';
const ONE = coefficient(1);
const FLUID: readonly ['density'] = ['density'];
const FLUID_ROLE = 'the fluid density';
const GRAVITY_ROLE = 'the acceleration of gravity';

export const FLUID_GROUPS: readonly NamedGroup[] = [
  {
    id: 'reynolds', name: 'Reynolds number', symbol: 'Re', physics: 'inertial to viscous forces',
    coefficient: ONE, source: WIKI,
    terms: [term(DENSITIES, 1, FLUID, FLUID_ROLE), term(VELOCITIES, 1), term(LENGTHS, 1, BODY_LENGTHS, 'a size of the body or passage'), term(['dynamic-viscosity'], -1)],
  },
  {
    id: 'reynolds-kinematic', name: 'Reynolds number', symbol: 'Re', physics: 'inertial to viscous forces',
    coefficient: ONE, source: WIKI,
    terms: [term(VELOCITIES, 1), term(LENGTHS, 1, BODY_LENGTHS, 'a size of the body or passage'), term(['kinematic-viscosity'], -1)],
  },
  {
    // Rotating machines: the tip speed is proportional to N*D (e.g. pump and mixer Reynolds numbers).
    id: 'reynolds-rotational', name: 'Reynolds number (rotational, rho*N*D^2/mu)', symbol: 'Re',
    physics: 'inertial to viscous forces in a rotating machine', coefficient: ONE, source: PUMP,
    terms: [term(DENSITIES, 1, FLUID, FLUID_ROLE), term(FREQUENCIES, 1, ['rotational-speed'], 'a rotational speed'), term(BODY_LENGTHS, 2), term(['dynamic-viscosity'], -1)],
  },
  {
    id: 'reynolds-rotational-kinematic', name: 'Reynolds number (rotational, N*D^2/nu)', symbol: 'Re',
    physics: 'inertial to viscous forces in a rotating machine', coefficient: ONE, source: PUMP,
    terms: [term(FREQUENCIES, 1, ['rotational-speed'], 'a rotational speed'), term(BODY_LENGTHS, 2), term(['kinematic-viscosity'], -1)],
  },
  {
    // Re = rho*U*D/mu with the mass flow mdot = rho*U*pi*D^2/4 (circular pipe): Re = 4*mdot/(pi*D*mu).
    id: 'reynolds-mass-flow', name: 'Reynolds number', symbol: 'Re', physics: 'inertial to viscous forces (pipe, from the mass flow)',
    coefficient: coefficient(4, 1, -1), source: `${WIKI}; with mdot = rho*U*pi*D^2/4`,
    terms: [term(['mass-flow'], 1), term(['diameter'], -1), term(['dynamic-viscosity'], -1)],
  },
  {
    id: 'euler', name: 'Euler number', symbol: 'Eu', physics: 'pressure difference to dynamic pressure (the pressure coefficient is 2*Eu)',
    coefficient: ONE, source: WIKI,
    terms: [term(['pressure-difference', 'pressure'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(VELOCITIES, -2)],
  },
  {
    // Darcy-Weisbach: dp = f * (L/D) * rho*U^2/2 (White, Fluid Mechanics, 7th ed., eq. 6.10; from memory).
    id: 'darcy', name: 'Darcy friction factor', symbol: 'f', physics: 'pressure drop per diameter of pipe length to dynamic pressure',
    coefficient: coefficient(2), source: 'Darcy-Weisbach equation, White, Fluid Mechanics 7th ed., eq. 6.10 (from memory)', composite: '2*Eu*D/L',
    terms: [term(['pressure-difference'], 1), term(['diameter'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(VELOCITIES, -2), term(['length'], -1)],
  },
  {
    // Fanning friction factor = wall shear stress / (rho*U^2/2) = Darcy f / 4.
    id: 'fanning', name: 'Fanning friction factor (skin-friction coefficient)', symbol: 'C_f', physics: 'wall shear stress to dynamic pressure',
    coefficient: coefficient(2), source: 'White, Fluid Mechanics 7th ed., eq. 6.11 (from memory)',
    terms: [term(['stress'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(VELOCITIES, -2)],
  },
  {
    id: 'froude', name: 'Froude number', symbol: 'Fr', physics: 'inertia to gravity (flow speed to gravity-wave speed)',
    coefficient: ONE, source: WIKI,
    terms: [term(VELOCITIES, 1), term(GRAVITY, [-1, 2], ['gravity'], GRAVITY_ROLE), term(LENGTHS, [-1, 2], ['height', 'length'], 'a depth or a length along the flow')],
  },
  {
    id: 'weber', name: 'Weber number', symbol: 'We', physics: 'inertia to surface tension',
    coefficient: ONE, source: WIKI,
    terms: [term(DENSITIES, 1, FLUID, FLUID_ROLE), term(VELOCITIES, 2), term(LENGTHS, 1, BODY_LENGTHS, 'a drop or body size'), term(['surface-tension'], -1)],
  },
  {
    id: 'capillary', name: 'capillary number', symbol: 'Ca', physics: 'viscous forces to surface tension',
    coefficient: ONE, source: WIKI, composite: 'We/Re',
    terms: [term(['dynamic-viscosity'], 1), term(VELOCITIES, 1), term(['surface-tension'], -1)],
  },
  {
    id: 'ohnesorge', name: 'Ohnesorge number', symbol: 'Oh', physics: 'viscous forces to inertia and surface tension (drops, jets)',
    coefficient: ONE, source: WIKI, composite: 'sqrt(We)/Re',
    terms: [term(['dynamic-viscosity'], 1), term(DENSITIES, [-1, 2], FLUID, FLUID_ROLE), term(['surface-tension'], [-1, 2]), term(BODY_LENGTHS, [-1, 2])],
  },
  {
    id: 'mach', name: 'Mach number', symbol: 'Ma', physics: 'flow speed to the speed of sound (compressibility)',
    coefficient: ONE, source: WIKI,
    terms: [term(VELOCITIES, 1), term(['sound-speed'], -1)],
  },
  {
    id: 'cauchy', name: 'Cauchy number', symbol: 'Cau', physics: 'inertia to elastic forces',
    coefficient: ONE, source: WIKI,
    terms: [term(DENSITIES, 1, FLUID, FLUID_ROLE), term(VELOCITIES, 2), term(['modulus'], -1)],
  },
  {
    // Propellers and rotors: J = U/(N*D).
    id: 'advance-ratio', name: 'advance ratio', symbol: 'J', physics: 'forward speed to rotor tip speed',
    coefficient: ONE, source: 'propeller advance ratio J = U/(n D) (from memory)',
    terms: [term(VELOCITIES, 1), term(['rotational-speed'], -1), term(DIAMETERS, -1, ['diameter'], 'the rotor diameter')],
  },
  {
    id: 'strouhal', name: 'Strouhal number', symbol: 'Sr', physics: 'unsteadiness: oscillation frequency to flow rate past a length',
    coefficient: ONE, source: WIKI,
    terms: [term(['frequency'], 1), term(BODY_LENGTHS, 1), term(VELOCITIES, -1)],
  },
  {
    id: 'flow-coefficient', name: 'flow coefficient', symbol: 'C_Q', physics: 'volume flow to the rotor swept flow N*D^3',
    coefficient: ONE, source: PUMP,
    terms: [term(['volume-flow'], 1), term(FREQUENCIES, -1, ['rotational-speed'], 'a rotational speed'), term(BODY_LENGTHS, -3, ['diameter'], 'the rotor diameter')],
  },
  {
    id: 'head-coefficient', name: 'head coefficient', symbol: 'C_H', physics: 'specific energy g*H to the rotor tip speed squared',
    coefficient: ONE, source: PUMP,
    terms: [term(['specific-energy'], 1), term(FREQUENCIES, -2, ['rotational-speed'], 'a rotational speed'), term(BODY_LENGTHS, -2, ['diameter'], 'the rotor diameter')],
  },
  {
    id: 'head-coefficient-g-h', name: 'head coefficient', symbol: 'C_H', physics: 'specific energy g*H to the rotor tip speed squared',
    coefficient: ONE, source: PUMP,
    terms: [term(GRAVITY, 1, ['gravity'], GRAVITY_ROLE), term(['height'], 1), term(FREQUENCIES, -2, ['rotational-speed'], 'a rotational speed'), term(['diameter', 'radius', 'length'], -2, ['diameter'], 'the rotor diameter')],
  },
  {
    id: 'power-number', name: 'power number (power coefficient)', symbol: 'C_P', physics: 'shaft power to rho*N^3*D^5 (pumps, fans, mixers)',
    coefficient: ONE, source: PUMP,
    terms: [term(['power'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(FREQUENCIES, -3, ['rotational-speed'], 'a rotational speed'), term(BODY_LENGTHS, -5, ['diameter'], 'the rotor diameter')],
  },
  {
    id: 'thrust-coefficient', name: 'thrust coefficient', symbol: 'C_T', physics: 'rotor force to rho*N^2*D^4',
    coefficient: ONE, source: 'propeller thrust coefficient K_T = T/(rho n^2 D^4) (from memory)',
    terms: [term(['force'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(['rotational-speed'], -2), term(DIAMETERS, -4, ['diameter'], 'the rotor diameter')],
  },
  {
    id: 'torque-coefficient', name: 'torque coefficient', symbol: 'C_M', physics: 'shaft torque to rho*N^2*D^5',
    coefficient: ONE, source: 'propeller torque coefficient K_Q = Q/(rho n^2 D^5) (from memory)',
    terms: [term(['torque'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(['rotational-speed'], -2), term(DIAMETERS, -5, ['diameter'], 'the rotor diameter')],
  },
  {
    // C_D = F / (rho*U^2/2 * A)
    id: 'drag-area', name: 'drag coefficient', symbol: 'C_D', physics: 'force to dynamic pressure times frontal area (drag, or lift for a lift force)',
    coefficient: coefficient(2), source: WIKI,
    terms: [term(['force'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(VELOCITIES, -2), term(['area'], -1)],
  },
  {
    // C_D = F / (rho*U^2/2 * pi*d^2/4) = 8*F/(pi*rho*U^2*d^2) for a sphere or cylinder end of diameter d.
    id: 'drag-diameter', name: 'drag coefficient', symbol: 'C_D', physics: 'force to dynamic pressure times frontal area pi*d^2/4',
    coefficient: coefficient(8, 1, -1), source: `${WIKI}; frontal area pi*d^2/4 of a sphere (check-values.md 5.1)`,
    terms: [term(['force'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(VELOCITIES, -2), term(['diameter', 'particle-diameter'], -2)],
  },
  {
    id: 'drag-radius', name: 'drag coefficient', symbol: 'C_D', physics: 'force to dynamic pressure times frontal area pi*r^2',
    coefficient: coefficient(2, 1, -1), source: `${WIKI}; frontal area pi*r^2`,
    terms: [term(['force'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(VELOCITIES, -2), term(['radius'], -2)],
  },
  {
    id: 'newton', name: 'Newton number (force coefficient)', symbol: 'Ne', physics: 'force to rho*U^2*L^2 (inertial force)',
    coefficient: ONE, source: WIKI,
    terms: [term(['force'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(VELOCITIES, -2), term(BODY_LENGTHS, -2)],
  },
  {
    id: 'galilei', name: 'Galilei number', symbol: 'Ga', physics: 'gravity to viscous forces', composite: 'Re^2/Fr^2',
    coefficient: ONE, source: WIKI,
    terms: [term(GRAVITY, 1, ['gravity'], GRAVITY_ROLE), term(BODY_LENGTHS, 3), term(DENSITIES, 2, FLUID, FLUID_ROLE), term(['dynamic-viscosity'], -2)],
  },
  {
    id: 'galilei-kinematic', name: 'Galilei number', symbol: 'Ga', physics: 'gravity to viscous forces', composite: 'Re^2/Fr^2',
    coefficient: ONE, source: WIKI,
    terms: [term(GRAVITY, 1, ['gravity'], GRAVITY_ROLE), term(BODY_LENGTHS, 3), term(['kinematic-viscosity'], -2)],
  },
  {
    // Ar = g L^3 rho_f (rho_p - rho_f) / mu^2 (stored page chemeurope.com, "Archimedes number").
    id: 'archimedes', name: 'Archimedes number', symbol: 'Ar', physics: 'buoyancy (weight less lift) to viscous forces on a particle',
    coefficient: ONE, source: 'Archimedes number, stored page chemeurope.com encyclopedia; check-values.md 5.1', composite: 'Ga*drho/rho',
    terms: [term(GRAVITY, 1, ['gravity'], GRAVITY_ROLE), term(BODY_LENGTHS, 3), term(['density'], 1), term(['density-difference'], 1), term(['dynamic-viscosity'], -2)],
  },
  {
    id: 'archimedes-buoyancy', name: 'Archimedes number', symbol: 'Ar', physics: 'buoyancy (weight less lift) to viscous forces on a particle',
    coefficient: ONE, source: 'Archimedes number with drho*g as one variable (check-values.md 5.1)', composite: 'Ga*drho/rho',
    terms: [term(['buoyancy-weight'], 1), term(BODY_LENGTHS, 3), term(['density'], 1), term(['dynamic-viscosity'], -2)],
  },
  {
    // Bo = rho g L^2 / sigma (stored page dimless.org, "Bond number"; Eotvos: drho g L^2 / sigma).
    id: 'bond', name: 'Bond number (Eotvos number)', symbol: 'Bo', physics: 'gravity (weight) to surface tension',
    coefficient: ONE, source: 'Bond number, stored page dimless.org/docs/numbers/bond',
    terms: [term(['density', 'density-difference', 'particle-density'], 1), term(GRAVITY, 1, ['gravity'], GRAVITY_ROLE), term(BODY_LENGTHS, 2), term(['surface-tension'], -1)],
  },
  {
    id: 'bond-buoyancy', name: 'Bond number (Eotvos number)', symbol: 'Bo', physics: 'gravity (weight) to surface tension',
    coefficient: ONE, source: 'Eotvos number drho g L^2/sigma, stored page en.wikipedia.org "Eotvos number"',
    terms: [term(['buoyancy-weight', 'specific-weight'], 1), term(BODY_LENGTHS, 2), term(['surface-tension'], -1)],
  },
  {
    // Stk = tau_p U / L with the particle relaxation time tau_p = rho_p d^2 / (18 mu) (Stokes drag).
    id: 'stokes', name: 'Stokes number', symbol: 'Stk', physics: 'particle response time to flow time (particle inertia)',
    coefficient: coefficient(1, 18), source: 'Stokes number with tau_p = rho_p d^2/(18 mu), stored page fxsolver.com "Stokes Number"',
    terms: [term(['particle-density'], 1), term(['particle-diameter', 'diameter'], 2, ['particle-diameter'], 'the particle diameter'), term(VELOCITIES, 1), term(['dynamic-viscosity'], -1), term(['length', 'diameter', 'height'], -1)],
  },
  {
    id: 'relative-roughness', name: 'relative roughness', symbol: 'eps_D', physics: 'wall roughness height to the passage diameter',
    coefficient: ONE, source: 'Moody chart parameter epsilon/D (check-values.md 5.1)',
    terms: [term(['roughness'], 1), term(DIAMETERS, -1, ['diameter'], 'the pipe diameter')],
  },
];
