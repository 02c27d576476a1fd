import { Dimension } from './dimension.js';

/**
 * Names of the physical quantities a rig engineer meets, by dimension, for messages such as
 * "kPa is a pressure (M L^-1 T^-2)". Where several quantities share a dimension (energy and
 * torque; kinematic viscosity and diffusivity) all are named. Dimensions as in the SI Brochure
 * (9th ed., 2019), Tables 4-6 (derived quantities and units).
 */
const QUANTITIES: readonly { readonly names: readonly string[]; readonly dimension: Dimension }[] = [
  { names: ['dimensionless quantity'], dimension: Dimension.NONE },
  { names: ['mass'], dimension: Dimension.of({ M: 1 }) },
  { names: ['length'], dimension: Dimension.of({ L: 1 }) },
  { names: ['time'], dimension: Dimension.of({ T: 1 }) },
  { names: ['temperature'], dimension: Dimension.of({ Θ: 1 }) },
  { names: ['amount of substance'], dimension: Dimension.of({ N: 1 }) },
  { names: ['electric current'], dimension: Dimension.of({ I: 1 }) },
  { names: ['luminous intensity'], dimension: Dimension.of({ J: 1 }) },
  { names: ['area'], dimension: Dimension.of({ L: 2 }) },
  { names: ['volume'], dimension: Dimension.of({ L: 3 }) },
  { names: ['velocity'], dimension: Dimension.of({ L: 1, T: -1 }) },
  { names: ['acceleration'], dimension: Dimension.of({ L: 1, T: -2 }) },
  { names: ['frequency', 'angular velocity'], dimension: Dimension.of({ T: -1 }) },
  { names: ['force'], dimension: Dimension.of({ M: 1, L: 1, T: -2 }) },
  { names: ['pressure', 'stress'], dimension: Dimension.of({ M: 1, L: -1, T: -2 }) },
  { names: ['energy', 'torque'], dimension: Dimension.of({ M: 1, L: 2, T: -2 }) },
  { names: ['power'], dimension: Dimension.of({ M: 1, L: 2, T: -3 }) },
  { names: ['density'], dimension: Dimension.of({ M: 1, L: -3 }) },
  { names: ['specific weight'], dimension: Dimension.of({ M: 1, L: -2, T: -2 }) },
  { names: ['dynamic viscosity'], dimension: Dimension.of({ M: 1, L: -1, T: -1 }) },
  { names: ['kinematic viscosity', 'diffusivity'], dimension: Dimension.of({ L: 2, T: -1 }) },
  { names: ['volume flow'], dimension: Dimension.of({ L: 3, T: -1 }) },
  { names: ['mass flow'], dimension: Dimension.of({ M: 1, T: -1 }) },
  { names: ['mass flux'], dimension: Dimension.of({ M: 1, L: -2, T: -1 }) },
  { names: ['surface tension', 'stiffness'], dimension: Dimension.of({ M: 1, T: -2 }) },
  { names: ['momentum'], dimension: Dimension.of({ M: 1, L: 1, T: -1 }) },
  { names: ['heat flux'], dimension: Dimension.of({ M: 1, T: -3 }) },
  { names: ['heat transfer coefficient'], dimension: Dimension.of({ M: 1, T: -3, Θ: -1 }) },
  { names: ['thermal conductivity'], dimension: Dimension.of({ M: 1, L: 1, T: -3, Θ: -1 }) },
  { names: ['specific heat capacity', 'specific gas constant'], dimension: Dimension.of({ L: 2, T: -2, Θ: -1 }) },
  { names: ['heat capacity', 'entropy'], dimension: Dimension.of({ M: 1, L: 2, T: -2, Θ: -1 }) },
  { names: ['specific energy'], dimension: Dimension.of({ L: 2, T: -2 }) },
  { names: ['molar gas constant'], dimension: Dimension.of({ M: 1, L: 2, T: -2, Θ: -1, N: -1 }) },
  { names: ['molar mass'], dimension: Dimension.of({ M: 1, N: -1 }) },
  { names: ['concentration'], dimension: Dimension.of({ N: 1, L: -3 }) },
  { names: ['thermal expansion coefficient'], dimension: Dimension.of({ Θ: -1 }) },
  { names: ['specific volume'], dimension: Dimension.of({ L: 3, M: -1 }) },
  { names: ['volumetric heat generation', 'power density'], dimension: Dimension.of({ M: 1, L: -1, T: -3 }) },
];

const BY_KEY = new Map(QUANTITIES.map((q) => [q.dimension.key, q.names]));

/** The quantity names for a dimension ('pressure', 'stress'), or [] when it has no common name. */
export function quantityNames(d: Dimension): readonly string[] {
  return BY_KEY.get(d.key) ?? [];
}

/**
 * A phrase for messages: 'a pressure or stress (M L^-1 T^-2)', 'a dimensionless quantity',
 * 'of dimension L^5 T^-1' when the dimension has no common name.
 */
export function describeDimension(d: Dimension): string {
  const names = quantityNames(d);
  if (d.isDimensionless()) return 'dimensionless';
  if (names.length === 0) return `of dimension ${d.toString()}`;
  const first = names[0]!;
  const article = /^[aeiou]/i.test(first) ? 'an' : 'a';
  return `${article} ${names.join(' or ')} (${d.toString()})`;
}
