import { BODY_LENGTHS, coefficient, DENSITIES, GRAVITY, term, VELOCITIES, type NamedGroup } from './catalogue-terms.js';

/**
 * Named groups of heat and mass transfer. Definitions as in Incropera, DeWitt, Bergman and
 * Lavine, Fundamentals of Heat and Mass Transfer, 6th ed. (2007), Table 6.2 (from memory), and
 * the stored pages "Dimensionless numbers in fluid mechanics" (en.wikipedia.org) and efunda.com
 * "Convection: non-dimensional parameters".
 */

const HEAT = 'Incropera et al., Fundamentals of Heat and Mass Transfer 6th ed., Table 6.2 (from memory); stored page efunda.com nondim_params';
const ONE = coefficient(1);
const FLUID: readonly ['density'] = ['density'];
const FLUID_ROLE = 'the fluid density';
const GRAVITY_ROLE = 'the acceleration of gravity';

export const TRANSPORT_GROUPS: readonly NamedGroup[] = [
  {
    id: 'prandtl', name: 'Prandtl number', symbol: 'Pr', physics: 'momentum diffusivity to thermal diffusivity',
    coefficient: ONE, source: HEAT,
    terms: [term(['specific-heat'], 1), term(['dynamic-viscosity'], 1), term(['conductivity'], -1)],
  },
  {
    id: 'prandtl-kinematic', name: 'Prandtl number', symbol: 'Pr', physics: 'momentum diffusivity to thermal diffusivity',
    coefficient: ONE, source: HEAT,
    terms: [term(['kinematic-viscosity'], 1), term(['thermal-diffusivity'], -1)],
  },
  {
    id: 'nusselt', name: 'Nusselt number', symbol: 'Nu', physics: 'convective to conductive heat transfer in the fluid',
    coefficient: ONE, source: HEAT,
    terms: [term(['heat-transfer-coefficient'], 1), term(BODY_LENGTHS, 1), term(['conductivity'], -1)],
  },
  {
    id: 'biot', name: 'Biot number', symbol: 'Bi', physics: 'conduction resistance inside a solid to convection resistance at its surface',
    coefficient: ONE, source: HEAT,
    terms: [term(['heat-transfer-coefficient'], 1), term(BODY_LENGTHS, 1), term(['solid-conductivity'], -1)],
  },
  {
    id: 'schmidt', name: 'Schmidt number', symbol: 'Sc', physics: 'momentum diffusivity to mass diffusivity',
    coefficient: ONE, source: HEAT,
    terms: [term(['dynamic-viscosity'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(['mass-diffusivity'], -1)],
  },
  {
    id: 'schmidt-kinematic', name: 'Schmidt number', symbol: 'Sc', physics: 'momentum diffusivity to mass diffusivity',
    coefficient: ONE, source: HEAT,
    terms: [term(['kinematic-viscosity'], 1), term(['mass-diffusivity'], -1)],
  },
  {
    id: 'sherwood', name: 'Sherwood number', symbol: 'Sh', physics: 'convective mass transfer to diffusion',
    coefficient: ONE, source: HEAT,
    terms: [term(['mass-transfer-coefficient'], 1), term(BODY_LENGTHS, 1), term(['mass-diffusivity'], -1)],
  },
  {
    id: 'peclet', name: 'Peclet number', symbol: 'Pe', physics: 'heat carried by the flow to heat conducted', composite: 'Re*Pr',
    coefficient: ONE, source: HEAT,
    terms: [term(VELOCITIES, 1), term(BODY_LENGTHS, 1), term(['thermal-diffusivity'], -1)],
  },
  {
    id: 'peclet-properties', name: 'Peclet number', symbol: 'Pe', physics: 'heat carried by the flow to heat conducted', composite: 'Re*Pr',
    coefficient: ONE, source: HEAT,
    terms: [term(DENSITIES, 1, FLUID, FLUID_ROLE), term(['specific-heat'], 1), term(VELOCITIES, 1), term(BODY_LENGTHS, 1), term(['conductivity'], -1)],
  },
  {
    id: 'peclet-mass', name: 'Peclet number (mass)', symbol: 'Pe', physics: 'species carried by the flow to species diffused', composite: 'Re*Sc',
    coefficient: ONE, source: HEAT,
    terms: [term(VELOCITIES, 1), term(BODY_LENGTHS, 1), term(['mass-diffusivity'], -1)],
  },
  {
    id: 'lewis', name: 'Lewis number', symbol: 'Le', physics: 'thermal diffusivity to mass diffusivity', composite: 'Sc/Pr',
    coefficient: ONE, source: HEAT,
    terms: [term(['thermal-diffusivity'], 1), term(['mass-diffusivity'], -1)],
  },
  {
    id: 'stanton', name: 'Stanton number', symbol: 'St', physics: 'heat transferred to heat capacity of the flow', composite: 'Nu/(Re*Pr)',
    coefficient: ONE, source: HEAT,
    terms: [term(['heat-transfer-coefficient'], 1), term(DENSITIES, -1, FLUID, FLUID_ROLE), term(['specific-heat'], -1), term(VELOCITIES, -1)],
  },
  {
    id: 'eckert', name: 'Eckert number', symbol: 'Ec', physics: 'kinetic energy of the flow to its enthalpy difference (viscous heating)',
    coefficient: ONE, source: 'Eckert number U^2/(c_p dT), stored page web1.eng.famu.fsu.edu convective ch1 node45; ' + HEAT,
    terms: [term(VELOCITIES, 2), term(['specific-heat'], -1), term(['temperature-difference', 'temperature'], -1, ['temperature-difference'], 'a temperature difference')],
  },
  {
    id: 'grashof', name: 'Grashof number', symbol: 'Gr', physics: 'buoyancy to viscous forces (natural convection)',
    coefficient: ONE, source: HEAT,
    terms: [term(GRAVITY, 1, ['gravity'], GRAVITY_ROLE), term(['thermal-expansion'], 1), term(['temperature-difference', 'temperature'], 1, ['temperature-difference'], 'a temperature difference'), term(BODY_LENGTHS, 3), term(DENSITIES, 2, FLUID, FLUID_ROLE), term(['dynamic-viscosity'], -2)],
  },
  {
    id: 'grashof-kinematic', name: 'Grashof number', symbol: 'Gr', physics: 'buoyancy to viscous forces (natural convection)',
    coefficient: ONE, source: HEAT,
    terms: [term(GRAVITY, 1, ['gravity'], GRAVITY_ROLE), term(['thermal-expansion'], 1), term(['temperature-difference', 'temperature'], 1, ['temperature-difference'], 'a temperature difference'), term(BODY_LENGTHS, 3), term(['kinematic-viscosity'], -2)],
  },
  {
    // Ra = Gr * Pr = g beta dT L^3 rho^2 c_p / (mu k)
    id: 'rayleigh', name: 'Rayleigh number', symbol: 'Ra', physics: 'buoyancy driving natural convection to viscous and thermal diffusion', composite: 'Gr*Pr',
    coefficient: ONE, source: HEAT,
    terms: [term(GRAVITY, 1, ['gravity'], GRAVITY_ROLE), term(['thermal-expansion'], 1), term(['temperature-difference', 'temperature'], 1, ['temperature-difference'], 'a temperature difference'), term(BODY_LENGTHS, 3), term(DENSITIES, 2, FLUID, FLUID_ROLE), term(['specific-heat'], 1), term(['dynamic-viscosity'], -1), term(['conductivity'], -1)],
  },
  {
    id: 'rayleigh-kinematic', name: 'Rayleigh number', symbol: 'Ra', physics: 'buoyancy driving natural convection to viscous and thermal diffusion', composite: 'Gr*Pr',
    coefficient: ONE, source: HEAT,
    terms: [term(GRAVITY, 1, ['gravity'], GRAVITY_ROLE), term(['thermal-expansion'], 1), term(['temperature-difference', 'temperature'], 1, ['temperature-difference'], 'a temperature difference'), term(BODY_LENGTHS, 3), term(['kinematic-viscosity'], -1), term(['thermal-diffusivity'], -1)],
  },
  {
    id: 'fourier', name: 'Fourier number', symbol: 'Fo', physics: 'elapsed time to the time heat needs to diffuse over the length',
    coefficient: ONE, source: HEAT,
    terms: [term(['thermal-diffusivity'], 1), term(['time'], 1), term(BODY_LENGTHS, -2)],
  },
  {
    id: 'fourier-properties', name: 'Fourier number', symbol: 'Fo', physics: 'elapsed time to the time heat needs to diffuse over the length',
    coefficient: ONE, source: HEAT,
    terms: [term(['conductivity', 'solid-conductivity'], 1), term(['time'], 1), term(DENSITIES, -1), term(['specific-heat'], -1), term(BODY_LENGTHS, -2)],
  },
];
