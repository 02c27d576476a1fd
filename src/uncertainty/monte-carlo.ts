import { InputError } from '../common/errors.js';
import type { CompiledFormula, Formula, FunctionTable } from '../expr/index.js';
import { BUILTIN_FUNCTIONS, compileFormula, namesIn } from '../expr/index.js';
import { correlationMatrix } from './correlation.js';
import { at, checkInputs, type UncertaintyInputs } from './inputs.js';
import { msg, UNCERTAINTY_ERROR } from './messages.js';
import { RandomStream } from './random.js';

/**
 * Propagation of distributions by Monte Carlo (JCGM 101:2008, "GUM Supplement 1"), row by row:
 * each uncertain input is drawn from a Gaussian with its value as mean and its standard
 * uncertainty as standard deviation (JCGM 101 6.4.7; jointly Gaussian with the stated
 * correlations, 6.4.8), the formula is evaluated on every draw, and the output distribution is
 * summarised by its mean, standard deviation (7.6) and the probabilistically symmetric 95 %
 * coverage interval (7.7). Seeded, so a run repeats exactly.
 *
 * The relative standard error of the Monte Carlo standard deviation is about 1/sqrt(2M) for a
 * near-Gaussian output (0.7 % at M = 10^4), far inside the 10 % by which compare.ts judges the
 * first-order result. JCGM 101 7.2.1 suggests M = 10^6 for a coverage interval to one or two
 * significant digits; the default here is 10^4 per row because every row is a separate
 * propagation; raise `samples` for a final report.
 */

export const MONTE_CARLO_DEFAULT_SAMPLES = 10_000;
export const MONTE_CARLO_MIN_SAMPLES = 100;

export interface MonteCarloOptions {
  /** Draws per row (M), default 10^4, at least 100. */
  readonly samples?: number;
  /** Seed of the random stream, default 1. */
  readonly seed?: number;
  readonly functions?: FunctionTable;
  /** Most draws evaluated in one batch (memory bound), default 2^18. */
  readonly batchDraws?: number;
}

export interface MonteCarloResult {
  readonly samples: number;
  readonly mean: Float64Array;
  /** Standard deviation of the output draws: the Monte Carlo standard uncertainty (JCGM 101 7.6). */
  readonly u: Float64Array;
  /** Probabilistically symmetric 95 % coverage interval (JCGM 101 7.7). */
  readonly low: Float64Array;
  readonly high: Float64Array;
  /** Fraction of draws per row that gave no finite value (statistics use the others). */
  readonly invalid: Float64Array;
}

/**
 * Monte Carlo propagation of the inputs' uncertainties through `formula`, per row.
 * @throws {InputError} 'uncertainty-value' for fewer than 100 samples or a negative
 *   uncertainty; 'uncertainty-correlation' for bad correlations; formula errors for unknown names.
 * @example propagateMonteCarlo(parseFormula('x^2'), { n: 1, values: new Map([['x', 0]]),
 *   uncertainties: new Map([['x', 1]]) }, { samples: 1e5, seed: 7 }).u[0] // => about 1.414 (sqrt 2)
 */
export function propagateMonteCarlo(formula: Formula, inputs: UncertaintyInputs, options: MonteCarloOptions = {}): MonteCarloResult {
  const samples = options.samples ?? MONTE_CARLO_DEFAULT_SAMPLES;
  if (!(Number.isInteger(samples) && samples >= MONTE_CARLO_MIN_SAMPLES)) {
    throw new InputError(UNCERTAINTY_ERROR.value, msg.samples(samples, MONTE_CARLO_MIN_SAMPLES));
  }
  checkInputs(inputs);
  const p = plan(formula, inputs, options.functions ?? BUILTIN_FUNCTIONS);
  const n = inputs.n;
  const result = {
    samples,
    mean: new Float64Array(n),
    u: new Float64Array(n),
    low: new Float64Array(n),
    high: new Float64Array(n),
    invalid: new Float64Array(n),
  };
  const rng = RandomStream.seeded(options.seed ?? 1);
  const rowsPerBatch = Math.max(1, Math.floor((options.batchDraws ?? 2 ** 18) / samples));
  for (let first = 0; first < n; first += rowsPerBatch) {
    const rows = Math.min(rowsPerBatch, n - first);
    const columns = new Map<string, Float64Array>();
    for (const name of [...p.uncertain, ...p.repeated]) columns.set(name, new Float64Array(rows * samples));
    for (let r = 0; r < rows; r++) drawRow(p, inputs, first + r, columns, r * samples, samples, rng);
    const y = p.compiled.bind({ n: rows * samples, vectors: columns, scalars: p.scalarValues }).evaluate([]);
    for (let r = 0; r < rows; r++) summarise(y.subarray(r * samples, (r + 1) * samples), first + r, result);
  }
  return result;
}

/** What is drawn, what is repeated, what stays a constant; the formula compiled for that layout. */
interface Plan {
  readonly uncertain: readonly string[];
  readonly repeated: readonly string[];
  /** Cholesky factor of the correlations among `uncertain` (k x k, lower, row-major). */
  readonly cholesky: Float64Array;
  readonly compiled: CompiledFormula;
  readonly scalarValues: ReadonlyMap<string, number>;
}

function plan(formula: Formula, inputs: UncertaintyInputs, functions: FunctionTable): Plan {
  const used = [...namesIn(formula)];
  const uncertain = used.filter((name) => inputs.uncertainties.has(name));
  const repeated = used.filter((name) => !inputs.uncertainties.has(name) && inputs.values.get(name) instanceof Float64Array);
  const scalars = used.filter((name) => !uncertain.includes(name) && !repeated.includes(name));
  const all = correlationMatrix([...inputs.uncertainties.keys()], inputs.correlations ?? []);
  const cholesky = subCholesky(all.r, all.names, uncertain);
  const compiled = compileFormula(formula, { vectors: [...uncertain, ...repeated], scalars, params: [] }, functions);
  const scalarValues = new Map<string, number>();
  for (const name of scalars) {
    const v = inputs.values.get(name);
    if (typeof v !== 'number') throw new RangeError(`propagateMonteCarlo: no value for ${JSON.stringify(name)}`);
    scalarValues.set(name, v);
  }
  return { uncertain, repeated, cholesky, compiled, scalarValues };
}

/** Fills draws [offset, offset + samples) of every column for one row: x + u (L z)  (JCGM 101 6.4.8). */
function drawRow(
  p: Plan,
  inputs: UncertaintyInputs,
  row: number,
  columns: ReadonlyMap<string, Float64Array>,
  offset: number,
  samples: number,
  rng: RandomStream,
): void {
  const k = p.uncertain.length;
  const means = p.uncertain.map((name) => at(inputs.values.get(name) ?? NaN, row));
  const sds = p.uncertain.map((name) => at(inputs.uncertainties.get(name)!, row));
  const drawn = p.uncertain.map((name) => columns.get(name)!);
  for (const name of p.repeated) columns.get(name)!.fill(at(inputs.values.get(name)!, row), offset, offset + samples);
  const z = new Float64Array(k);
  const l = p.cholesky;
  for (let s = 0; s < samples; s++) {
    for (let a = 0; a < k; a++) z[a] = rng.normal();
    for (let a = 0; a < k; a++) {
      let w = 0;
      for (let b = 0; b <= a; b++) w += l[a * k + b]! * z[b]!;
      drawn[a]![offset + s] = means[a]! + sds[a]! * w;
    }
  }
}

/** The Cholesky factor of the correlation submatrix over `names` (lower, row-major). */
function subCholesky(r: Float64Array, allNames: readonly string[], names: readonly string[]): Float64Array {
  const k = names.length;
  const index = names.map((name) => allNames.indexOf(name));
  const pairs = [];
  for (let a = 0; a < k; a++) {
    for (let b = a + 1; b < k; b++) {
      const rab = r[index[a]! * allNames.length + index[b]!]!;
      if (rab !== 0) pairs.push({ a: names[a]!, b: names[b]!, r: rab });
    }
  }
  return correlationMatrix(names, pairs).cholesky;
}

/** Mean, standard deviation and 95 % coverage interval of one row's finite draws (JCGM 101 7.6, 7.7). */
function summarise(
  draws: Float64Array,
  row: number,
  out: { mean: Float64Array; u: Float64Array; low: Float64Array; high: Float64Array; invalid: Float64Array },
): void {
  const finite = Float64Array.from(draws.filter((v) => Number.isFinite(v))).sort();
  const m = finite.length;
  out.invalid[row] = (draws.length - m) / draws.length;
  if (m < 2) {
    out.mean[row] = out.u[row] = out.low[row] = out.high[row] = NaN;
    return;
  }
  let sum = 0;
  for (const v of finite) sum += v;
  const mean = sum / m;
  let ss = 0;
  for (const v of finite) ss += (v - mean) ** 2;
  out.mean[row] = mean;
  out.u[row] = Math.sqrt(ss / (m - 1));
  // JCGM 101 7.7.2: q = pM (or its integer part + 1/2), r = (M - q)/2 (or (M - q + 1)/2); [y_(r), y_(r+q)], 1-based.
  const pm = 0.95 * m;
  const q = Number.isInteger(pm) ? pm : Math.floor(pm + 0.5);
  const lowIndex = (m - q) % 2 === 0 ? (m - q) / 2 : (m - q + 1) / 2;
  out.low[row] = finite[Math.max(lowIndex, 1) - 1]!;
  out.high[row] = finite[Math.min(lowIndex + q, m) - 1]!;
}
