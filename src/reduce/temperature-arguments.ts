import { InputError, type SourceSpan } from '../common/errors.js';
import { placeInside } from '../data/index.js';
import { childrenOf, nodeText, type ExprNode, type Formula, type FunctionTable } from '../expr/index.js';
import { propertyFunctionInfo } from '../properties/index.js';
import { REDUCE_ERROR } from './kinds.js';
import { reduceMessages } from './messages.js';

/**
 * Temperature arguments of the fluid properties must be absolute temperatures. The dimension
 * check cannot see it (a difference of 1 K and a temperature of 1 K have the same dimension, SI
 * Brochure 9th ed. 2.3.1), but the units can: a column logged in delta_degC is a difference, one
 * in degC or degF an absolute temperature, one in K either. The scale of an argument is followed
 * through + and - (absolute + difference is absolute, absolute - absolute is a difference: NIST
 * SP 811 (2008) 4.2.1.1 on Celsius temperature and temperature intervals) and through derived
 * quantities, so that `water_density(T_out - T_in)` is refused and `water_density(T + dT)` is not.
 */

/** What is known of a temperature-valued expression: an absolute temperature, a difference, or nothing certain. */
export type TemperatureScale = 'absolute' | 'difference' | 'unknown';

/** The scale of a name and, for a difference, why ('dT [delta_degC]'). */
export interface NamedScale {
  readonly scale: TemperatureScale;
  readonly why?: string;
}

interface Verdict {
  readonly scale: TemperatureScale;
  readonly why: string;
}

const UNKNOWN: Verdict = { scale: 'unknown', why: '' };

/**
 * The scale of an expression from the scales of its names.
 * @example scaleOf(parseFormula('T_out - T_in').root, text, () => ({ scale: 'absolute' })).scale // => 'difference'
 */
export function scaleOf(node: ExprNode, text: string, nameScale: (name: string) => NamedScale): Verdict {
  const formula: Formula = { text, root: node };
  switch (node.type) {
    case 'name': {
      const s = nameScale(node.name);
      return { scale: s.scale, why: s.why ?? node.name };
    }
    case 'unary': {
      // -dT is still a difference; the negative of an absolute temperature is nothing certain.
      const inner = node.op === 'neg' ? scaleOf(node.arg, text, nameScale) : UNKNOWN;
      return inner.scale === 'difference' ? inner : UNKNOWN;
    }
    case 'binary': {
      const a = scaleOf(node.left, text, nameScale);
      const b = scaleOf(node.right, text, nameScale);
      const whole = nodeText(formula, node) || 'the argument';
      if (node.op === '+') return sum(a, b, whole);
      if (node.op === '-') return difference(a, b, whole);
      // A difference scaled by a number stays a difference (2*dT, dT/2).
      if ((node.op === '*' || node.op === '/') && a.scale === 'difference' && node.right.type === 'num') return a;
      if (node.op === '*' && b.scale === 'difference' && node.left.type === 'num') return b;
      return UNKNOWN;
    }
    case 'call':
      if (['abs', 'min', 'max'].includes(node.fn)) {
        const args = node.args.map((x) => scaleOf(x, text, nameScale));
        const first = args[0];
        if (first !== undefined && args.every((x) => x.scale === first.scale)) return first;
      }
      return UNKNOWN;
    default:
      return UNKNOWN;
  }
}

function sum(a: Verdict, b: Verdict, whole: string): Verdict {
  if (a.scale === 'difference' && b.scale === 'difference') return { scale: 'difference', why: `${whole} adds two differences` };
  if ((a.scale === 'absolute' && b.scale === 'difference') || (a.scale === 'difference' && b.scale === 'absolute')) return { scale: 'absolute', why: '' };
  return UNKNOWN;
}

function difference(a: Verdict, b: Verdict, whole: string): Verdict {
  if (a.scale === 'absolute' && b.scale === 'absolute') return { scale: 'difference', why: `${whole} is a difference of two temperatures` };
  if (a.scale === 'difference' && b.scale === 'difference') return { scale: 'difference', why: `${whole} is a difference of two differences` };
  if (a.scale === 'absolute' && b.scale === 'difference') return { scale: 'absolute', why: '' };
  return UNKNOWN;
}

/**
 * Refuses a fluid-property call whose temperature argument is a temperature difference.
 * @throws {InputError} 'reduce-temperature-difference' at the argument, placed in the study file.
 * @example checkTemperatureArguments({ formula: parseFormula('water_density(dT)', ...), where, columnsExact: true },
 *   () => ({ scale: 'difference', why: 'dT [delta_degC]' }), PROPERTY_FUNCTIONS) // throws
 */
export function checkTemperatureArguments(
  at: { readonly formula: Formula; readonly where: SourceSpan; readonly columnsExact: boolean },
  nameScale: (name: string) => NamedScale,
  functions: FunctionTable,
): void {
  const visit = (node: ExprNode): void => {
    childrenOf(node).forEach(visit);
    if (node.type !== 'call' || !functions.has(node.fn)) return;
    const info = propertyFunctionInfo(node.fn);
    if (info === undefined) return;
    node.args.forEach((arg, k) => {
      if (info.argumentNames[k] !== 'T') return;
      const verdict = scaleOf(arg, at.formula.text, nameScale);
      if (verdict.scale !== 'difference') return;
      const call = nodeText(at.formula, node) || `${node.fn}(...)`;
      const argument = nodeText(at.formula, arg) || 'its argument';
      const inFormula: SourceSpan =
        arg.span.start > 0 ? { text: at.formula.text, column: arg.span.start, endColumn: Math.max(arg.span.end, arg.span.start + 1) } : { text: at.formula.text };
      const e = new InputError(REDUCE_ERROR.temperatureDifference, reduceMessages.temperatureDifference(call, argument, verdict.why), inFormula);
      throw placeInside(e, at.where, at.columnsExact);
    });
  };
  visit(at.formula.root);
}
