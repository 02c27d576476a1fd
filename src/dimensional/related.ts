import { Rational } from '../common/rational.js';
import { CATALOGUE } from './catalogue.js';
import type { ClassifiedVariable } from './classify.js';
import { NumericFactor } from './factor.js';
import type { PiGroup } from './groups.js';
import type { QuantityKind } from './kinds.js';
import { formatProduct } from './product-format.js';
import { instancesOf, type NamedInstance } from './recognise.js';

/**
 * Named groups that are not in a set but are products of powers of its groups: any product of
 * powers of a complete set is dimensionless, and every dimensionless product is one (the groups
 * are a basis of the null space). With rho, U, D repeating, the Darcy friction factor is not a
 * member of {Eu, Re, L/D} but equals 2*Eu/L_D; in a settling problem the Froude number is Re/sqrt(Ga).
 */

export interface RelatedGroup {
  readonly name: string;
  readonly symbol: string;
  readonly physics: string;
  /** The named group in the user's variables: '2*dp*D/(rho*U^2*L)'. */
  readonly formula: string;
  /** The same in the set's keys: '2*Eu/L_D'. */
  readonly relation: string;
  readonly notes: readonly string[];
}

/** At most this many related groups are listed, and this many writings of one entry are tried. */
const MAX_RELATED = 8;
const MAX_INSTANCES = 200;

/**
 * The named groups, one per name, that the set does not contain but can form.
 * @example relatedNamedGroups(pipeGroups, vars, kinds)[0] // => Darcy friction factor, relation '2*Eu/L_D'
 */
export function relatedNamedGroups(
  groups: readonly PiGroup[],
  variables: readonly ClassifiedVariable[],
  kinds: ReadonlyMap<string, QuantityKind>,
): RelatedGroup[] {
  const names = variables.map((v) => v.name);
  const done = new Set(groups.map((g) => g.recognition?.name).filter((n): n is string => n !== null && n !== undefined));
  const out: RelatedGroup[] = [];
  for (const entry of CATALOGUE) {
    if (out.length >= MAX_RELATED) break;
    if (done.has(entry.name)) continue;
    const best = simplestInstance(instancesOf(entry, names, kinds));
    if (best === undefined) continue;
    const relation = relationInKeys(best, groups);
    if (relation === undefined) continue;
    done.add(entry.name);
    out.push({
      name: entry.name,
      symbol: entry.symbol,
      physics: entry.physics,
      formula: formatProduct(best.exponents, best.coefficient),
      relation,
      notes: best.notes,
    });
  }
  return out;
}

function simplestInstance(instances: Iterable<NamedInstance>): NamedInstance | undefined {
  let best: NamedInstance | undefined;
  let count = 0;
  for (const inst of instances) {
    if (best === undefined || inst.notes.length < best.notes.length) best = inst;
    if (best.notes.length === 0 || ++count >= MAX_INSTANCES) break;
  }
  return best;
}

/**
 * The instance as a product of powers of the set's groups, written with their keys. Each group's
 * defining variable appears in that group only, so its coefficient is read off directly; the
 * whole combination is then checked exactly. undefined when the check fails.
 */
function relationInKeys(inst: NamedInstance, groups: readonly PiGroup[]): string | undefined {
  const coefficients = groups.map((g) => (inst.exponents.get(g.defining) ?? Rational.ZERO).div(g.exponents.get(g.defining)!));
  const rebuilt = new Map<string, Rational>();
  groups.forEach((g, j) => {
    for (const [name, e] of g.exponents) rebuilt.set(name, (rebuilt.get(name) ?? Rational.ZERO).add(e.mul(coefficients[j]!)));
  });
  const names = new Set([...rebuilt.keys(), ...inst.exponents.keys()]);
  for (const name of names) {
    if (!(rebuilt.get(name) ?? Rational.ZERO).equals(inst.exponents.get(name) ?? Rational.ZERO)) return undefined;
  }
  // named = coefficient * prod G_j^c_j and G_j = f_j * N_j^p_j, so named = F * prod N_j^(p_j c_j).
  let factor = inst.coefficient;
  const keyExponents: [string, Rational][] = [];
  groups.forEach((g, j) => {
    const c = coefficients[j]!;
    if (c.isZero()) return;
    const power = g.recognition?.power ?? Rational.ONE;
    const f = g.recognition?.factor ?? NumericFactor.ONE;
    factor = factor.mul(f.pow(c));
    keyExponents.push([g.key, power.mul(c)]);
  });
  return formatProduct(keyExponents, factor);
}
