/**
 * IAPWS-IF97 region 4: the saturation-pressure equation, used here only to decide whether a state
 * is liquid (the lower pressure bound of region 1 is p_s(T)).
 *
 * Source: IAPWS R7-97(2012), section 8.1, eq. (30) with the coefficients of Table 34; checked
 * against a stored open implementation (R package `pipenostics`, `R/if97pt.R`). Range of the
 * equation: 273.15 K <= T <= 647.096 K.
 */

// IAPWS R7-97(2012), Table 34: n_1 .. n_10 of eqs. (28)-(31).
const N1 = 0.11670521452767e4;
const N2 = -0.72421316703206e6;
const N3 = -0.17073846940092e2;
const N4 = 0.12020824702470e5;
const N5 = -0.32325550322333e7;
const N6 = 0.14915108613530e2;
const N7 = -0.48232657361591e4;
const N8 = 0.40511340542057e6;
const N9 = -0.23855557567849;
const N10 = 0.65017534844798e3;

/**
 * Saturation pressure of water, Pa, from the temperature in K (IAPWS R7-97(2012), eq. 30:
 * p_s/p* = [2C / (-B + (B^2 - 4AC)^0.5)]^4 with p* = 1 MPa). No range check: the equation is
 * smooth a little outside 273.15 K to 647.096 K, and callers decide what they accept.
 * @example saturationPressurePa(300) // => 3536.58941 (IF97 Table 35: 0.353658941e-2 MPa)
 */
export function saturationPressurePa(temperatureK: number): number {
  const theta = temperatureK + N9 / (temperatureK - N10);
  const a = theta * theta + N1 * theta + N2;
  const b = N3 * theta * theta + N4 * theta + N5;
  const c = N6 * theta * theta + N7 * theta + N8;
  const ratio = (2 * c) / (-b + Math.sqrt(b * b - 4 * a * c));
  return ratio ** 4 * 1e6;
}
