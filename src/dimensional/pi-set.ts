import { Rational } from '../common/rational.js';
import type { ClassifiedVariable } from './classify.js';
import type { QuantityKind } from './kinds.js';
import { primitiveIntegerVector } from './integers.js';
import { nullSpace } from './linear.js';
import type { DimensionalMatrix } from './matrix.js';
import { recogniseGroup, type Recognition } from './recognise.js';

/**
 * The groups of one repeating set: the null-space basis of the dimensional matrix whose pivot
 * columns are the repeating variables, so that each other variable ("defining" variable) appears
 * in exactly one group with exponent 1 before scaling. Each vector is scaled to small integers
 * (LCM of denominators, then GCD), recognised, and turned over when its named form has a
 * negative power (mu/(rho*U*D) becomes rho*U*D/mu), except the response's group, where the
 * response keeps a positive exponent.
 */

export interface RawGroup {
  /** The non-repeating variable that defines the group. */
  readonly defining: string;
  /** Integer exponents, non-zero only, in display order. */
  readonly exponents: ReadonlyMap<string, Rational>;
  readonly recognition: Recognition | null;
}

/** How well a set of groups is recognised, for choosing among repeating sets (smaller is better). */
export interface SetScore {
  readonly unrecognised: number;
  readonly composite: number;
  /** The repeating variables' kind preferences, ascending. */
  readonly preferences: readonly number[];
  /** Sum of |exponent| over all groups: smaller exponents are preferred. */
  readonly exponentSum: number;
}

/**
 * The groups for the repeating variables at `repeating` (column indices, assumed valid).
 * @example groupsForRepeating(pipe, vars, kinds, [rho, U, D], 'dp') // => dp/(rho*U^2), rho*U*D/mu, L/D
 */
export function groupsForRepeating(
  m: DimensionalMatrix,
  variables: readonly ClassifiedVariable[],
  kinds: ReadonlyMap<string, QuantityKind>,
  repeating: readonly number[],
  response: string | undefined,
  cache: Map<string, Recognition | null> = new Map(),
): RawGroup[] {
  const n = m.variables.length;
  const others = m.variables.map((_, j) => j).filter((j) => !repeating.includes(j));
  const order = [...repeating, ...others];
  const reordered = m.entries.map((row) => order.map((j) => row[j]!));
  const basis = nullSpace(reordered, n);
  return basis.map((v, k) => {
    const vector = Array.from({ length: n }, () => Rational.ZERO);
    order.forEach((j, pos) => (vector[j] = v[pos]!));
    const scaled = primitiveIntegerVector(vector);
    const defining = variables[others[k]!]!.name;
    const displayOrder = [defining, ...repeating.map((j) => variables[j]!.name)];
    let exponents = new Map(displayOrder.map((name) => [name, scaled[m.variables.indexOf(name)]!] as const).filter(([, e]) => !e.isZero()));
    const key = [...exponents].map(([name, e]) => `${name}:${e.toString()}`).join(' ');
    let recognition = cache.get(key);
    if (recognition === undefined) {
      recognition = recogniseGroup(exponents, kinds);
      cache.set(key, recognition);
    }
    if (recognition?.type === 'named' && recognition.power.sign() < 0 && defining !== response) {
      exponents = new Map([...exponents].map(([name, e]) => [name, e.neg()]));
      recognition = { ...recognition, power: recognition.power.neg(), factor: recognition.factor.inverse() };
    }
    if (recognition !== null) {
      const termOrder = [...recognition.named.exponents.keys()];
      exponents = new Map(termOrder.filter((name) => exponents.has(name)).map((name) => [name, exponents.get(name)!]));
    }
    return { defining, exponents, recognition };
  });
}

/**
 * The score of a repeating set: groups recognised (named or ratio of like quantities) first, then
 * fewer composite groups (Pe = Re*Pr), then the preferred kinds, then the smaller exponents.
 * @example scoreOf(pipeGroups, [density, velocity, diameter]) // => { unrecognised: 0, composite: 0, preferences: [1, 2, 4], exponentSum: 10 }
 */
export function scoreOf(groups: readonly RawGroup[], repeatingKinds: readonly QuantityKind[]): SetScore {
  let unrecognised = 0;
  let composite = 0;
  let exponentSum = 0;
  for (const g of groups) {
    const type = g.recognition?.type;
    if (type !== 'named' && type !== 'ratio') unrecognised++;
    if (g.recognition?.composite === true) composite++;
    for (const e of g.exponents.values()) exponentSum += Math.abs(e.toNumber());
  }
  return { unrecognised, composite, preferences: repeatingKinds.map((k) => k.preference).sort((a, b) => a - b), exponentSum };
}

/** Negative when a is the better score. @example compareScores(scoreOf(nuRePr), scoreOf(nuRePe)) // => negative (fewer composites) */
export function compareScores(a: SetScore, b: SetScore): number {
  if (a.unrecognised !== b.unrecognised) return a.unrecognised - b.unrecognised;
  if (a.composite !== b.composite) return a.composite - b.composite;
  for (let i = 0; i < Math.min(a.preferences.length, b.preferences.length); i++) {
    const d = a.preferences[i]! - b.preferences[i]!;
    if (d !== 0) return d;
  }
  return a.exponentSum - b.exponentSum;
}
