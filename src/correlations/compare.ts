import type { SourceSpan, Warning } from '../common/errors.js';
import { evaluateCorrelation, inRangeMask, type InputValues } from './evaluate.js';
import { MESSAGES } from './messages.js';
import { ratioStatistics, slipFromStatistics } from './slip.js';
import type { Correlation, ReturnedSymbol } from './types.js';

/**
 * Data against a handbook correlation, point by point. The deviation of a point is
 * (data - correlation)/correlation in per cent, signed: +10 means the data sit 10 % above the
 * handbook form. Points outside the correlation's stated range keep their deviation (a report
 * shows them) but are not counted in the summary figures.
 */

/** Summary of signed per-cent deviations. All figures in per cent; shares are per cent of counted points. */
export interface DeviationSummary {
  readonly counted: number;
  readonly meanDeviation: number;
  readonly meanAbsDeviation: number;
  readonly rmsDeviation: number;
  readonly maxAbsDeviation: number;
  /** Row of the largest absolute deviation (-1 when nothing was counted). */
  readonly maxAbsRow: number;
  readonly within5: number;
  readonly within10: number;
  readonly within20: number;
}

export interface ComparisonData {
  /** The measured quantity the correlation returns (f_D for a Darcy form, C_D, Nu), one per row. */
  readonly response: Float64Array;
  /** Columns (or constants) by input name: Re, roughness, Pr... Names the correlation does not use are ignored. */
  readonly inputs: InputValues;
  /** The new fitted correlation at the same rows, when there is one. */
  readonly fitted?: Float64Array;
}

export interface Comparison extends DeviationSummary {
  readonly id: string;
  readonly title: string;
  readonly returns: ReturnedSymbol;
  /** Rows in the data. */
  readonly n: number;
  /** Rows with an input outside the stated range (shown, not counted). */
  readonly outOfRange: number;
  /** Rows where the data or the correlation is not a finite number, or the correlation is not positive. */
  readonly notEvaluable: number;
  /** The correlation at every row. */
  readonly correlation: Float64Array;
  /** Signed deviation of the data in per cent at every row (NaN where not evaluable). */
  readonly deviation: Float64Array;
  /** 1 where the row lies inside the stated range. */
  readonly inRange: Uint8Array;
  /** Deviation of the new fit from the correlation over the counted rows, or null without a fit. */
  readonly fitDeviation: DeviationSummary | null;
  /** Median of data/correlation over the counted rows (of the logarithms, back-transformed; NaN when none). */
  readonly medianRatio: number;
  /** 'factor-mismatch' when the data sit at a constant slip factor from the form; 'comparison-out-of-range' when nothing was counted. */
  readonly warnings: readonly Warning[];
}

/**
 * Compares data (and optionally a new fit) with one correlation.
 * `args` fixes inputs that are not columns of the data (roughness = 0.0015), or maps them to
 * other columns; it takes precedence over `data.inputs`.
 *
 * @throws {InputError} 'correlation-missing-input' when an input the correlation needs is in neither.
 * @throws {RangeError} when columns differ in length from the response.
 * @example
 *   compareWithCorrelation({ response: Float64Array.of(0.034804), inputs: { Re: Float64Array.of(1e4) } }, BLASIUS).meanDeviation
 *   // => 10 (per cent): Blasius gives 0.3164 * 1e4^-0.25 = 0.03164, and 0.034804 = 1.1 * 0.03164
 */
export function compareWithCorrelation(
  data: ComparisonData,
  correlation: Correlation,
  args: InputValues = {},
  where: SourceSpan = {},
): Comparison {
  const n = data.response.length;
  const values = mergeInputs(data.inputs, args);
  const predicted = evaluateCorrelation(correlation, values, undefined, where);
  const inRange = inRangeMask(correlation, values, where);
  // When every input is a constant the correlation has one value for all rows.
  const corr = predicted.length === n ? predicted : broadcast(predicted, n);
  const mask = inRange.length === n ? inRange : Uint8Array.from(broadcast(Float64Array.from(inRange), n));
  if (data.fitted !== undefined && data.fitted.length !== n) {
    throw new RangeError(`compareWithCorrelation: fitted has ${data.fitted.length} rows, response ${n}`);
  }

  const deviation = new Float64Array(n);
  const counted = new Uint8Array(n);
  let outOfRange = 0;
  let notEvaluable = 0;
  for (let i = 0; i < n; i++) {
    const y = data.response[i]!;
    const c = corr[i]!;
    if (!(Number.isFinite(y) && Number.isFinite(c) && c > 0)) {
      deviation[i] = NaN;
      notEvaluable++;
      continue;
    }
    deviation[i] = ((y - c) / c) * 100;
    if (mask[i] === 1) counted[i] = 1;
    else outOfRange++;
  }
  const summary = summarizeDeviations(deviation, counted);
  const fitDeviation = data.fitted === undefined ? null : fitSummary(data.fitted, corr, counted);
  const stats = ratioStatistics(countedRatios(data.response, corr, counted));
  const warnings: Warning[] = [];
  const slip = slipFromStatistics(stats, correlation);
  if (slip !== null) warnings.push(slip);
  if (summary.counted === 0 && n > 0) {
    warnings.push({ code: 'comparison-out-of-range', message: MESSAGES.nothingCounted(correlation, outOfRange, notEvaluable) });
  }
  return {
    id: correlation.id,
    title: correlation.title,
    returns: correlation.returns.symbol,
    n,
    outOfRange,
    notEvaluable,
    ...summary,
    correlation: corr,
    deviation,
    inRange: mask,
    fitDeviation,
    medianRatio: stats.medianRatio,
    warnings,
  };
}

function broadcast(values: Float64Array, n: number): Float64Array {
  if (values.length !== 1) throw new RangeError(`compareWithCorrelation: inputs have ${values.length} rows, response ${n}`);
  return new Float64Array(n).fill(values[0]!);
}

function mergeInputs(inputs: InputValues, args: InputValues): Map<string, Float64Array | number> {
  const m = new Map<string, Float64Array | number>(inputs instanceof Map ? inputs : Object.entries(inputs));
  for (const [k, v] of args instanceof Map ? args : Object.entries(args)) m.set(k, v);
  return m;
}

/**
 * Mean, mean absolute, RMS and maximum absolute of the deviations (per cent) at the rows marked
 * 1 in `counted`, and the per cent of those rows within 5, 10 and 20 % (inclusive).
 * @example summarizeDeviations(new Float64Array([1, -3, 12]), new Uint8Array([1, 1, 1])).within10 // => 66.666...
 */
export function summarizeDeviations(deviation: Float64Array, counted: Uint8Array): DeviationSummary {
  let k = 0;
  let sum = 0;
  let sumAbs = 0;
  let sumSq = 0;
  let maxAbs = -1;
  let maxAbsRow = -1;
  let w5 = 0;
  let w10 = 0;
  let w20 = 0;
  for (let i = 0; i < deviation.length; i++) {
    if (counted[i] !== 1) continue;
    const d = deviation[i]!;
    const a = Math.abs(d);
    k++;
    sum += d;
    sumAbs += a;
    sumSq += d * d;
    if (a > maxAbs) {
      maxAbs = a;
      maxAbsRow = i;
    }
    if (a <= 5) w5++;
    if (a <= 10) w10++;
    if (a <= 20) w20++;
  }
  const share = (c: number) => (k === 0 ? NaN : (100 * c) / k);
  return {
    counted: k,
    meanDeviation: k === 0 ? NaN : sum / k,
    meanAbsDeviation: k === 0 ? NaN : sumAbs / k,
    rmsDeviation: k === 0 ? NaN : Math.sqrt(sumSq / k),
    maxAbsDeviation: k === 0 ? NaN : maxAbs,
    maxAbsRow,
    within5: share(w5),
    within10: share(w10),
    within20: share(w20),
  };
}

function fitSummary(fitted: Float64Array, corr: Float64Array, counted: Uint8Array): DeviationSummary {
  const dev = new Float64Array(fitted.length);
  const use = new Uint8Array(fitted.length);
  for (let i = 0; i < fitted.length; i++) {
    const f = fitted[i]!;
    if (counted[i] !== 1 || !Number.isFinite(f)) continue;
    dev[i] = ((f - corr[i]!) / corr[i]!) * 100;
    use[i] = 1;
  }
  return summarizeDeviations(dev, use);
}

function countedRatios(response: Float64Array, corr: Float64Array, counted: Uint8Array): Float64Array {
  const out = new Float64Array(response.length);
  let k = 0;
  for (let i = 0; i < response.length; i++) {
    if (counted[i] === 1) out[k++] = response[i]! / corr[i]!;
  }
  return out.subarray(0, k);
}

/**
 * Median of the values (NaN for none).
 * @example median(Float64Array.of(3, 1, 2, 10)) // => 2.5
 */
export function median(values: Float64Array): number {
  if (values.length === 0) return NaN;
  const s = Float64Array.from(values).sort();
  const m = s.length >> 1;
  return s.length % 2 === 1 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}
