import type { SourceSpan } from '../common/errors.js';
import { InputError } from '../common/errors.js';
import { FORMULA_ERROR } from './errors.js';
import type { FunctionTable } from './functions.js';
import { BUILTIN_FUNCTIONS } from './functions.js';
import { msg } from './messages.js';

/**
 * Names that user columns, constants and parameters may not take, because a formula could not
 * refer to them (a column named `exp` would be shadowed by the function, one named `and` could
 * not be written at all).
 */

/** The words of the formula language. */
export const KEYWORDS: readonly string[] = ['and', 'or', 'not'];

/** The named constants of the formula language. */
export const CONSTANT_NAMES: readonly string[] = ['pi'];

/** Spellings refused as functions with advice (log is ambiguous), reserved so they stay refusable. */
export const REFUSED_FUNCTION_NAMES: readonly string[] = ['log'];

/** Every reserved name with the built-in functions: keywords, pi, log and the function names. */
export const RESERVED_NAMES: ReadonlySet<string> = new Set([
  ...KEYWORDS,
  ...CONSTANT_NAMES,
  ...REFUSED_FUNCTION_NAMES,
  ...BUILTIN_FUNCTIONS.names(),
]);

const NAME_PATTERN = /^[\p{L}_][\p{L}\p{Nd}\p{M}_]*$/u;

/**
 * Whether text can be written as a name in a formula: a letter (any script) or _, then letters,
 * digits or _. @example isValidName('ρ_w') // => true; isValidName('L/D') // => false
 */
export function isValidName(name: string): boolean {
  return NAME_PATTERN.test(name);
}

/**
 * Whether a user name would shadow a keyword, `pi`, `log` or a function of the table.
 * @example isReservedName('exp') // => true; isReservedName('Re') // => false
 */
export function isReservedName(name: string, functions: FunctionTable = BUILTIN_FUNCTIONS): boolean {
  return RESERVED_NAMES.has(name) || functions.has(name);
}

/**
 * Refuses a name for a column, constant or parameter that a formula could not use.
 * @throws {InputError} kind 'formula-reserved-name' for `exp`, `pi`, `and`...; kind
 *   'formula-invalid-name' for text that is not a name ('L/D', '2x', ''). `where` locates it.
 * @example checkUserName('pi', { file: 'rig.csv', line: 3, column: 5 }) // throws formula-reserved-name
 */
export function checkUserName(name: string, where: SourceSpan = {}, functions: FunctionTable = BUILTIN_FUNCTIONS): void {
  if (!isValidName(name)) throw new InputError(FORMULA_ERROR.invalidName, msg.invalidName(name), where);
  if (isReservedName(name, functions)) {
    const what = KEYWORDS.includes(name)
      ? 'a keyword'
      : CONSTANT_NAMES.includes(name)
        ? 'a constant'
        : 'a function name';
    throw new InputError(FORMULA_ERROR.reservedName, msg.reservedName(name, what), where);
  }
}
