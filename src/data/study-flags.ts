import { InputError, type SourceSpan, type WarningSink } from '../common/errors.js';
import { checkUserName, parseFormula, type FunctionTable } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import { parseQuantityText } from './quantity-text.js';
import { checkStudyNames } from './study.js';
import type { LocatedFormula, NamedFormula, Study, StudyConstant } from './study-types.js';

/**
 * Command-line flags that say what a study file says, for a quick run: `--const D="0.5 in"`,
 * `--derive U="4*Q/(pi*D^2)"`, `--group Re=rho*U*D/mu`, `--where "Re > 4000"`. They extend a
 * study (or make one); a flag that redefines a study item replaces it, with a warning.
 */

export interface StudyFlags {
  readonly constants?: readonly string[];
  readonly derive?: readonly string[];
  readonly group?: readonly string[];
}

const FILE = 'command line';

/**
 * An empty study, to which flags are added when no study file is given.
 * @example emptyStudy().file // => 'command line'
 */
export function emptyStudy(): Study {
  return { file: FILE, title: null, data: [], constants: [], derived: [], groups: [], fit: null, compare: null, uncertainty: [] };
}

/**
 * The study with the flags applied.
 * @throws {InputError} 'usage' for an argument that is not NAME=TEXT; 'study-constant', unit and
 *   formula kinds at their column within the flag (file 'command line'); 'study-duplicate-name'.
 * @param functions what the formulas may call (default: built-in functions and fluid properties)
 * @example applyStudyFlags(emptyStudy(), { group: ['Re=rho*U*D/mu'] }).groups[0].name // => 'Re'
 */
export function applyStudyFlags(study: Study, flags: StudyFlags, sink: WarningSink, functions: FunctionTable = PROPERTY_FUNCTIONS): Study {
  let constants = [...study.constants];
  let derived = [...study.derived];
  let groups = [...study.groups];
  for (const arg of flags.constants ?? []) {
    const c = constantFlag(arg, sink, functions);
    const earlier = constants.find((k) => k.name === c.name);
    if (earlier !== undefined) sink.warn({ code: 'constant-overridden', message: overrideMessage(c.name, earlier.text, c.text, earlier.where), where: c.where });
    constants = [...constants.filter((k) => k.name !== c.name), c];
  }
  for (const arg of flags.derive ?? []) derived = replaceNamed(derived, formulaFlag('--derive', arg, functions), sink);
  for (const arg of flags.group ?? []) groups = replaceNamed(groups, formulaFlag('--group', arg, functions), sink);
  const result: Study = { ...study, constants, derived, groups };
  checkStudyNames(result);
  return result;
}

/**
 * A `--where` condition, parsed (its kind is checked against the data by the plan).
 * @throws {InputError} formula kinds at their column within the flag.
 * @example whereFlag('Re > 4000').formula.text // => 'Re > 4000'
 */
export function whereFlag(text: string, functions: FunctionTable = PROPERTY_FUNCTIONS): LocatedFormula {
  const flagText = `--where ${text}`;
  const where: SourceSpan = { file: FILE, column: '--where '.length + 1, text: flagText };
  try {
    return { formula: parseFormula(text, { functions }), where, columnsExact: true };
  } catch (e) {
    if (e instanceof InputError) throw e.relocate(where);
    throw e;
  }
}

function splitFlag(
  flag: string,
  arg: string,
  example: string,
  functions: FunctionTable,
): { name: string; value: string; where: SourceSpan; valueWhere: SourceSpan } {
  const text = `${flag} ${arg}`;
  const eq = arg.indexOf('=');
  const base = flag.length + 2;
  if (eq <= 0) throw new InputError(DATA_ERROR.flag, dataMessages.commandLineFlag(flag, arg, example), { file: FILE, column: base, text });
  const name = arg.slice(0, eq).trim();
  const where: SourceSpan = { file: FILE, column: base, endColumn: base + eq, text };
  checkUserName(name, where, functions);
  return { name, value: arg.slice(eq + 1), where, valueWhere: { file: FILE, column: base + eq + 1, text } };
}

function constantFlag(arg: string, sink: WarningSink, functions: FunctionTable): StudyConstant {
  const { name, value, where, valueWhere } = splitFlag('--const', arg, '"VALUE UNIT", as in D="0.5 in"', functions);
  try {
    const q = parseQuantityText(value, DATA_ERROR.studyConstant, sink);
    return { name, valueSI: q.valueSI, text: value.trim(), unit: q.unit, where, origin: 'command line' };
  } catch (e) {
    if (e instanceof InputError) throw e.relocate(valueWhere);
    throw e;
  }
}

function formulaFlag(flag: '--derive' | '--group', arg: string, functions: FunctionTable): NamedFormula {
  const example = flag === '--derive' ? 'FORMULA, as in U="4*Q/(pi*D^2)"' : 'FORMULA, as in Re="rho*U*D/mu"';
  const { name, value, where, valueWhere } = splitFlag(flag, arg, example, functions);
  try {
    return { name, formula: parseFormula(value, { functions }), where: valueWhere, columnsExact: true, nameWhere: where, origin: 'command line' };
  } catch (e) {
    if (e instanceof InputError) throw e.relocate(valueWhere);
    throw e;
  }
}

function replaceNamed(items: NamedFormula[], item: NamedFormula, sink: WarningSink): NamedFormula[] {
  const earlier = items.find((k) => k.name === item.name);
  if (earlier === undefined) return [...items, item];
  sink.warn({ code: 'definition-overridden', message: overrideMessage(item.name, earlier.formula.text, item.formula.text, earlier.where), where: item.nameWhere });
  return items.map((k) => (k.name === item.name ? item : k));
}

function overrideMessage(name: string, before: string, after: string, where: SourceSpan): string {
  const at = where.line === undefined ? '' : ` (${where.file ?? 'study'} line ${where.line})`;
  return `the command line sets ${name} = ${after}, replacing ${name} = ${before}${at}`;
}
