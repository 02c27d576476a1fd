import { InputError, type SourceSpan } from '../common/errors.js';
import { MESSAGES } from './messages.js';
import type { Correlation, ValidityBound } from './types.js';

/**
 * Evaluating a correlation over columns (Float64Array per input) or at one point, and checking
 * its stated range of validity. Inputs are looked up by name; names the correlation does not use
 * are ignored (a comparison passes every column of the data), and an optional input that is not
 * given takes its default inside the correlation.
 */

/** Values by input name: a column per row, or one number for every row. */
export type InputValues = ReadonlyMap<string, Float64Array | number> | Readonly<Record<string, Float64Array | number>>;

function lookup(values: InputValues, name: string): Float64Array | number | undefined {
  if (values instanceof Map) return values.get(name);
  const rec = values as Readonly<Record<string, Float64Array | number>>;
  return Object.prototype.hasOwnProperty.call(rec, name) ? rec[name] : undefined;
}

/** The inputs of `c` in its order (NaN for an absent optional one) and the row count. */
interface Resolved {
  readonly n: number;
  readonly columns: readonly (Float64Array | number)[];
}

/**
 * @throws {InputError} 'correlation-missing-input' when a required input is absent.
 * @throws {RangeError} when columns differ in length (a programming error of the caller).
 */
function resolve(c: Correlation, values: InputValues, where: SourceSpan): Resolved {
  let n = -1;
  const columns = c.inputs.map((input) => {
    const v = lookup(values, input.name);
    if (v === undefined) {
      if (input.default !== undefined) return NaN;
      throw new InputError('correlation-missing-input', MESSAGES.missingInput(c, input.name), where);
    }
    if (typeof v !== 'number') {
      if (n >= 0 && v.length !== n) throw new RangeError(`evaluateCorrelation: column ${input.name} has ${v.length} rows, expected ${n}`);
      n = v.length;
    }
    return v;
  });
  return { n: n < 0 ? 1 : n, columns };
}

/**
 * The correlation at every row. `out` (length n) is reused when given.
 * @throws {InputError} 'correlation-missing-input' when a required input is absent (located at `where`).
 * @example evaluateCorrelation(BLASIUS, { Re: new Float64Array([1e4, 1e5]) }) // => Float64Array [0.03164, 0.017792...]
 */
export function evaluateCorrelation(c: Correlation, values: InputValues, out?: Float64Array, where: SourceSpan = {}): Float64Array {
  const { n, columns } = resolve(c, values, where);
  const result = out ?? new Float64Array(n);
  if (result.length !== n) throw new RangeError(`evaluateCorrelation: out has ${result.length} rows, expected ${n}`);
  const x = new Array<number>(columns.length).fill(NaN);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < columns.length; j++) {
      const col = columns[j]!;
      x[j] = typeof col === 'number' ? col : col[i]!;
    }
    result[i] = c.value(x);
  }
  return result;
}

/**
 * The correlation at one point.
 * @throws {InputError} 'correlation-missing-input' when a required input is absent.
 * @example correlationAt(COLEBROOK, { Re: 1e5, roughness: 1e-4 }) // => 0.018513866077... (Colebrook 1939)
 */
export function correlationAt(c: Correlation, point: Readonly<Record<string, number>> | ReadonlyMap<string, number>, where: SourceSpan = {}): number {
  return evaluateCorrelation(c, point, undefined, where)[0]!;
}

/** One input outside the range its source states. */
export interface RangeViolation {
  readonly input: string;
  readonly value: number;
  readonly bound: ValidityBound;
}

/**
 * Whether a value lies inside a bound (inclusive); NaN is never inside a bounded input.
 * @example withinBound({ input: 'Re', max: 800, source: '' }, 800) // => true
 */
export function withinBound(b: ValidityBound, v: number): boolean {
  if (b.min !== undefined && !(v >= b.min)) return false;
  if (b.max !== undefined && !(v <= b.max)) return false;
  return true;
}

/**
 * Every bound of `c` that the point violates. Inputs absent from the point are not checked.
 * @example rangeViolations(BLASIUS, { Re: 5e5 })[0]?.bound.max // => 100000
 */
export function rangeViolations(c: Correlation, point: Readonly<Record<string, number>> | ReadonlyMap<string, number>): RangeViolation[] {
  const out: RangeViolation[] = [];
  for (const b of c.range) {
    const v = point instanceof Map ? point.get(b.input) : (point as Readonly<Record<string, number>>)[b.input];
    if (v === undefined) continue;
    if (!withinBound(b, v)) out.push({ input: b.input, value: v, bound: b });
  }
  return out;
}

/**
 * 1 for each row where every bounded input lies in the stated range, 0 elsewhere.
 * @example inRangeMask(BLASIUS, { Re: Float64Array.of(2000, 5e4) }) // => Uint8Array [0, 1]
 * @throws {InputError} 'correlation-missing-input' when a required input is absent.
 */
export function inRangeMask(c: Correlation, values: InputValues, where: SourceSpan = {}): Uint8Array {
  const { n } = resolve(c, values, where);
  const mask = new Uint8Array(n).fill(1);
  for (const b of c.range) {
    const v = lookup(values, b.input);
    if (v === undefined) continue;
    for (let i = 0; i < n; i++) {
      if (!withinBound(b, typeof v === 'number' ? v : v[i]!)) mask[i] = 0;
    }
  }
  return mask;
}

/**
 * A bound as people write it: '2300', '0.05', '1e8', '3.6e7', '1e-6'.
 * @example compactNumber(100000000) // => '1e8'
 */
export function compactNumber(x: number): string {
  const a = Math.abs(x);
  if (x === 0 || !Number.isFinite(x) || (a >= 1e-3 && a < 1e5)) return String(x);
  const [mantissa, exponent] = x.toExponential().split('e');
  return `${mantissa}e${Number(exponent)}`;
}

/**
 * A list of bounds in words: 'Re <= 2300', '4000 <= Re <= 1e8, 0 <= roughness <= 0.05', or
 * 'no stated range'.
 * @example describeBounds(COLEBROOK.range) // => '4000 <= Re <= 1e8, 0 <= roughness <= 0.05'
 */
export function describeBounds(bounds: readonly ValidityBound[], format: (x: number) => string = compactNumber): string {
  if (bounds.length === 0) return 'no stated range';
  return bounds
    .map((b) =>
      b.min !== undefined && b.max !== undefined
        ? `${format(b.min)} <= ${b.input} <= ${format(b.max)}`
        : b.min !== undefined
          ? `${b.input} >= ${format(b.min)}`
          : `${b.input} <= ${format(b.max ?? Infinity)}`,
    )
    .join(', ');
}

/**
 * The stated range of a correlation in words (see describeBounds).
 * @example describeRange(STOKES) // => 'Re <= 0.1'
 */
export function describeRange(c: Correlation, format: (x: number) => string = compactNumber): string {
  return describeBounds(c.range, format);
}
