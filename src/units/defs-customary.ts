import { Rational } from '../common/rational.js';
import {
  FOOT_M,
  INCH_M,
  KILOGRAM_FORCE_N,
  POUND_FORCE_N,
  POUND_KG,
  UK_GALLON_M3,
  US_GALLON_M3,
} from './constants.js';
import { Dimension } from './dimension.js';
import { define, type UnitDefinition } from './definition.js';

const SP811 = 'NIST SP 811 (2008) B.9';
const D = Dimension.of;
const int = (n: number): Rational => Rational.of(n);

const LENGTH = D({ L: 1 });
const VOLUME = D({ L: 3 });
const MASS = D({ M: 1 });
const FORCE = D({ M: 1, L: 1, T: -2 });
const VOLUME_FLOW = D({ L: 3, T: -1 });
const VELOCITY = D({ L: 1, T: -1 });

const MINUTE_S = int(60);
const HOUR_S = int(3600);

/**
 * US customary and imperial units of length, volume, mass and force, and the rig spellings of
 * flows and speeds. All exact from the 1959 yard and pound (NIST SP 811 (2008) B.9).
 */
export const CUSTOMARY_UNITS: readonly UnitDefinition[] = [
  define({ symbol: 'in', name: 'inch', dimension: LENGTH, factor: INCH_M, definition: '0.0254 m', source: `${SP811} ("2.54 E-02"), exact` }),
  define({ symbol: 'ft', name: 'foot', dimension: LENGTH, factor: FOOT_M, definition: '12 in = 0.3048 m', source: `${SP811} ("3.048 E-01"), exact`, note: 'The international foot; the US survey foot (1200/3937 m) is a different unit and is not accepted.' }),
  define({ symbol: 'yd', name: 'yard', dimension: LENGTH, factor: FOOT_M.mul(int(3)), definition: '3 ft = 0.9144 m', source: `${SP811} ("9.144 E-01"), exact` }),
  define({ symbol: 'mi', name: 'mile (international)', dimension: LENGTH, factor: FOOT_M.mul(int(5280)), definition: '5280 ft = 1609.344 m', source: `${SP811} ("1.609 344 E+03"), exact` }),
  // Volume.
  define({ symbol: 'gal', aliases: ['gal_US'], name: 'gallon (US liquid)', dimension: VOLUME, factor: US_GALLON_M3, definition: '231 in^3 = 3.785411784e-3 m^3', source: `${SP811} ("3.785 412 E-03"), exact from 231 in^3`, assumption: 'gal read as the US liquid gallon (231 in^3 = 3.785411784 L); for the imperial gallon (4.54609 L) write gal_UK', note: 'US liquid gallon; the UK (imperial) gallon is gal_UK.' }),
  define({ symbol: 'gal_UK', aliases: ['gal_imp'], name: 'gallon (UK, imperial)', dimension: VOLUME, factor: UK_GALLON_M3, definition: '4.54609 L', source: `${SP811} ("4.546 09 E-03"), exact (UK Weights and Measures Act 1985)` }),
  // Mass.
  define({ symbol: 'lb', aliases: ['lbm'], name: 'pound (avoirdupois)', dimension: MASS, factor: POUND_KG, definition: '0.45359237 kg', source: `${SP811} ("4.535 924 E-01"), exact by the 1959 definition` }),
  define({ symbol: 'slug', name: 'slug', dimension: MASS, factor: POUND_FORCE_N.div(FOOT_M), definition: '1 lbf s^2/ft = 14.5939029372... kg', source: `${SP811} ("1.459 390 E+01"), exact rational from lbf and ft` }),
  // Force.
  define({ symbol: 'lbf', name: 'pound-force', dimension: FORCE, factor: POUND_FORCE_N, definition: '0.45359237 kg x 9.80665 m s^-2 = 4.4482216152605 N', source: `${SP811} ("4.448 222 E+00"), exact` }),
  define({ symbol: 'kgf', name: 'kilogram-force', dimension: FORCE, factor: KILOGRAM_FORCE_N, definition: '1 kg x 9.80665 m s^-2 = 9.80665 N', source: `${SP811} ("9.806 65 E+00"), exact` }),
  // Rig spellings of flows and speeds.
  define({ symbol: 'gpm', name: 'US gallon per minute', dimension: VOLUME_FLOW, factor: US_GALLON_M3.div(MINUTE_S), definition: '1 gal/min = 6.30901964e-5 m^3 s^-1', source: `${SP811} (gallon and minute), exact`, assumption: 'gpm read as US gallons per minute (3.785411784 L/min); for imperial gallons write gal_UK/min' }),
  define({ symbol: 'lpm', name: 'litre per minute', dimension: VOLUME_FLOW, factor: Rational.of(1, 60000), definition: '1 L/min = 1/60000 m^3 s^-1', source: 'SI Brochure 9th ed. (2019) Table 8 (litre, minute), exact' }),
  define({ symbol: 'cfm', name: 'cubic foot per minute', dimension: VOLUME_FLOW, factor: FOOT_M.powInt(3).div(MINUTE_S), definition: '1 ft^3/min = 4.719474432e-4 m^3 s^-1', source: `${SP811} (foot and minute), exact`, note: 'Actual volume flow; standard (scfm) flows need reference conditions and are refused.' }),
  define({ symbol: 'fps', name: 'foot per second', dimension: VELOCITY, factor: FOOT_M, definition: '1 ft/s = 0.3048 m s^-1', source: `${SP811} ("3.048 E-01"), exact` }),
  define({ symbol: 'mph', name: 'mile per hour', dimension: VELOCITY, factor: FOOT_M.mul(int(5280)).div(HOUR_S), definition: '1 mi/h = 0.44704 m s^-1', source: `${SP811} ("4.4704 E-01"), exact` }),
  define({ symbol: 'rpm', name: 'revolution per minute', dimension: D({ T: -1 }), factor: Rational.of(1, 60), angle: 'revolution', definition: '1/60 s^-1 (revolutions per second / 60)', source: 'SI Brochure 9th ed. (2019) Table 8 (minute); revolution counted as 1', note: 'Converts to s^-1 (revolutions per second). An angular velocity in rad/s needs the factor 2*pi rad per revolution; the radian is dimensionless in the SI, so similis refuses to convert rpm to rad/s silently: convert to s^-1 and multiply by 2*pi in a formula.' }),
];
