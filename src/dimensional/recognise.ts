import { Rational } from '../common/rational.js';
import { quantityNames } from '../units/index.js';
import { CATALOGUE, type NamedGroup } from './catalogue.js';
import { NumericFactor } from './factor.js';
import type { KindId, QuantityKind } from './kinds.js';

/**
 * Recognition of a dimensionless group: is it, up to a power and a numeric factor, a named group
 * of the catalogue written in these variables? A volume flow rate Q may stand for a mean velocity
 * U = 4Q/(pi D^2) in a pipe of diameter D (U = Q/(pi r^2) with a radius), so that rho*Q/(mu*D) is
 * recognised as (pi/4)*Re. Otherwise, two variables of one dimension form a ratio (L/D, rho_p/rho),
 * and a dimensionless variable is a group by itself.
 */

/** A named group written in the user's variables: coefficient * prod name^exponent. */
export interface NamedForm {
  readonly coefficient: NumericFactor;
  /** In the order of the definition's terms. */
  readonly exponents: ReadonlyMap<string, Rational>;
}

/** One way a catalogue entry is written in the user's variables. */
export interface NamedInstance extends NamedForm {
  readonly entry: NamedGroup;
  /** Where the variables differ from the usual definition (a volume flow for U, d for a depth). */
  readonly notes: readonly string[];
}

export interface Recognition {
  /** 'named' (catalogue), 'ratio' (two like quantities), 'input' (a dimensionless variable). */
  readonly type: 'named' | 'ratio' | 'input';
  /** 'Reynolds number', 'length ratio'; null for a dimensionless input. */
  readonly name: string | null;
  /** A formula-safe symbol: 'Re', 'L_D', or the input's own name. */
  readonly symbol: string;
  readonly physics: string;
  /** group = factor * named^power. */
  readonly power: Rational;
  readonly factor: NumericFactor;
  /** The catalogue entry, for a named group. */
  readonly entry: NamedGroup | null;
  /** The named group in the user's variables (for a ratio or an input, the group itself). */
  readonly named: NamedForm;
  readonly notes: readonly string[];
  readonly composite: boolean;
}

/** Kinds a volume flow can stand in for, with Q = k * U * length^2 (k = pi/4 for D, pi for r). */
const FLOW_AREA: ReadonlyMap<KindId, { k: NumericFactor; text: (q: string, d: string) => string }> = new Map([
  // Mean velocity in a circular pipe: U = 4 Q / (pi D^2) (continuity, area pi D^2 / 4).
  ['diameter', { k: NumericFactor.pi().div(NumericFactor.of(Rational.of(4))), text: (q, d) => `4*${q}/(pi*${d}^2)` }],
  ['radius', { k: NumericFactor.pi(), text: (q, r) => `${q}/(pi*${r}^2)` }],
]);

/**
 * Every way a catalogue entry can be written with the given variables (each variable used once;
 * a diameter may also serve a volume flow's area).
 * @example [...instancesOf(reynolds, ['rho', 'U', 'D', 'mu'], kinds)][0].exponents // => rho 1, U 1, D 1, mu -1
 */
export function* instancesOf(
  entry: NamedGroup,
  available: readonly string[],
  kinds: ReadonlyMap<string, QuantityKind>,
  options: { readonly flowForVelocity?: boolean } = {},
): Generator<NamedInstance> {
  const flowForVelocity = options.flowForVelocity ?? true;
  const exps = new Map<string, Rational>();
  const used = new Set<string>();
  const notes: string[] = [];
  function* place(i: number, coefficient: NumericFactor): Generator<NamedInstance> {
    if (i === entry.terms.length) {
      const nonZero = new Map([...exps].filter(([, e]) => !e.isZero()));
      yield { entry, coefficient, exponents: nonZero, notes: [...notes] };
      return;
    }
    const t = entry.terms[i]!;
    for (const name of available) {
      const kind = kinds.get(name)!;
      if (used.has(name) || !t.kinds.includes(kind.id)) continue;
      const note = t.usual !== undefined && !t.usual.includes(kind.id) ? `${name} (${kind.words}) stands for ${t.role ?? 'the usual quantity'}` : undefined;
      used.add(name);
      addExp(exps, name, t.exponent);
      if (note !== undefined) notes.push(note);
      yield* place(i + 1, coefficient);
      if (note !== undefined) notes.pop();
      addExp(exps, name, t.exponent.neg());
      used.delete(name);
    }
    if (!flowForVelocity || !t.kinds.includes('velocity')) return;
    // A volume flow in place of the mean velocity: U^e = k^-e Q^e D^-2e.
    for (const q of available) {
      if (used.has(q) || kinds.get(q)!.id !== 'volume-flow') continue;
      for (const d of available) {
        const area = FLOW_AREA.get(kinds.get(d)!.id);
        if (area === undefined) continue;
        used.add(q);
        addExp(exps, q, t.exponent);
        addExp(exps, d, t.exponent.mul(Rational.of(-2)));
        notes.push(`the mean velocity ${area.text(q, d)} stands for the velocity`);
        yield* place(i + 1, coefficient.mul(area.k.pow(t.exponent.neg())));
        notes.pop();
        addExp(exps, d, t.exponent.mul(Rational.of(2)));
        addExp(exps, q, t.exponent.neg());
        used.delete(q);
      }
    }
  }
  yield* place(0, entry.coefficient);
}

function addExp(into: Map<string, Rational>, name: string, e: Rational): void {
  into.set(name, (into.get(name) ?? Rational.ZERO).add(e));
}

/**
 * The power p with group = p * instance (exponent vectors over the same variables), or undefined.
 * @example powerBetween({U: 2, g: -1, d: -1}, {U: 1, g: -1/2, d: -1/2}) // => 2
 */
export function powerBetween(group: ReadonlyMap<string, Rational>, instance: ReadonlyMap<string, Rational>): Rational | undefined {
  if (group.size !== instance.size || group.size === 0) return undefined;
  let p: Rational | undefined;
  for (const [name, e] of group) {
    const n = instance.get(name);
    if (n === undefined || n.isZero()) return undefined;
    const ratio = e.div(n);
    if (p === undefined) p = ratio;
    else if (!p.equals(ratio)) return undefined;
  }
  return p;
}

/**
 * Recognises a group given by its exponents (non-zero entries) over variables of known kinds:
 * the first catalogue entry that fits as written (Q/(N*D^3) is a flow coefficient), else the
 * first that fits with a volume flow for a velocity, else a ratio of two like quantities, else a
 * dimensionless input; null when none applies. group = factor * named^power.
 * @example recogniseGroup({rho: 1, Q: 1, mu: -1, D: -1}, kinds) // => Reynolds number, power 1, factor pi/4
 */
export function recogniseGroup(
  exponents: ReadonlyMap<string, Rational>,
  kinds: ReadonlyMap<string, QuantityKind>,
): Recognition | null {
  const support = [...exponents.keys()];
  const present = new Set(support.map((n) => kinds.get(n)!.id));
  for (const flowForVelocity of [false, true]) {
    const found = firstNamed(exponents, support, present, kinds, flowForVelocity);
    if (found !== null) return found;
  }
  return recogniseRatio(exponents, kinds) ?? recogniseInput(exponents, kinds);
}

function firstNamed(
  exponents: ReadonlyMap<string, Rational>,
  support: readonly string[],
  present: ReadonlySet<KindId>,
  kinds: ReadonlyMap<string, QuantityKind>,
  flowForVelocity: boolean,
): Recognition | null {
  for (const entry of CATALOGUE) {
    // Without a substitution each term takes one distinct variable; with one, a diameter may be added.
    const terms = entry.terms.length;
    if (flowForVelocity ? support.length > terms + 1 : support.length !== terms) continue;
    if (!couldFit(entry, present, flowForVelocity)) continue;
    for (const instance of instancesOf(entry, support, kinds, { flowForVelocity })) {
      const power = powerBetween(exponents, instance.exponents);
      if (power === undefined) continue;
      return {
        type: 'named',
        name: entry.name,
        symbol: entry.symbol,
        physics: entry.physics,
        power,
        factor: instance.coefficient.pow(power.neg()),
        entry,
        named: instance,
        notes: instance.notes,
        composite: entry.composite !== undefined,
      };
    }
  }
  return null;
}

/** The kinds each catalogue entry accepts, computed once. */
const ACCEPTED = new Map<NamedGroup, ReadonlySet<KindId>>(CATALOGUE.map((e) => [e, new Set(e.terms.flatMap((t) => t.kinds))]));

function couldFit(entry: NamedGroup, present: ReadonlySet<KindId>, flowForVelocity: boolean): boolean {
  const accepted = ACCEPTED.get(entry)!;
  const takesVelocity = flowForVelocity && accepted.has('velocity');
  for (const k of present) {
    if (accepted.has(k)) continue;
    if (takesVelocity && (k === 'volume-flow' || FLOW_AREA.has(k))) continue;
    return false;
  }
  return true;
}

function recogniseRatio(exponents: ReadonlyMap<string, Rational>, kinds: ReadonlyMap<string, QuantityKind>): Recognition | null {
  const entries = [...exponents];
  if (entries.length !== 2) return null;
  const [[a, ea], [b, eb]] = entries as [[string, Rational], [string, Rational]];
  const ka = kinds.get(a)!;
  const kb = kinds.get(b)!;
  if (!ka.dimension.equals(kb.dimension) || !ea.add(eb).isZero() || ka.dimension.isDimensionless()) return null;
  const [top, bottom, power] = ea.sign() > 0 ? [a, b, ea] : [b, a, eb];
  const quantity = quantityNames(ka.dimension)[0];
  const name = quantity === undefined ? `ratio of like quantities (${ka.dimension.toString()})` : `${quantity} ratio`;
  const physics =
    quantity === 'length' ? 'geometric similarity: one length to another' : quantity === undefined ? 'one quantity to another of its kind' : `one ${quantity} to another`;
  return {
    type: 'ratio',
    name,
    symbol: `${top}_${bottom}`,
    physics,
    power,
    factor: NumericFactor.ONE,
    entry: null,
    named: { coefficient: NumericFactor.ONE, exponents: new Map([[top, Rational.ONE], [bottom, Rational.of(-1)]]) },
    notes: [],
    composite: false,
  };
}

function recogniseInput(exponents: ReadonlyMap<string, Rational>, kinds: ReadonlyMap<string, QuantityKind>): Recognition | null {
  const entries = [...exponents];
  if (entries.length !== 1) return null;
  const [name, e] = entries[0]!;
  if (!kinds.get(name)!.dimension.isDimensionless()) return null;
  return {
    type: 'input',
    name: null,
    symbol: name,
    physics: 'a dimensionless input: a group by itself',
    power: e,
    factor: NumericFactor.ONE,
    entry: null,
    named: { coefficient: NumericFactor.ONE, exponents: new Map([[name, Rational.ONE]]) },
    notes: [],
    composite: false,
  };
}
