import { InputError } from '../common/errors.js';
import { Rational } from '../common/rational.js';
import { unitMessages } from './messages.js';
import { describeDimension } from './quantities.js';
import { Scale } from './scale.js';
import { internalsOf, type Unit } from './unit.js';

/** A map from values in one unit to values in another. */
export interface Converter {
  readonly apply: (x: number) => number;
  /** Converts every element; writes into `out` (which may be `xs` itself) or a new array. */
  readonly applyArray: (xs: Float64Array, out?: Float64Array) => Float64Array;
  /** True when the map is an exact rational affine map (both factors exact); evaluation is still in doubles. */
  readonly exact: boolean;
}

const TWO_53 = 2n ** 53n;

/**
 * The map from values in `from` to values in `to`. With SI value = (x + offset) * factor for each
 * unit, y = x * f1/f2 + (o1 * f1/f2 - o2). When both factors are exact this is built as
 * y = (x*p + q)/r with integers p, q, r (all below 2^53), so that integer inputs in exact
 * definitions come out as the nearest double of the exact answer (32 degF -> 273.15 K, NIST SP 811
 * (2008) B.9); otherwise y = x*scale + shift in doubles.
 *
 * Temperature rule: an absolute temperature (degC, degF alone) converts to another absolute one or
 * to K/degR with offsets; a difference converts by scale only; absolute <-> difference is refused.
 *
 * @throws {InputError} 'unit-incompatible' when the dimensions differ (both named in words),
 *   'unit-temperature-kind' for absolute <-> difference, 'unit-angle' for revolutions (rpm, Hz)
 *   <-> radians or degrees (the 2*pi would be lost).
 * @example converter(parseUnit('degF'), parseUnit('degC')).apply(212) // => 100
 */
export function converter(from: Unit, to: Unit): Converter {
  if (!from.dimension.equals(to.dimension)) {
    const message = unitMessages.incompatible(from.text, describeDimension(from.dimension), to.text, describeDimension(to.dimension));
    throw new InputError('unit-incompatible', message, { text: `${from.text} -> ${to.text}` });
  }
  const kinds = [from.temperature, to.temperature];
  if (kinds.includes('absolute') && kinds.includes('difference')) {
    const words = (u: Unit): string => (u.temperature === 'absolute' ? 'an absolute temperature' : 'a temperature difference');
    throw new InputError('unit-temperature-kind', unitMessages.temperatureKind(from.text, words(from), to.text, words(to)), {
      text: `${from.text} -> ${to.text}`,
    });
  }
  const a = internalsOf(from);
  const b = internalsOf(to);
  const angleOnly = (i: typeof a): boolean => i.radian && !i.revolution;
  const cycleOnly = (i: typeof a): boolean => i.revolution && !i.radian;
  if ((angleOnly(a) && cycleOnly(b)) || (cycleOnly(a) && angleOnly(b))) {
    throw new InputError('unit-angle', unitMessages.angleBasis(from.text, to.text), { text: `${from.text} -> ${to.text}` });
  }
  const useOffsets = kinds.includes('absolute');
  return affine(a.scale.div(b.scale), useOffsets ? from.offset : Rational.ZERO, useOffsets ? to.offset : Rational.ZERO);
}

/**
 * The map from values in `unit` to the coherent SI unit of the same dimension: (x + offset) * factor.
 * Absolute temperatures go to kelvin.
 * @example toSI(parseUnit('kPa')).apply(101.325) // => 101325
 */
export function toSI(unit: Unit): Converter {
  return affine(internalsOf(unit).scale, unit.offset, Rational.ZERO);
}

/** y = (x + fromOffset) * ratio - toOffset. */
function affine(ratio: Scale, fromOffset: Rational, toOffset: Rational): Converter {
  if (ratio.isExact()) {
    const a = ratio.rational;
    const b = fromOffset.mul(a).sub(toOffset);
    const r = lcm(a.den, b.den);
    const p = a.num * (r / a.den);
    const q = b.num * (r / b.den);
    if (abs(p) < TWO_53 && abs(q) < TWO_53 && r < TWO_53) return integerMap(Number(p), Number(q), Number(r));
    return floatMap(a.toNumber(), b.toNumber(), true);
  }
  const scale = ratio.toNumber();
  const shift = fromOffset.toNumber() * scale - toOffset.toNumber();
  return floatMap(scale, shift, false);
}

/** y = (x*p + q)/r with integer p, q, r; one loop per shape so that no branch runs per element. */
function integerMap(p: number, q: number, r: number): Converter {
  if (q === 0 && r === 1) {
    if (p === 1) return build((x) => x, (xs, out) => { out.set(xs); }, true);
    return build((x) => x * p, (xs, out) => { for (let i = 0; i < xs.length; i++) out[i] = xs[i]! * p; }, true);
  }
  if (q === 0) {
    if (p === 1) return build((x) => x / r, (xs, out) => { for (let i = 0; i < xs.length; i++) out[i] = xs[i]! / r; }, true);
    return build((x) => (x * p) / r, (xs, out) => { for (let i = 0; i < xs.length; i++) out[i] = (xs[i]! * p) / r; }, true);
  }
  if (r === 1) return build((x) => x * p + q, (xs, out) => { for (let i = 0; i < xs.length; i++) out[i] = xs[i]! * p + q; }, true);
  return build((x) => (x * p + q) / r, (xs, out) => { for (let i = 0; i < xs.length; i++) out[i] = (xs[i]! * p + q) / r; }, true);
}

/** y = x*scale + shift in doubles. */
function floatMap(scale: number, shift: number, exact: boolean): Converter {
  if (shift === 0) {
    return build((x) => x * scale, (xs, out) => { for (let i = 0; i < xs.length; i++) out[i] = xs[i]! * scale; }, exact);
  }
  return build((x) => x * scale + shift, (xs, out) => { for (let i = 0; i < xs.length; i++) out[i] = xs[i]! * scale + shift; }, exact);
}

function build(apply: (x: number) => number, fill: (xs: Float64Array, out: Float64Array) => void, exact: boolean): Converter {
  const applyArray = (xs: Float64Array, out?: Float64Array): Float64Array => {
    const target = out ?? new Float64Array(xs.length);
    if (target.length !== xs.length) {
      throw new RangeError(`applyArray: output length ${target.length} differs from input length ${xs.length}`);
    }
    fill(xs, target);
    return target;
  };
  return Object.freeze({ apply, applyArray, exact });
}

function abs(x: bigint): bigint {
  return x < 0n ? -x : x;
}

function gcd(a: bigint, b: bigint): bigint {
  let x = abs(a);
  let y = abs(b);
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
}

function lcm(a: bigint, b: bigint): bigint {
  return (a / gcd(a, b)) * b;
}
