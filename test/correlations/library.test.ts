import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError } from '../../src/common/errors.js';
import {
  BLASIUS,
  COLEBROOK,
  CORRELATIONS,
  correlationAt,
  describeRange,
  evaluateCorrelation,
  findCorrelation,
  GNIELINSKI,
  inRangeMask,
  listCorrelations,
  rangeViolations,
  SIEDER_TATE,
  type Correlation,
} from '../../src/correlations/index.js';
import { Dimension } from '../../src/units/index.js';
import { evaluateAt, inferDimension, namesIn, parseFormula } from '../../src/expr/index.js';
import { SEED } from '../seed.js';

/** Three points per input: inside the stated range where there is one, typical values otherwise. */
function samplePoints(c: Correlation): Record<string, number>[] {
  const typical: Record<string, [number, number, number]> = {
    Re: [2e3, 1e5, 1e7],
    roughness: [0, 1e-4, 1e-2],
    Pr: [0.7, 5, 100],
    viscosityRatio: [0.5, 1, 3],
    f_D: [0.015, 0.02, 0.04],
  };
  const values = c.inputs.map((input) => {
    const b = c.range.find((r) => r.input === input.name);
    const t = typical[input.name];
    if (t === undefined) throw new Error(`no typical values for ${input.name}`);
    if (b === undefined) return t;
    const lo = b.min !== undefined && b.min > 0 ? b.min : (b.max ?? 1) * 1e-3;
    const hi = b.max ?? lo * 1e3;
    return [lo, Math.sqrt(lo * hi), hi] as [number, number, number];
  });
  return [0, 1, 2].map((k) => Object.fromEntries(c.inputs.map((input, j) => [input.name, values[j]![k]!])));
}

describe('the library as data', () => {
  it('has the 19 correlations issue 6 names, 9 Fanning twins and the extra printings, each id once, lower-case and dashed', () => {
    const ids = CORRELATIONS.map((c) => c.id);
    for (const id of [
      'colebrook', 'blasius', 'haaland', 'swamee-jain', 'churchill-1977', 'hagen-poiseuille', 'prandtl-karman', 'von-karman-rough',
      'mckeon-2005', 'stokes', 'oseen', 'schiller-naumann', 'clift-gauvin', 'haider-levenspiel', 'morrison-2013', 'brown-lawler-2003',
      'dittus-boelter', 'sieder-tate', 'gnielinski',
    ]) {
      expect(ids).toContain(id);
    }
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids.filter((id) => id.endsWith('-fanning')).length).toBe(9);
    for (const id of ids) expect(id).toMatch(/^[a-z][a-z0-9]*(-[a-z0-9]+)*$/);
  });

  it('every entry names its source with a year, states each bound with a source, and bounds only its own inputs', () => {
    for (const c of CORRELATIONS) {
      expect(c.source, c.id).toMatch(/\((1[89]\d\d|20\d\d)\)/);
      for (const b of c.range) {
        expect(c.inputs.map((i) => i.name), c.id).toContain(b.input);
        expect(b.source.length, c.id).toBeGreaterThan(10);
        if (b.min !== undefined && b.max !== undefined) expect(b.min, c.id).toBeLessThan(b.max);
      }
    }
  });

  it('each equation parses, uses only its inputs and returned symbol, and is dimensionless on both sides (formula engine)', () => {
    const none = Dimension.NONE;
    for (const c of CORRELATIONS) {
      const allowed = new Set([...c.inputs.map((i) => i.name), c.returns.symbol]);
      for (const side of [c.equation.left, c.equation.right]) {
        const f = parseFormula(side);
        for (const n of namesIn(f)) expect(allowed.has(n), `${c.id}: ${n}`).toBe(true);
        expect(inferDimension(f, () => none).dimension.isDimensionless(), c.id).toBe(true);
      }
    }
  });

  it('each numeric implementation satisfies its own printed equation, evaluated by the formula engine, to 1e-12 (catches a coefficient typed differently in the two)', () => {
    for (const c of CORRELATIONS) {
      for (const point of samplePoints(c)) {
        const y = correlationAt(c, point);
        expect(Number.isFinite(y) && y > 0, `${c.id} at ${JSON.stringify(point)}: ${y}`).toBe(true);
        const values = new Map(Object.entries(point));
        values.set(c.returns.symbol, y);
        const left = evaluateAt(parseFormula(c.equation.left), values);
        const right = evaluateAt(parseFormula(c.equation.right), values);
        expect(Math.abs(left - right) / Math.max(Math.abs(left), Math.abs(right)), `${c.id} at ${JSON.stringify(point)}`).toBeLessThan(1e-12);
      }
    }
  });

  it('optional inputs: their default formula gives the same value as leaving them out (Sieder-Tate ratio 1; Gnielinski with Filonenko f)', () => {
    for (const c of [SIEDER_TATE, GNIELINSKI]) {
      const point = { Re: 5e4, Pr: 3 };
      const optional = c.inputs.find((i) => i.default !== undefined)!;
      const dflt = evaluateAt(parseFormula(optional.default!.formula), new Map(Object.entries(point)));
      expect(correlationAt(c, point)).toBe(correlationAt(c, { ...point, [optional.name]: dflt }));
    }
  });

  it('listCorrelations filters by family; findCorrelation ignores case and spaces', () => {
    expect(listCorrelations('heat-transfer').map((c) => c.id)).toEqual(['dittus-boelter', 'dittus-boelter-cooling', 'sieder-tate', 'gnielinski']);
    expect(findCorrelation(' Swamee-Jain ').id).toBe('swamee-jain');
  });

  it('findCorrelation: an unknown id is an InputError correlation-unknown with the nearest ids as a hint', () => {
    try {
      findCorrelation('colebroke', { file: 'study.yaml', line: 12, column: 5 });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      const err = e as InputError;
      expect(err.kind).toBe('correlation-unknown');
      expect(err.hint).toMatch(/^did you mean colebrook/);
      expect(err.where.line).toBe(12);
    }
  });
});

describe('evaluateCorrelation and the range checks', () => {
  it('a column gives the same values as one point at a time (seeded property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 3, max: 8, noNaN: true }), { minLength: 1, maxLength: 20 }), (lgRe) => {
        const re = Float64Array.from(lgRe, (l) => 10 ** l);
        const col = evaluateCorrelation(COLEBROOK, { Re: re, roughness: 1e-4 });
        re.forEach((r, i) => expect(col[i]).toBe(correlationAt(COLEBROOK, { Re: r, roughness: 1e-4 })));
      }),
      { seed: SEED, numRuns: 50 },
    );
  });

  it('a missing required input is an InputError correlation-missing-input naming it', () => {
    expect(() => correlationAt(COLEBROOK, { Re: 1e5 })).toThrow(/'colebrook' needs roughness/);
    try {
      evaluateCorrelation(COLEBROOK, new Map([['Re', 1e5]]));
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).kind).toBe('correlation-missing-input');
    }
  });

  it('columns of different lengths are a programming error (RangeError)', () => {
    expect(() => evaluateCorrelation(COLEBROOK, { Re: new Float64Array(3), roughness: new Float64Array(2) })).toThrow(RangeError);
  });

  it('rangeViolations and inRangeMask: Blasius is stated for 3000 <= Re <= 1e5 (textbook range, see friction.ts)', () => {
    expect(rangeViolations(BLASIUS, { Re: 2e5 }).map((v) => v.bound.max)).toEqual([1e5]);
    expect(rangeViolations(BLASIUS, { Re: 1e5 })).toEqual([]);
    expect(Array.from(inRangeMask(BLASIUS, { Re: Float64Array.from([2000, 3000, 5e4, 1e5, 2e5, NaN]) }))).toEqual([0, 1, 1, 1, 0, 0]);
  });

  it('describeRange writes bounds as people do', () => {
    expect(describeRange(COLEBROOK)).toBe('4000 <= Re <= 1e8, 0 <= roughness <= 0.05');
    expect(describeRange(findCorrelation('churchill-1977'))).toBe('no stated range');
    expect(describeRange(findCorrelation('stokes'))).toBe('Re <= 0.1');
  });
});
