/**
 * Says why the parameters cannot all be determined, in the user's terms: which group is constant,
 * which groups change together, or (for a general model) which parameters the singular direction
 * of the Jacobian involves.
 */
import { InputError } from '../common/errors.js';
import type { DesignFindings } from './design.js';
import { columnScale, designDiagnostics, designFromFactor } from './design.js';
import type { LogDesign } from './log-linear.js';
import type { PowerProduct } from './power-product.js';
import type { FitSpaceSolution } from './solution.js';
import type { FactorAnalysis } from './linalg/factor-analysis.js';
import { FIT_ERROR, msg } from './messages.js';

const and = (xs: readonly string[]) => (xs.length <= 1 ? xs.join('') : `${xs.slice(0, -1).join(', ')} and ${xs.at(-1)}`);

/**
 * The error for a rank-deficient power law, from the design findings of its groups.
 * @param params the exponent parameter of each group; `coefficient` the name of C (if any);
 * @param firstValue the value of each group in the first row (a constant group's value).
 * @example // LD constant at 50: 'b and C cannot be determined: LD is constant in the data (every row has LD = 50), ...'
 */
export function powerLawRankError(
  findings: DesignFindings,
  params: readonly string[],
  coefficient: string | undefined,
  firstValue: readonly number[],
): InputError {
  const groups = findings.diagnostics.groups;
  const c = findings.constant[0];
  if (c !== undefined) {
    const who = coefficient === undefined ? params[c]! : `${params[c]} and ${coefficient}`;
    return new InputError(FIT_ERROR.rankDeficient, msg.rankConstant(who, groups[c]!, firstValue[c]!));
  }
  // The fit's own rank test found the deficiency; the nearest dependence among the centred groups
  // names it even when rounding leaves its singular value just above the tolerance.
  const idx = findings.dependent[0] ?? findings.weakest;
  if (idx.length > 1) {
    return new InputError(FIT_ERROR.rankDeficient, msg.rankTogether(and(idx.map((i) => params[i]!)), and(idx.map((i) => groups[i]!))));
  }
  return new InputError(FIT_ERROR.rankDeficient, msg.rankGeneral(and([...params, ...(coefficient ? [coefficient] : [])])));
}

/**
 * The error for a singular Jacobian: the parameters with a sizeable component (> 0.1) in a
 * right singular vector of a zero singular value (equilibrated coordinates).
 * @example // model a*b*x: 'a and b cannot be determined separately from these data ...'
 */
export function jacobianRankError(analysis: FactorAnalysis, names: readonly string[]): InputError {
  const p = analysis.p;
  const involved = new Set<string>();
  for (let k = analysis.rank; k < p; k++) {
    for (let j = 0; j < p; j++) if (Math.abs(analysis.v[j + k * p]!) > 0.1) involved.add(names[j]!);
  }
  return new InputError(FIT_ERROR.rankDeficient, msg.rankGeneral(and([...involved])));
}

/** The error for a rank-deficient log-space design (from its factor when it has a coefficient). @example // LD = 0.01 Re^0.5: 'a and b cannot be told apart: Re and LD change together ...' */
export function logRankError(d: LogDesign, pp: PowerProduct, sol: FitSpaceSolution): InputError {
  const k = pp.powers.length;
  const groups = pp.powers.map((f) => f.group);
  const offset = d.hasCoefficient ? 1 : 0;
  const columns = pp.powers.map((_, j) => d.x.subarray((j + offset) * d.n, (j + offset + 1) * d.n));
  const findings =
    d.hasCoefficient && sol.factor !== undefined
      ? designFromFactor(sol.factor, k, groups, 'log', d.n, Float64Array.from(columns, columnScale))
      : designDiagnostics(columns.map((values, j) => ({ name: groups[j]!, values })), d.n, 'log');
  return powerLawRankError(
    findings,
    pp.powers.map((f) => f.param),
    pp.coefficient,
    d.bases.map((b) => b[0]!),
  );
}
