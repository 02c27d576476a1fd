import { Rational } from '../common/rational.js';

/**
 * Exact defining constants behind the customary units. Each is exact by the definition cited;
 * every derived factor in the unit tables is built from these with exact rational arithmetic.
 */

const dec = (s: string): Rational => Rational.parse(s);

/** 1 in = 0.0254 m exactly: international yard and pound agreement (1959); NIST SP 811 (2008) B.9. */
export const INCH_M = dec('0.0254');
/** 1 ft = 12 in = 0.3048 m exactly: NIST SP 811 (2008) B.9. */
export const FOOT_M = INCH_M.mul(Rational.of(12));
/** 1 lb (avoirdupois) = 0.45359237 kg exactly: 1959 agreement; NIST SP 811 (2008) B.9 footnote. */
export const POUND_KG = dec('0.45359237');
/** Standard acceleration of gravity g_n = 9.80665 m/s^2 exactly: 3rd CGPM (1901); NIST SP 811 (2008) B.8. */
export const STANDARD_GRAVITY_M_PER_S2 = dec('9.80665');
/** 1 lbf = 1 lb x g_n = 4.4482216152605 N exactly: NIST SP 811 (2008) B.9. */
export const POUND_FORCE_N = POUND_KG.mul(STANDARD_GRAVITY_M_PER_S2);
/** 1 kgf = 1 kg x g_n = 9.80665 N exactly: NIST SP 811 (2008) B.9. */
export const KILOGRAM_FORCE_N = STANDARD_GRAVITY_M_PER_S2;
/** 1 US gallon = 231 in^3 = 3.785411784e-3 m^3 exactly: NIST SP 811 (2008) B.9. */
export const US_GALLON_M3 = INCH_M.powInt(3).mul(Rational.of(231));
/** 1 UK (imperial) gallon = 4.54609 L exactly: UK Weights and Measures Act 1985; NIST SP 811 (2008) B.9. */
export const UK_GALLON_M3 = dec('0.00454609');
/** 1 atm = 101325 Pa exactly: 10th CGPM (1954); NIST SP 811 (2008) B.9. */
export const STANDARD_ATMOSPHERE_PA = Rational.of(101325);
/** Conventional density of mercury 13.5951 g/cm^3 = 13595.1 kg/m^3: NIST SP 811 (2008) B.8 note (conventional mmHg). */
export const MERCURY_DENSITY_CONVENTIONAL_KG_PER_M3 = dec('13595.1');
/** Conventional density of water 1000 kg/m^3 (conventional inch/mm of water): NIST SP 811 (2008) B.8 note. */
export const WATER_DENSITY_CONVENTIONAL_KG_PER_M3 = Rational.of(1000);
/** International Table calorie = 4.1868 J exactly: 5th Int. Conf. on Properties of Steam (1956); NIST SP 811 (2008) B.9. */
export const CALORIE_IT_J = dec('4.1868');
/** Thermochemical calorie = 4.184 J exactly: NIST SP 811 (2008) B.9. */
export const CALORIE_TH_J = dec('4.184');
/** 1 Btu_IT / lb / degF = 1 cal_IT / g / degC, so Btu_IT = 4.1868 J/g x 453.59237 g x 5/9 = 1055.05585262 J: NIST SP 811 (2008) B.9. */
export const BTU_IT_J = CALORIE_IT_J.mul(dec('453.59237')).mul(Rational.of(5, 9));
/** 1 degF difference = 1 degR = 5/9 K exactly: NIST SP 811 (2008) B.9 (t/degC = (t/degF - 32)/1.8). */
export const RANKINE_K = Rational.of(5, 9);
/** 0 degC = 273.15 K exactly: NIST SP 811 (2008) B.9; SI Brochure 9th ed. (2019) 2.3.1. */
export const CELSIUS_ZERO_K = dec('273.15');
/** 0 degF = 459.67 degR exactly (so 32 degF = 491.67 degR = 273.15 K): NIST SP 811 (2008) B.9. */
export const FAHRENHEIT_ZERO_R = dec('459.67');
