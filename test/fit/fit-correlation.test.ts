/**
 * fitCorrelation: errors by kind, warnings as data, statuses. The data are small invented tables
 * whose properties (a constant group, a group that is a power of another, a value <= 0) are
 * built in, so each expected outcome follows from the data's construction, not from the code.
 */
import { describe, expect, it } from 'vitest';
import { InputError, WarningList } from '../../src/common/errors.js';
import { parseFormula } from '../../src/expr/index.js';
import { FIT_ERROR, FIT_WARNING, fitCorrelation } from '../../src/fit/index.js';
import type { FitInput } from '../../src/fit/index.js';
import { SeededRandom } from './random.js';
import { SEED } from '../seed.js';

const rng = new SeededRandom(SEED);
const N = 12;
const re = Float64Array.from({ length: N }, (_, i) => 1e4 * 1.2 ** i);
const ldFree = Float64Array.from({ length: N }, (_, i) => [20, 50, 120, 35, 80, 200][i % 6]!);
const f = Float64Array.from({ length: N }, (_, i) => 0.3 * re[i]! ** -0.25 * ldFree[i]! ** 0.05 * Math.exp(0.02 * rng.normal()));

function input(overrides: Partial<FitInput> & { columns?: Map<string, Float64Array> }): FitInput {
  return {
    n: N,
    columns: new Map([['f', f], ['Re', re], ['LD', ldFree]]),
    response: 'f',
    model: parseFormula('C*Re^a*LD^b'),
    parameters: new Map([['C', 0.3], ['a', -0.2], ['b', 0]]),
    method: 'auto',
    ...overrides,
  };
}

function errorOf(run: () => unknown): InputError {
  try {
    run();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}

const source = { file: ['loop-a.csv'], fileIndex: new Uint32Array(N), line: Uint32Array.from({ length: N }, (_, i) => i + 5) };

describe('fitCorrelation errors (InputError kinds)', () => {
  it("fit-nonpositive: method 'log-linear' with f <= 0 names the first rows by file:line", () => {
    const bad = Float64Array.from(f);
    bad[2] = 0;
    bad[7] = -0.01;
    const e = errorOf(() => fitCorrelation(input({ columns: new Map([['f', bad], ['Re', re], ['LD', ldFree]]), method: 'log-linear', rowSource: source }), new WarningList()));
    expect(e.kind).toBe(FIT_ERROR.nonpositive);
    expect(e.message).toContain('loop-a.csv:7, loop-a.csv:12');
    expect(e.message).toContain('f > 0');
  });

  it("method 'auto' with f <= 0 falls back to linear space and warns fit-log-space-impossible", () => {
    const bad = Float64Array.from(f);
    bad[2] = -1e-4;
    const sink = new WarningList();
    const r = fitCorrelation(input({ columns: new Map([['f', bad], ['Re', re], ['LD', ldFree]]) }), sink);
    expect(r.method).toBe('nonlinear');
    expect(sink.items.map((w) => w.code)).toContain(FIT_WARNING.logSpaceImpossible);
  });

  it('fit-too-few-points: n <= p', () => {
    const three = new Map([['f', f.slice(0, 3)], ['Re', re.slice(0, 3)], ['LD', ldFree.slice(0, 3)]]);
    expect(errorOf(() => fitCorrelation(input({ n: 3, columns: three }), new WarningList())).kind).toBe(FIT_ERROR.tooFewPoints);
  });

  it('fit-rank-deficient: L/D constant in the data names b, C and LD', () => {
    const ld = new Float64Array(N).fill(50);
    const e = errorOf(() => fitCorrelation(input({ columns: new Map([['f', f], ['Re', re], ['LD', ld]]) }), new WarningList()));
    expect(e.kind).toBe(FIT_ERROR.rankDeficient);
    expect(e.message).toBe(
      'b and C cannot be determined: LD is constant in the data (every row has LD = 50), so it cannot be told apart from the coefficient',
    );
  });

  it('fit-rank-deficient: L/D = 0.01 Re^0.5 in every row: a and b cannot be told apart', () => {
    const ld = Float64Array.from(re, (r) => 0.01 * Math.sqrt(r));
    const e = errorOf(() => fitCorrelation(input({ columns: new Map([['f', f], ['Re', re], ['LD', ld]]) }), new WarningList()));
    expect(e.kind).toBe(FIT_ERROR.rankDeficient);
    expect(e.message).toBe('a and b cannot be told apart: Re and LD change together in the data (one is a power of the others in every row)');
  });

  it('fit-rank-deficient for a general model whose parameters only appear as a product (a*b*x)', () => {
    const e = errorOf(() =>
      fitCorrelation(input({ model: parseFormula('a*b*Re'), parameters: new Map([['a', 1], ['b', 1]]), method: 'nonlinear' }), new WarningList()),
    );
    expect(e.kind).toBe(FIT_ERROR.rankDeficient);
    expect(e.message).toContain('a and b');
  });

  it('fit-nonfinite-data names the column and rows', () => {
    const bad = Float64Array.from(re);
    bad[4] = NaN;
    const e = errorOf(() => fitCorrelation(input({ columns: new Map([['f', f], ['Re', bad], ['LD', ldFree]]), rowSource: source }), new WarningList()));
    expect(e.kind).toBe(FIT_ERROR.nonfiniteData);
    expect(e.message).toBe('column "Re" has values that are not finite numbers at loop-a.csv:9');
  });

  it('fit-parameters: a model name that is neither a column nor a parameter; a start for an unused name', () => {
    expect(errorOf(() => fitCorrelation(input({ parameters: new Map([['C', 1], ['a', 0]]) }), new WarningList())).message).toBe('parameter b has no start value');
    expect(errorOf(() => fitCorrelation(input({ parameters: new Map([['C', 1], ['a', 0], ['b', 0], ['k', 1]]) }), new WarningList())).kind).toBe(FIT_ERROR.parameters);
  });

  it('fit-missing-column for the response; fit-weights for a non-positive weight', () => {
    expect(errorOf(() => fitCorrelation(input({ response: 'fD' }), new WarningList())).kind).toBe(FIT_ERROR.missingColumn);
    const w = new Float64Array(N).fill(1);
    w[0] = 0;
    expect(errorOf(() => fitCorrelation(input({ weights: w }), new WarningList())).kind).toBe(FIT_ERROR.weights);
  });

  it("fit-method-mismatch: 'log-linear' for a model that is not a power product", () => {
    const e = errorOf(() => fitCorrelation(input({ model: parseFormula('C*Re^a + b'), method: 'log-linear' }), new WarningList()));
    expect(e.kind).toBe(FIT_ERROR.methodMismatch);
  });

  it('fit-start-invalid: sqrt of a negative number at the start values names the rows', () => {
    const e = errorOf(() =>
      fitCorrelation(input({ model: parseFormula('sqrt(C*Re)'), parameters: new Map([['C', -1]]), method: 'nonlinear', rowSource: source }), new WarningList()),
    );
    expect(e.kind).toBe(FIT_ERROR.startInvalid);
    expect(e.message).toContain('loop-a.csv:5');
  });

  it('fit-option: a confidence level outside (0, 1)', () => {
    expect(errorOf(() => fitCorrelation(input({ options: { level: 95 } }), new WarningList())).kind).toBe(FIT_ERROR.option);
  });
});

describe('fitCorrelation warnings and statuses', () => {
  it('groups-collinear: L/D nearly proportional to Re^0.5 warns, naming a, b, Re and LD', () => {
    const ld = Float64Array.from(re, (r, i) => 0.01 * Math.sqrt(r) * (1 + 0.01 * Math.sin(i)));
    const sink = new WarningList();
    fitCorrelation(input({ columns: new Map([['f', f], ['Re', re], ['LD', ld]]) }), sink);
    const w = sink.items.find((x) => x.code === FIT_WARNING.groupsCollinear);
    expect(w?.message).toMatch(/^a and b are hard to tell apart: LD changes together with Re in the data \(correlation 1\.000 in log space, VIF/);
  });

  it('independent groups: VIFs near 1 and no collinearity warning', () => {
    const sink = new WarningList();
    const r = fitCorrelation(input({}), sink);
    expect(sink.items.map((w) => w.code)).not.toContain(FIT_WARNING.groupsCollinear);
    for (const v of r.design!.vif) expect(v).toBeLessThan(2);
  });

  it('fit-not-converged: an iteration limit of 2 from a far start returns the best point with its status', () => {
    const sink = new WarningList();
    const r = fitCorrelation(input({ method: 'nonlinear', parameters: new Map([['C', 100], ['a', 1], ['b', 1]]), options: { maxIterations: 2 } }), sink);
    expect(r.status.converged).toBe(false);
    expect(r.status.code).toBe('iteration-limit');
    expect(sink.items.map((w) => w.code)).toContain(FIT_WARNING.notConverged);
  });

  it('every accepted step lowers the sum of squares: the result is never worse than the start', () => {
    const start = new Map([['C', 100], ['a', 1], ['b', 1]]);
    for (const maxIterations of [1, 2, 3, 5, 8]) {
      const r = fitCorrelation(input({ method: 'nonlinear', parameters: start, options: { maxIterations } }), new WarningList());
      let rssStart = 0;
      for (let i = 0; i < N; i++) rssStart += (100 * re[i]! * ldFree[i]! - f[i]!) ** 2;
      expect(r.rss).toBeLessThan(rssStart);
    }
  });

  it('ranges: min and max of the response and of every group used', () => {
    const r = fitCorrelation(input({}), new WarningList());
    expect(r.ranges.map((g) => g.name)).toEqual(['f', 'Re', 'LD']);
    expect(r.ranges[1]).toEqual({ name: 'Re', min: re[0], max: re[N - 1] });
    expect(r.ranges[2]).toEqual({ name: 'LD', min: 20, max: 200 });
  });

  it('group tests: Re matters (p < 0.05); the t statistic is estimate / standard error', () => {
    const r = fitCorrelation(input({}), new WarningList());
    const a = r.groupTests.find((g) => g.group === 'Re')!;
    expect(a.verdict).toBe('matters');
    expect(a.t).toBeCloseTo(r.parameters[1]!.estimate / r.parameters[1]!.stdError, 12);
  });
});
