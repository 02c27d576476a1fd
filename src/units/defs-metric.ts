import { Rational } from '../common/rational.js';
import { Dimension } from './dimension.js';
import { define, r, type UnitDefinition } from './definition.js';
import { Scale } from './scale.js';

const SI = 'SI Brochure 9th ed. (2019)';
const ONE = Rational.ONE;
const D = Dimension.of;

/**
 * SI base and derived units, the units accepted for use with the SI, and the dimensionless
 * counting units. Base units: SI Brochure 9th ed. (2019) Table 2; derived: Table 4; accepted:
 * Table 8; CGS viscosity units: NIST SP 811 (2008) B.9.
 */
export const METRIC_UNITS: readonly UnitDefinition[] = [
  // SI base units (SI Brochure 9th ed. Table 2); the kilogram is the gram with the prefix k.
  define({ symbol: 'm', name: 'metre', dimension: D({ L: 1 }), factor: ONE, prefixable: true, definition: 'SI base unit of length', source: `${SI} Table 2` }),
  define({ symbol: 'g', name: 'gram', dimension: D({ M: 1 }), factor: r('0.001'), prefixable: true, definition: '0.001 kg (the kilogram is the SI base unit)', source: `${SI} Table 2 and 3.2` }),
  define({ symbol: 's', name: 'second', dimension: D({ T: 1 }), factor: ONE, prefixable: true, definition: 'SI base unit of time', source: `${SI} Table 2` }),
  define({ symbol: 'A', name: 'ampere', dimension: D({ I: 1 }), factor: ONE, prefixable: true, definition: 'SI base unit of electric current', source: `${SI} Table 2` }),
  define({ symbol: 'K', name: 'kelvin', dimension: D({ Θ: 1 }), factor: ONE, prefixable: true, temperature: 'thermodynamic', definition: 'SI base unit of thermodynamic temperature', source: `${SI} Table 2` }),
  define({ symbol: 'mol', name: 'mole', dimension: D({ N: 1 }), factor: ONE, prefixable: true, definition: 'SI base unit of amount of substance', source: `${SI} Table 2` }),
  define({ symbol: 'cd', name: 'candela', dimension: D({ J: 1 }), factor: ONE, prefixable: true, definition: 'SI base unit of luminous intensity', source: `${SI} Table 2` }),
  // Coherent derived units with special names (SI Brochure 9th ed. Table 4).
  define({ symbol: 'N', name: 'newton', dimension: D({ M: 1, L: 1, T: -2 }), factor: ONE, prefixable: true, definition: '1 kg m s^-2', source: `${SI} Table 4` }),
  define({ symbol: 'Pa', name: 'pascal', dimension: D({ M: 1, L: -1, T: -2 }), factor: ONE, prefixable: true, definition: '1 N m^-2', source: `${SI} Table 4` }),
  define({ symbol: 'J', name: 'joule', dimension: D({ M: 1, L: 2, T: -2 }), factor: ONE, prefixable: true, definition: '1 N m', source: `${SI} Table 4` }),
  define({ symbol: 'W', name: 'watt', dimension: D({ M: 1, L: 2, T: -3 }), factor: ONE, prefixable: true, definition: '1 J s^-1', source: `${SI} Table 4` }),
  define({ symbol: 'Hz', name: 'hertz', dimension: D({ T: -1 }), factor: ONE, prefixable: true, angle: 'revolution', definition: '1 s^-1 (cycles per second)', source: `${SI} Table 4`, note: 'The hertz is for periodic phenomena (cycles per second); an angular velocity in rad/s is 2*pi times the frequency in Hz, so similis refuses to convert between Hz and rad/s.' }),
  define({ symbol: 'V', name: 'volt', dimension: D({ M: 1, L: 2, T: -3, I: -1 }), factor: ONE, prefixable: true, definition: '1 W A^-1', source: `${SI} Table 4` }),
  define({ symbol: 'C', name: 'coulomb', dimension: D({ T: 1, I: 1 }), factor: ONE, prefixable: true, definition: '1 A s', source: `${SI} Table 4`, note: 'C alone is the coulomb (electric charge), not degrees Celsius: write degC or °C for those.' }),
  define({ symbol: 'ohm', aliases: ['\u03A9', '\u2126'], name: 'ohm', dimension: D({ M: 1, L: 2, T: -3, I: -2 }), factor: ONE, prefixable: true, definition: '1 V A^-1', source: `${SI} Table 4` }),
  define({ symbol: 'rad', name: 'radian', dimension: Dimension.NONE, factor: ONE, angle: 'radian', definition: '1 m/m (dimensionless)', source: `${SI} Table 4`, note: 'The radian is dimensionless in the SI; similis keeps angles apart from revolutions (rpm, Hz) in conversions.' }),
  // Non-SI units accepted for use with the SI (SI Brochure 9th ed. Table 8).
  define({ symbol: 'min', name: 'minute', dimension: D({ T: 1 }), factor: Rational.of(60), definition: '60 s', source: `${SI} Table 8` }),
  define({ symbol: 'h', aliases: ['hr'], name: 'hour', dimension: D({ T: 1 }), factor: Rational.of(3600), definition: '3600 s', source: `${SI} Table 8` }),
  define({ symbol: 'd', aliases: ['day'], name: 'day', dimension: D({ T: 1 }), factor: Rational.of(86400), definition: '86400 s', source: `${SI} Table 8` }),
  define({ symbol: 'L', aliases: ['l'], name: 'litre', dimension: D({ L: 3 }), factor: r('0.001'), prefixable: true, definition: '1 dm^3 = 0.001 m^3', source: `${SI} Table 8` }),
  define({ symbol: 't', aliases: ['tonne'], name: 'tonne (metric ton)', dimension: D({ M: 1 }), factor: Rational.of(1000), definition: '1000 kg', source: `${SI} Table 8`, note: 'similis takes no prefixes on the tonne (write Mg, not kt).' }),
  define({ symbol: 'deg', aliases: ['°'], name: 'degree (angle)', dimension: Dimension.NONE, factor: Scale.withPi(Rational.of(1, 180), 1), angle: 'radian', definition: '(pi/180) rad', source: `${SI} Table 8`, note: 'Not exact as a number (pi/180); deg to rad conversions carry pi exactly until the last step. ° alone is the degree of angle; °C is degrees Celsius.' }),
  define({ symbol: 'bar', name: 'bar', dimension: D({ M: 1, L: -1, T: -2 }), factor: Rational.of(100000), prefixable: true, definition: '100000 Pa', source: 'NIST SP 811 (2008) B.9 ("1.0 E+05")' }),
  // CGS viscosity units (NIST SP 811 (2008) B.9).
  define({ symbol: 'P', name: 'poise', dimension: D({ M: 1, L: -1, T: -1 }), factor: r('0.1'), prefixable: true, definition: '0.1 Pa s (1 cP = 1 mPa s)', source: 'NIST SP 811 (2008) B.9 ("1.0 E-01")' }),
  define({ symbol: 'St', name: 'stokes', dimension: D({ L: 2, T: -1 }), factor: r('0.0001'), prefixable: true, definition: '1e-4 m^2 s^-1 (1 cSt = 1 mm^2 s^-1)', source: 'NIST SP 811 (2008) B.9 ("1.0 E-04")' }),
  define({ symbol: 'dyn', name: 'dyne', dimension: D({ M: 1, L: 1, T: -2 }), factor: r('0.00001'), definition: '1e-5 N', source: 'NIST SP 811 (2008) B.9 ("1.0 E-05")' }),
  // Dimensionless counting units.
  define({ symbol: '%', aliases: ['percent'], name: 'percent', dimension: Dimension.NONE, factor: r('0.01'), definition: '0.01', source: 'NIST SP 811 (2008) 7.10.2' }),
  define({ symbol: 'ppm', name: 'part per million', dimension: Dimension.NONE, factor: r('0.000001'), definition: '1e-6', source: 'common practice (NIST SP 811 (2008) 7.10.3 advises against it but it is in use)' }),
];
