import type { SourceSpan, Warning } from '../common/errors.js';
import { Rational } from '../common/rational.js';
import { namesIn, parseFormula, type Formula } from '../expr/index.js';
import type { Dimension } from '../units/index.js';
import { absentVariables } from './absent.js';
import { classifyVariable } from './classify.js';
import { combinationOf } from './linear.js';
import { dimensionalMatrix } from './matrix.js';
import { GROUPS_WARNING, groupsMessages } from './messages.js';
import { powerProductOf } from './power-product.js';
import { formatProduct } from './product-format.js';

/**
 * The check of a study's groups against its data: does every variable that the data vary appear
 * in some group ('groups-incomplete'), and is any group a product of powers of the others
 * ('groups-dependent': its fitted exponent could not be told apart from theirs)? Names reach
 * through derived quantities (U = 4*Q/(pi*D^2) makes Re depend on Q). Pure: warnings are returned.
 */

export interface StudyVariable {
  readonly name: string;
  readonly dimension: Dimension;
  /** Whether the data vary it (a column that is not constant), as opposed to a fixed constant. */
  readonly varied: boolean;
  readonly where?: SourceSpan;
}

export interface StudyFormula {
  readonly name: string;
  readonly formula: string | Formula;
  readonly where?: SourceSpan;
}

export interface StudyCheckOptions {
  /** Derived quantities the groups may use (`U: 4*Q/(pi*D^2)`). */
  readonly derived?: readonly StudyFormula[];
}

/**
 * Warnings about a study's groups: 'groups-incomplete' for each varied variable in no group,
 * 'groups-dependent' for each group that is a product of powers of the groups before it (or a
 * constant). Groups that are not power products (`(rho_p - rho)/rho`) count for the first check
 * and are left out of the second.
 * @throws {InputError} a formula given as text that does not parse ('formula-*').
 * @example checkStudyGroups([dp, rho, mu, D, U, L (all varied)], [Re, f]) // => [groups-incomplete for L]
 * @example checkStudyGroups(vars, [Re: rho*U*D/mu, Pr: cp*mu/k, Pe: rho*cp*U*D/k]) // => [groups-dependent: Pe = Re*Pr]
 */
export function checkStudyGroups(
  variables: readonly StudyVariable[],
  groups: readonly StudyFormula[],
  options: StudyCheckOptions = {},
): Warning[] {
  const derived = new Map((options.derived ?? []).map((d) => [d.name, toFormula(d.formula)] as const));
  const parsed = groups.map((g) => ({ ...g, formula: toFormula(g.formula) }));
  return [...incomplete(variables, parsed, derived), ...dependent(parsed, derived)];
}

function toFormula(f: string | Formula): Formula {
  return typeof f === 'string' ? parseFormula(f) : f;
}

function withWhere(code: string, message: string, where: SourceSpan | undefined): Warning {
  return where === undefined ? { code, message } : { code, message, where };
}

function incomplete(
  variables: readonly StudyVariable[],
  groups: readonly { formula: Formula }[],
  derived: ReadonlyMap<string, Formula>,
): Warning[] {
  const reached = new Set<string>();
  const visit = (name: string, stack: Set<string>): void => {
    if (reached.has(name) || stack.has(name)) return;
    reached.add(name);
    const d = derived.get(name);
    if (d !== undefined) for (const n of namesIn(d)) visit(n, new Set([...stack, name]));
  };
  for (const g of groups) for (const n of namesIn(g.formula)) visit(n, new Set());
  const classified = variables.map((v) => classifyVariable({ name: v.name, dimension: v.dimension }));
  const absent = new Map(absentVariables(dimensionalMatrix(classified), classified).map((a) => [a.name, a.reason]));
  return variables
    .filter((v) => v.varied && !reached.has(v.name))
    .map((v) => {
      const reason = absent.get(v.name);
      const message = groupsMessages.incomplete(v.name) + (reason === undefined ? '' : ` (note: ${reason})`);
      return withWhere(GROUPS_WARNING.incomplete, message, v.where);
    });
}

function dependent(groups: readonly { name: string; formula: Formula; where?: SourceSpan }[], derived: ReadonlyMap<string, Formula>): Warning[] {
  const products = groups
    .map((g) => ({ g, exps: expandedProduct(g.formula, derived, new Set()) }))
    .filter((x): x is { g: (typeof groups)[number]; exps: Map<string, Rational> } => x.exps !== undefined);
  const atoms = [...new Set(products.flatMap((p) => [...p.exps.keys()]))];
  const vectorOf = (exps: ReadonlyMap<string, Rational>): Rational[] => atoms.map((a) => exps.get(a) ?? Rational.ZERO);
  const kept: { name: string; vector: Rational[] }[] = [];
  const warnings: Warning[] = [];
  for (const { g, exps } of products) {
    const vector = vectorOf(exps);
    if (exps.size === 0) {
      warnings.push(withWhere(GROUPS_WARNING.dependent, groupsMessages.constantGroup(g.name), g.where));
      continue;
    }
    const c = kept.length === 0 ? undefined : combinationOf(kept.map((k) => k.vector), vector);
    if (c === undefined) {
      kept.push({ name: g.name, vector });
      continue;
    }
    const relation = `${g.name} = ${formatProduct(kept.map((k, i) => [k.name, c[i]!] as const))}`;
    warnings.push(withWhere(GROUPS_WARNING.dependent, groupsMessages.dependent(g.name, relation), g.where));
  }
  return warnings;
}

/** The power product of a formula with derived power products substituted (others stay atoms). */
function expandedProduct(formula: Formula, derived: ReadonlyMap<string, Formula>, stack: Set<string>): Map<string, Rational> | undefined {
  const own = powerProductOf(formula.root);
  if (own === undefined) return undefined;
  const out = new Map<string, Rational>();
  const add = (name: string, e: Rational): void => {
    const sum = out.has(name) ? out.get(name)!.add(e) : e;
    if (sum.isZero()) out.delete(name);
    else out.set(name, sum);
  };
  for (const [name, e] of own) {
    const d = derived.get(name);
    const inner = d === undefined || stack.has(name) ? undefined : expandedProduct(d, derived, new Set([...stack, name]));
    if (inner === undefined) add(name, e);
    else for (const [n, k] of inner) add(n, k.mul(e));
  }
  return out;
}
