import type { Warning } from '../common/errors.js';
import { Rational } from '../common/rational.js';
import type { UnitDefinition } from './definition.js';
import { Dimension } from './dimension.js';
import { unitMessages } from './messages.js';
import { isExponentInRange, MAX_EXPONENT, type UnitNode } from './parser.js';
import type { Prefix } from './prefixes.js';
import { resolveName } from './resolve.js';
import { Scale } from './scale.js';
import { unitError } from './unit-error.js';
import type { TemperatureKind, UnitInternals } from './unit.js';

/** One written unit symbol with the exponent it carries after all powers and quotients. */
interface Occurrence {
  readonly definition: UnitDefinition;
  readonly prefix: Prefix | null;
  readonly exponent: Rational;
  readonly start: number;
  readonly end: number;
}

/** The meaning of a unit tree, before it is wrapped as a Unit. */
export interface EvaluatedUnit {
  readonly canonical: string;
  readonly dimension: Dimension;
  readonly temperature: TemperatureKind;
  readonly offset: Rational;
  readonly internals: UnitInternals;
  readonly warnings: readonly Warning[];
}

/**
 * Resolves the names of a unit tree and combines them: exponents multiply through powers and
 * change sign under '/', equal symbols merge, and the factor is the product of
 * (prefix x unit factor)^exponent. Temperature rules (see `Unit.temperature`): an offset scale
 * (degC, degF) alone with exponent 1 is absolute; anywhere else it is a difference and may carry
 * only the exponent +1 or -1.
 *
 * @throws {InputError} from name resolution, and 'unit-temperature', 'unit-exponent' here.
 * @example evaluate(tree, 'kg/m^3', Array.from('kg/m^3')).canonical // => 'kg m^-3' (tree from parseTokens)
 */
export function evaluate(tree: UnitNode, text: string, chars: readonly string[]): EvaluatedUnit {
  const occurrences: Occurrence[] = [];
  const warnings: Warning[] = [];
  collect(tree, Rational.ONE, null, { text, chars, occurrences, warnings, quiet: false });
  for (const o of occurrences) checkOccurrence(o, text);
  const terms = combine(occurrences, text);
  let dimension = Dimension.NONE;
  let scale = Scale.ONE;
  for (const t of terms) {
    dimension = dimension.mul(t.definition.dimension.pow(t.exponent));
    const prefixed = t.prefix === null ? t.definition.scale : Scale.exact(t.prefix.factor).mul(t.definition.scale);
    scale = scale.mul(prefixed.pow(t.exponent));
  }
  const { temperature, offset } = classifyTemperature(occurrences);
  for (const o of occurrences) {
    if (o.definition.assumption !== undefined) {
      warnings.push({ code: 'unit-assumed-convention', message: o.definition.assumption, where: { column: o.start, endColumn: o.end, text } });
    }
  }
  const only = occurrences.length === 1 ? occurrences[0]! : undefined;
  if (only !== undefined && only.definition.symbol === 'C' && only.prefix === null && only.exponent.equals(Rational.ONE)) {
    warnings.push({ code: 'unit-coulomb', message: unitMessages.coulomb(), where: { column: only.start, endColumn: only.end, text } });
  }
  return {
    canonical: terms.length === 0 ? '1' : terms.map(spellTerm).join(' '),
    dimension,
    temperature,
    offset,
    internals: {
      scale,
      radian: terms.some((t) => t.definition.angle === 'radian'),
      revolution: terms.some((t) => t.definition.angle === 'revolution'),
    },
    warnings,
  };
}

interface Context {
  readonly text: string;
  readonly chars: readonly string[];
  readonly occurrences: Occurrence[];
  readonly warnings: Warning[];
  /** True while re-reading a sub-tree only to spell it (no warnings). */
  readonly quiet: boolean;
}

/** Walks the tree; `powerAt` is the column of the exponent applied directly to this node, if any. */
function collect(node: UnitNode, exponent: Rational, powerAt: number | null, ctx: Context): void {
  switch (node.kind) {
    case 'one':
      return;
    case 'atom': {
      const site = { text: ctx.text, start: node.start, end: node.end };
      const resolved = resolveName(node.name, site);
      if (resolved.digitsExponent !== null && powerAt !== null) {
        const message = unitMessages.digitsAndExponent(node.name, resolved.digitsExponent.toString());
        throw unitError('unit-exponent', message, ctx.text, powerAt, powerAt + 1);
      }
      const e = resolved.digitsExponent === null ? exponent : exponent.mul(resolved.digitsExponent);
      ctx.occurrences.push({ definition: resolved.definition, prefix: resolved.prefix, exponent: e, start: node.start, end: node.end });
      return;
    }
    case 'power':
      collect(node.base, exponent.mul(node.exponent), node.base.end, ctx);
      return;
    case 'product':
      for (const f of node.factors) collect(f, exponent, null, ctx);
      return;
    case 'quotient': {
      collect(node.numerator, exponent, null, ctx);
      for (const d of node.denominators) collect(d, exponent.neg(), null, ctx);
      if (node.denominators.length > 1 && !ctx.quiet) ctx.warnings.push(slashChainWarning(node, ctx));
      return;
    }
  }
}

function slashChainWarning(node: UnitNode & { kind: 'quotient' }, ctx: Context): Warning {
  const slice = (n: UnitNode): string => ctx.chars.slice(n.start - 1, n.end - 1).join('');
  const sub: Context = { ...ctx, occurrences: [], warnings: [], quiet: true };
  collect(node, Rational.ONE, null, sub);
  const reading = combine(sub.occurrences, ctx.text).map(spellTerm).join(' ') || '1';
  const better = `${slice(node.numerator)}/(${node.denominators.map(slice).join(' ')})`;
  const second = node.slashes[1] ?? node.start;
  return {
    code: 'unit-slash-chain',
    message: unitMessages.slashChain(slice(node), reading, better),
    where: { column: second, endColumn: second + 1, text: ctx.text },
  };
}

/** Exponent range, and the absolute-temperature power rule, for one written symbol. */
function checkOccurrence(o: Occurrence, text: string): void {
  if (!isExponentInRange(o.exponent)) {
    throw unitError('unit-exponent', unitMessages.exponentOutOfRange(o.exponent.toString(), MAX_EXPONENT), text, o.start, o.end);
  }
  if (o.definition.temperature === 'scale' && !(o.exponent.equals(Rational.ONE) || o.exponent.equals(Rational.ONE.neg()))) {
    const message = unitMessages.temperaturePower(o.definition.symbol, `delta_${o.definition.symbol}`);
    throw unitError('unit-temperature', message, text, o.start, o.end);
  }
}

/** Merges equal symbols (same prefix and unit), in order of first appearance, dropping zero exponents. */
function combine(occurrences: readonly Occurrence[], text: string): Occurrence[] {
  const merged = new Map<string, Occurrence>();
  for (const o of occurrences) {
    const key = `${o.prefix?.canonical ?? ''}\u0000${o.definition.symbol}`;
    const seen = merged.get(key);
    const next = seen === undefined ? o : { ...seen, exponent: seen.exponent.add(o.exponent), start: o.start, end: o.end };
    checkOccurrence(next, text);
    merged.set(key, next);
  }
  return [...merged.values()].filter((t) => !t.exponent.isZero());
}

function spellTerm(t: Occurrence): string {
  const symbol = `${t.prefix?.canonical ?? ''}${t.definition.symbol}`;
  const e = t.exponent;
  if (e.equals(Rational.ONE)) return symbol;
  return e.isInteger() ? `${symbol}^${e.toString()}` : `${symbol}^(${e.toString()})`;
}

function classifyTemperature(occurrences: readonly Occurrence[]): { temperature: TemperatureKind; offset: Rational } {
  const only = occurrences.length === 1 ? occurrences[0]! : undefined;
  if (only !== undefined && only.exponent.equals(Rational.ONE)) {
    const role = only.definition.temperature;
    if (role === 'scale' && only.prefix === null) return { temperature: 'absolute', offset: only.definition.offset };
    if (role === 'thermodynamic') return { temperature: 'either', offset: Rational.ZERO };
  }
  const anyTemperature = occurrences.some((o) => o.definition.temperature !== undefined);
  return { temperature: anyTemperature ? 'difference' : 'either', offset: Rational.ZERO };
}
