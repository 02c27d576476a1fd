import { InputError } from '../common/errors.js';
import {
  binaryNode,
  BUILTIN_FUNCTIONS,
  callNode,
  FORMULA_ERROR,
  fixedDimensionRule,
  FunctionTable,
  numNode,
  unaryNode,
  type ExprNode,
  type FunctionSpec,
  type PartialRule,
} from '../expr/index.js';
import { SUTHERLAND_S_K } from './air.js';
import { PRESSURE, PROPERTY_FUNCTIONS_INFO, TEMPERATURE, type PropertyFunctionInfo } from './catalogue.js';
import { msg } from './messages.js';

/**
 * The fluid properties as formula functions: `water_density(T)`, `water_density(T, p)`,
 * `water_viscosity(T[, p])`, `water_kinematic_viscosity(T[, p])`, `air_density(T, p)`,
 * `air_viscosity(T)`, `air_kinematic_viscosity(T, p)`, and the derivative companions
 * `water_density_dT`, `water_density_dp`, `water_viscosity_dT`, `water_viscosity_dp`.
 *
 * Dimension rules: T must be a temperature and p a pressure; the result has the property's
 * dimension. Values: SI; NaN outside the stated range (a column evaluation never throws for one
 * bad row); explainPropertyFailures (explain.ts) names the call, the argument and the range.
 *
 * Derivative rules, all exact:
 * - water: d/dT and d/dp are calls of the companions, which evaluate the analytic derivatives of
 *   the IAPWS equations (water.ts); the kinematic viscosity nu = mu/rho by the quotient rule,
 *   d nu = (d mu - nu d rho)/rho.
 * - air: closed forms of the ideal-gas and Sutherland expressions:
 *   d rho/dT = -rho/T, d rho/dp = rho/p; d mu/dT = mu (1.5/T - 1/(T + S));
 *   nu = mu R T/p, so d nu/dT = nu (2.5/T - 1/(T + S)), d nu/dp = -nu/p.
 * - the companions themselves have no derivative rule: asking for one (a second derivative)
 *   throws InputError 'formula-not-differentiable'.
 */

const n = (x: number) => numNode(x);
const div = (a: ExprNode, b: ExprNode) => binaryNode('/', a, b);
const mul = (a: ExprNode, b: ExprNode) => binaryNode('*', a, b);
const sub = (a: ExprNode, b: ExprNode) => binaryNode('-', a, b);
const add = (a: ExprNode, b: ExprNode) => binaryNode('+', a, b);
const neg = (a: ExprNode) => unaryNode('neg', a);
const call = (fn: string, args: readonly ExprNode[]) => callNode(fn, args);

const T0 = (args: readonly ExprNode[]) => args[0]!;
const P1 = (args: readonly ExprNode[]) => args[1]!;
/** 1/(T + S), Sutherland's S for air. */
const sutherlandTerm = (t: ExprNode) => div(n(1), add(t, n(SUTHERLAND_S_K)));

const PARTIALS: Readonly<Record<string, PartialRule>> = {
  water_density: (a, k) => call(k === 0 ? 'water_density_dT' : 'water_density_dp', a),
  water_viscosity: (a, k) => call(k === 0 ? 'water_viscosity_dT' : 'water_viscosity_dp', a),
  water_kinematic_viscosity: (a, k, self) => {
    const [dMu, dRho] = k === 0 ? ['water_viscosity_dT', 'water_density_dT'] : ['water_viscosity_dp', 'water_density_dp'];
    return div(sub(call(dMu, a), mul(self, call(dRho, a))), call('water_density', a));
  },
  air_density: (a, k, self) => (k === 0 ? neg(div(self, T0(a))) : div(self, P1(a))),
  air_viscosity: (a, _k, self) => mul(self, sub(div(n(1.5), T0(a)), sutherlandTerm(T0(a)))),
  air_kinematic_viscosity: (a, k, self) =>
    k === 0 ? mul(self, sub(div(n(2.5), T0(a)), sutherlandTerm(T0(a)))) : neg(div(self, P1(a))),
};

function noSecondDerivative(name: string): PartialRule {
  return () => {
    throw new InputError(FORMULA_ERROR.notDifferentiable, msg.secondDerivative(name));
  };
}

function specOf(info: PropertyFunctionInfo): FunctionSpec {
  const dims = info.argumentNames.map((a) => (a === 'T' ? TEMPERATURE : PRESSURE));
  const words = info.argumentNames.map((a) => (a === 'T' ? 'a temperature (T, absolute)' : 'a pressure (p, absolute)'));
  const usesPressure = info.argumentNames.length > 1;
  return {
    name: info.name,
    minArgs: info.minArgs,
    maxArgs: info.argumentNames.length,
    summary: info.summary,
    dimension: fixedDimensionRule(dims, words, info.resultDimension),
    evaluate: usesPressure
      ? (t: number, p?: number) => info.evaluate(t, p ?? info.defaultPressurePa ?? NaN)
      : (t: number) => info.evaluate(t, NaN),
    partial: info.derivativeOf !== undefined ? noSecondDerivative(info.name) : PARTIALS[info.name]!,
  };
}

/** The property functions as FunctionSpecs (to add to any table with `.with(PROPERTY_SPECS)`). */
export const PROPERTY_SPECS: readonly FunctionSpec[] = PROPERTY_FUNCTIONS_INFO.map(specOf);

/**
 * The built-in functions plus the fluid properties: the table to pass to parseFormula,
 * inferDimension, compileFormula and differentiate when formulas may call water_density(T).
 * @example inferDimension(parseFormula('rho*U*D/water_viscosity(T)', { functions: PROPERTY_FUNCTIONS }), dims, PROPERTY_FUNCTIONS).dimension.isDimensionless() // => true
 */
export const PROPERTY_FUNCTIONS: FunctionTable = BUILTIN_FUNCTIONS.with(PROPERTY_SPECS);
