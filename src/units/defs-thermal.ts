import { Rational } from '../common/rational.js';
import {
  BTU_IT_J,
  CALORIE_IT_J,
  CALORIE_TH_J,
  CELSIUS_ZERO_K,
  FAHRENHEIT_ZERO_R,
  FOOT_M,
  KILOGRAM_FORCE_N,
  POUND_FORCE_N,
  RANKINE_K,
} from './constants.js';
import { Dimension } from './dimension.js';
import { define, type UnitDefinition } from './definition.js';

const SP811 = 'NIST SP 811 (2008) B.9';
const TEMPERATURE = Dimension.of({ Θ: 1 });
const ENERGY = Dimension.of({ M: 1, L: 2, T: -2 });
const POWER = Dimension.of({ M: 1, L: 2, T: -3 });
const ONE = Rational.ONE;

const DIFFERENCE_NOTE = 'An explicit temperature difference: converts by scale only, never by offset.';

/** Temperature scales and differences, and the customary units of energy and power. */
export const THERMAL_UNITS: readonly UnitDefinition[] = [
  // Temperature: T/K = t/degC + 273.15; t/degC = (t/degF - 32)/1.8; T/K = (T/degR)/1.8 (SP 811 B.9).
  define({ symbol: 'degC', aliases: ['°C', '℃'], name: 'degree Celsius', dimension: TEMPERATURE, factor: ONE, offset: CELSIUS_ZERO_K, temperature: 'scale', definition: 'T/K = t/degC + 273.15', source: `${SP811}; SI Brochure 9th ed. (2019) 2.3.1, exact`, note: 'Alone: an absolute temperature (offset 273.15 K). Inside a compound unit (W/(m degC)) it is a difference of 1 K.' }),
  define({ symbol: 'degF', aliases: ['°F', '℉'], name: 'degree Fahrenheit', dimension: TEMPERATURE, factor: RANKINE_K, offset: FAHRENHEIT_ZERO_R, temperature: 'scale', definition: 'T/K = (t/degF + 459.67)/1.8', source: `${SP811}, exact`, note: 'Alone: an absolute temperature (32 degF = 273.15 K). Inside a compound unit it is a difference of 5/9 K.' }),
  define({ symbol: 'degR', aliases: ['°R'], name: 'degree Rankine', dimension: TEMPERATURE, factor: RANKINE_K, temperature: 'thermodynamic', definition: 'T/K = (T/degR)/1.8', source: `${SP811}, exact`, note: 'Zero at absolute zero, so like K a value is both a temperature and a difference.' }),
  define({ symbol: 'delta_degC', name: 'degree Celsius (difference)', dimension: TEMPERATURE, factor: ONE, temperature: 'difference', definition: '1 K (difference)', source: `${SP811}, exact`, note: DIFFERENCE_NOTE }),
  define({ symbol: 'delta_degF', name: 'degree Fahrenheit (difference)', dimension: TEMPERATURE, factor: RANKINE_K, temperature: 'difference', definition: '5/9 K (difference)', source: `${SP811}, exact`, note: DIFFERENCE_NOTE }),
  define({ symbol: 'delta_K', name: 'kelvin (difference)', dimension: TEMPERATURE, factor: ONE, temperature: 'difference', definition: '1 K (difference)', source: 'SI Brochure 9th ed. (2019) Table 2', note: DIFFERENCE_NOTE }),
  define({ symbol: 'delta_degR', name: 'degree Rankine (difference)', dimension: TEMPERATURE, factor: RANKINE_K, temperature: 'difference', definition: '5/9 K (difference)', source: `${SP811}, exact`, note: DIFFERENCE_NOTE }),
  // Energy.
  define({ symbol: 'cal', aliases: ['cal_IT'], name: 'calorie (International Table)', dimension: ENERGY, factor: CALORIE_IT_J, definition: '4.1868 J', source: `${SP811} ("4.1868 E+00"), exact`, assumption: 'cal read as the International Table calorie (4.1868 J); the thermochemical calorie (4.184 J) is cal_th', note: 'International Table calorie; the thermochemical calorie (4.184 J) is cal_th.' }),
  define({ symbol: 'cal_th', name: 'calorie (thermochemical)', dimension: ENERGY, factor: CALORIE_TH_J, definition: '4.184 J', source: `${SP811} ("4.184 E+00"), exact` }),
  define({ symbol: 'kcal', aliases: ['kcal_IT'], name: 'kilocalorie (International Table)', dimension: ENERGY, factor: CALORIE_IT_J.mul(Rational.of(1000)), definition: '4186.8 J', source: `${SP811} ("4.1868 E+03"), exact`, assumption: 'kcal read as the International Table kilocalorie (4186.8 J); the thermochemical one (4184 J) is kcal_th', note: 'International Table kilocalorie; kcal_th is the thermochemical one (4184 J).' }),
  define({ symbol: 'kcal_th', name: 'kilocalorie (thermochemical)', dimension: ENERGY, factor: CALORIE_TH_J.mul(Rational.of(1000)), definition: '4184 J', source: `${SP811} ("4.184 E+03"), exact` }),
  define({ symbol: 'BTU', aliases: ['Btu', 'BTU_IT', 'Btu_IT'], name: 'British thermal unit (International Table)', dimension: ENERGY, factor: BTU_IT_J, definition: '1055.05585262 J (4.1868 J/g x 453.59237 g x 5/9)', source: `${SP811} ("1.055 056 E+03"), exact from cal_IT and lb` }),
  define({ symbol: 'Wh', name: 'watt hour', dimension: ENERGY, factor: Rational.of(3600), prefixable: true, definition: '3600 J (1 kWh = 3.6 MJ)', source: `${SP811} ("3.6 E+06" for kWh), exact` }),
  // Power.
  define({ symbol: 'hp', aliases: ['hp_mech'], name: 'horsepower (mechanical)', dimension: POWER, factor: FOOT_M.mul(POUND_FORCE_N).mul(Rational.of(550)), definition: '550 ft lbf/s = 745.69987158227022 W', source: `${SP811} ("7.456 999 E+02"), exact`, assumption: 'hp read as the mechanical horsepower (550 ft lbf/s = 745.6999 W); metric horsepower is hp_metric (735.49875 W), electric hp_electric (746 W)', note: 'Mechanical horsepower; hp_metric is 75 kgf m/s, hp_electric is 746 W.' }),
  define({ symbol: 'hp_metric', name: 'horsepower (metric)', dimension: POWER, factor: KILOGRAM_FORCE_N.mul(Rational.of(75)), definition: '75 kgf m/s = 735.49875 W', source: `${SP811} ("7.354 988 E+02"), exact` }),
  define({ symbol: 'hp_electric', name: 'horsepower (electric)', dimension: POWER, factor: Rational.of(746), definition: '746 W', source: `${SP811} ("7.46 E+02"), exact` }),
];
