import { Rational } from '../common/rational.js';
import {
  FOOT_M,
  INCH_M,
  KILOGRAM_FORCE_N,
  MERCURY_DENSITY_CONVENTIONAL_KG_PER_M3,
  POUND_FORCE_N,
  STANDARD_ATMOSPHERE_PA,
  STANDARD_GRAVITY_M_PER_S2,
  WATER_DENSITY_CONVENTIONAL_KG_PER_M3,
} from './constants.js';
import { Dimension } from './dimension.js';
import { define, r, type UnitDefinition } from './definition.js';

const SP811 = 'NIST SP 811 (2008) B.9';
const PRESSURE = Dimension.of({ M: 1, L: -1, T: -2 });

/** Pressure of a conventional liquid column: rho x h x g_n (NIST SP 811 (2008) B.8, conventional units). */
function column(densityKgPerM3: Rational, heightM: Rational): Rational {
  return densityKgPerM3.mul(heightM).mul(STANDARD_GRAVITY_M_PER_S2);
}

const MERCURY = MERCURY_DENSITY_CONVENTIONAL_KG_PER_M3;
const WATER = WATER_DENSITY_CONVENTIONAL_KG_PER_M3;
const MM = r('0.001');
const CM = r('0.01');

/**
 * Pressure units other than the pascal and the bar: pound-force per square inch, atmospheres and
 * the manometer units. Conventional liquid columns use g_n and the conventional densities
 * (mercury 13595.1 kg/m^3, water 1000 kg/m^3), NIST SP 811 (2008) B.8 and B.9.
 */
export const PRESSURE_UNITS: readonly UnitDefinition[] = [
  define({ symbol: 'psi', aliases: ['psia', 'psid'], name: 'pound-force per square inch', dimension: PRESSURE, factor: POUND_FORCE_N.div(INCH_M.powInt(2)), definition: '1 lbf/in^2 = 6894.757293168... Pa', source: `${SP811} ("6.894 757 E+03"), exact rational`, note: 'psia (absolute) and psid (differential) are the same unit; psig (gauge) is refused because it needs the ambient pressure.' }),
  define({ symbol: 'atm', name: 'standard atmosphere', dimension: PRESSURE, factor: STANDARD_ATMOSPHERE_PA, definition: '101325 Pa', source: `${SP811} ("1.013 25 E+05"), exact (10th CGPM 1954)` }),
  define({ symbol: 'at', name: 'technical atmosphere', dimension: PRESSURE, factor: KILOGRAM_FORCE_N.div(CM.powInt(2)), definition: '1 kgf/cm^2 = 98066.5 Pa', source: `${SP811} ("9.806 65 E+04"), exact` }),
  define({ symbol: 'torr', aliases: ['Torr'], name: 'torr', dimension: PRESSURE, factor: STANDARD_ATMOSPHERE_PA.div(Rational.of(760)), definition: '101325/760 Pa = 133.322368... Pa', source: `${SP811} ("1.333 224 E+02"), exact rational`, note: 'Differs from the conventional mmHg by 1.4e-7 relative.' }),
  define({ symbol: 'mmHg', name: 'millimetre of mercury, conventional', dimension: PRESSURE, factor: column(MERCURY, MM), definition: '13.5951 g/cm^3 x 1 mm x g_n = 133.322387415 Pa', source: `${SP811} ("1.333 224 E+02"), exact by convention`, note: 'Conventional mmHg; the torr (101325/760 Pa) is 1.4e-7 smaller.' }),
  define({ symbol: 'inHg', name: 'inch of mercury, conventional', dimension: PRESSURE, factor: column(MERCURY, INCH_M), definition: '13.5951 g/cm^3 x 25.4 mm x g_n = 3386.38864034 Pa', source: `${SP811} ("3.386 389 E+03"), conventional`, note: 'Conventional inHg; SP 811 also lists inHg at 32 degF (3386.38 Pa) and 60 degF (3376.85 Pa), not accepted here.' }),
  define({ symbol: 'inH2O', name: 'inch of water, conventional', dimension: PRESSURE, factor: column(WATER, INCH_M), definition: '1000 kg/m^3 x 25.4 mm x g_n = 249.08891 Pa', source: `${SP811} ("2.490 889 E+02"), exact by convention`, assumption: 'inH2O read as the conventional inch of water (1000 kg/m^3, g_n: 249.08891 Pa); water at 39.2 degF (4 degC) is inH2O_4C (249.082 Pa), at 60 degF inH2O_60F (248.84 Pa)', note: 'Conventional inch of water (1000 kg/m^3, g_n). inH2O_4C is water at 39.2 degF (4 degC), inH2O_60F water at 60 degF; they differ by up to 0.1 %.' }),
  define({ symbol: 'inH2O_4C', aliases: ['inH2O_39F'], name: 'inch of water at 39.2 degF (4 degC)', dimension: PRESSURE, factor: r('249.082'), definition: '249.082 Pa (NIST SP 811 listed value)', source: `${SP811} ("2.490 82 E+02"), SP 811's listed value used as exact`, note: 'SP 811 lists 249.082 Pa; water at 4 degC (999.972 kg/m^3) gives 249.08194 Pa. similis uses the listed value.' }),
  define({ symbol: 'inH2O_60F', name: 'inch of water at 60 degF', dimension: PRESSURE, factor: r('248.84'), definition: '248.84 Pa (NIST SP 811 listed value)', source: `${SP811} ("2.4884 E+02"), SP 811's listed value used as exact`, note: 'SP 811 lists 248.84 Pa; water at 60 degF (999.001 kg/m^3) gives 248.84007 Pa. similis uses the listed value.' }),
  define({ symbol: 'mmH2O', name: 'millimetre of water, conventional', dimension: PRESSURE, factor: column(WATER, MM), definition: '1000 kg/m^3 x 1 mm x g_n = 9.80665 Pa', source: `${SP811} ("9.806 65 E+00"), exact by convention` }),
  define({ symbol: 'cmH2O', name: 'centimetre of water, conventional', dimension: PRESSURE, factor: column(WATER, CM), definition: '1000 kg/m^3 x 1 cm x g_n = 98.0665 Pa', source: `${SP811} ("9.806 65 E+01"), exact by convention` }),
  define({ symbol: 'ftH2O', name: 'foot of water, conventional', dimension: PRESSURE, factor: column(WATER, FOOT_M), definition: '1000 kg/m^3 x 0.3048 m x g_n = 2989.06692 Pa', source: `${SP811} ("2.989 067 E+03"), exact by convention` }),
];
