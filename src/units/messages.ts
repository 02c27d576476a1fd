/**
 * Every message the unit engine shows, in one place so that wording stays consistent. Messages
 * never contain columns (those travel in the SourceSpan, which a caller may relocate).
 */

/** 'U+0007' for a code point. */
export function codePoint(ch: string): string {
  return `U+${(ch.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}`;
}

export const unitMessages = {
  // Whole-text problems.
  empty: (): string => 'the unit is empty: write a unit such as kPa, or 1 for a dimensionless value',
  tooLong: (length: number, max: number): string =>
    `the unit text is ${length} characters long; at most ${max} are accepted`,
  controlCharacter: (ch: string): string => `control character ${codePoint(ch)} in the unit`,
  unexpectedCharacter: (ch: string): string => `unexpected character '${ch}' (${codePoint(ch)}) in the unit`,

  // Syntax.
  expected: (expected: string, found: string): string => `expected ${expected}, found ${found}`,
  numberNotUnit: (num: string): string =>
    `the number ${num} is not a unit: only 1 is accepted, alone or as the numerator of 1/unit ` +
    `(write scale factors as prefixes: mm, not 0.001 m)`,
  unmatchedClose: (): string => `found ')' with no '(' before it`,
  unclosedOpen: (found: string): string => `expected ')' to close the '(', found ${found}`,
  ambiguousProduct: (text: string, den: string, next: string): string =>
    `'${text}' is ambiguous: a product after '/' needs parentheses (SI Brochure 9th ed., 5.4.6); ` +
    `write .../(${den} ${next}) if ${next} is in the denominator, or put ${next} before the '/' if it is not`,

  // Exponents.
  exponentMissing: (found: string): string =>
    `expected an exponent (an integer such as 2 or -1, a decimal such as 0.5, or a fraction in ` +
    `parentheses such as (1/2)), found ${found}`,
  exponentNotConstant: (name: string): string =>
    `an exponent must be a number, found the name '${name}' (a unit cannot have a variable exponent)`,
  exponentZeroDenominator: (text: string): string => `the exponent ${text} divides by zero`,
  exponentOutOfRange: (text: string, max: number): string =>
    `the exponent ${text} is out of range (numerator and denominator at most ${max} in size)`,
  exponentTwice: (text: string): string =>
    `'${text}' is followed by a second exponent: write the power once (m^6) or use parentheses ((m^2)^3)`,
  digitsAndExponent: (name: string, digits: string): string =>
    `'${name}' already has the exponent ${digits} from its trailing digits, and a second exponent follows: ` +
    `write the power once (m^6) or use parentheses ((m^2)^3)`,
  exponentZeroDigits: (name: string): string =>
    `'${name}' ends in 0, which would be the exponent 0; write the unit without it`,

  // Names.
  unknown: (name: string): string => `unknown unit '${name}'`,
  lonePrefix: (name: string, prefixName: string): string =>
    `'${name}' is the prefix ${prefixName} without a unit (write e.g. ${name}m or ${name}s)`,
  seeList: (): string => 'similis units --list shows the known units and how to write them',
  didYouMean: (suggestions: readonly string[]): string => `did you mean ${suggestions.join(', ')}?`,
  caseMatters: (name: string, suggestions: readonly string[]): string =>
    `unit symbols are case-sensitive ('${name}' is not known); did you mean ${suggestions.join(', ')}?`,
  prefixNotAllowed: (written: string, prefixSymbol: string, prefixName: string, unit: string, unitName: string): string =>
    `'${written}': the prefix ${prefixSymbol} (${prefixName}) cannot go on ${unit} (${unitName}), which takes no SI prefix: write it without the prefix, or use an SI unit`,
  gaugePressure: (name: string, base: string): string =>
    `${name} is a gauge pressure (measured above the ambient pressure), which no unit factor can make ` +
    `absolute: give the column in ${base} and treat it as a pressure difference from the ambient, or ` +
    `add the ambient pressure in a derived quantity`,
  standardVolume: (name: string, base: string): string =>
    `${name} is a standard (reference-condition) gas volume, whose reference temperature and pressure ` +
    `differ between standards; convert it with its reference conditions, or write ${base} for an actual volume`,

  // Temperatures.
  temperaturePower: (symbol: string, diff: string): string =>
    `${symbol} is an absolute temperature and cannot be raised to a power; inside compound units ` +
    `temperatures are differences: write ${diff}^n (or K^n) for a power of a temperature difference`,
  temperaturePrefix: (written: string, symbol: string, diff: string): string =>
    `'${written}': a prefix cannot go on ${symbol}, an offset temperature scale; inside compound units ` +
    `temperatures are differences: write ${diff} for a difference, or a prefixed kelvin such as mK`,
  temperatureSpaced: (written: string): string =>
    `'${written}' reads as a degree of angle times another unit; for a temperature write degC, degF, ` +
    `°C or °F with no space`,

  // Conversions.
  incompatible: (from: string, fromWords: string, to: string, toWords: string): string =>
    `cannot convert ${from} to ${to}: ${from} is ${fromWords}, ${to} is ${toWords}`,
  temperatureKind: (from: string, fromKind: string, to: string, toKind: string): string =>
    `cannot convert ${from} to ${to}: ${from} is ${fromKind} and ${to} is ${toKind}; absolute ` +
    `temperatures convert to K, degC, degF or degR, differences to K, degR or delta_degC, delta_degF, delta_K, delta_degR`,
  angleBasis: (from: string, to: string): string =>
    `cannot convert ${from} to ${to}: one counts revolutions (rpm, Hz) and the other radians or degrees; ` +
    `1 revolution = 2*pi rad, and the SI counts both as dimensionless, so the factor would be lost: ` +
    `convert to s^-1 and multiply by 2*pi in a formula`,

  // Warnings.
  slashChain: (text: string, reading: string, better: string): string =>
    `'${text}' has more than one '/'; read left to right as ${reading} (write ${better} to avoid this warning)`,
  coulomb: (): string => `'C' is the coulomb (electric charge); for degrees Celsius write degC or °C`,
} as const;

/** How a token is named in "found ..." messages. */
export function describeFound(kind: string, text: string): string {
  switch (kind) {
    case 'end':
      return 'the end of the unit';
    case 'name':
      return `'${text}'`;
    case 'number':
      return `the number ${text}`;
    case 'space':
      return 'a space';
    default:
      return `'${text}'`;
  }
}
