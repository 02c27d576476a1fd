import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import {
  BLASIUS,
  COLEBROOK,
  compareWithCorrelation,
  correlationAt,
  parseCompareEntry,
  summarizeDeviations,
} from '../../src/correlations/index.js';

/**
 * compareWithCorrelation on data built with known deviations from a handbook form: the expected
 * figures are the arithmetic of the deviations the test put in (not values the code produced).
 * Blasius (1913), f_D = 0.3164 Re^-0.25, range 3000 <= Re <= 1e5.
 */

const re = Float64Array.from([4e3, 1e4, 2e4, 5e4, 8e4, 2e5]);
const putIn = [9.5, -4.5, 2, 0, -19.5, 30]; // per cent; the last row (Re 2e5) is outside Blasius's range
const response = Float64Array.from(re, (r, i) => 0.3164 * Math.pow(r, -0.25) * (1 + putIn[i]! / 100));

describe('compareWithCorrelation: deviation figures', () => {
  const c = compareWithCorrelation({ response, inputs: { Re: re } }, BLASIUS);

  it('deviation = (data - correlation)/correlation in per cent, signed, at every row (the out-of-range row too)', () => {
    putIn.forEach((d, i) => expect(c.deviation[i]).toBeCloseTo(d, 10));
  });

  it('counts only the rows inside the stated range: 5 counted, 1 out of range (Re 2e5 > 1e5)', () => {
    expect(c.counted).toBe(5);
    expect(c.outOfRange).toBe(1);
    expect(Array.from(c.inRange)).toEqual([1, 1, 1, 1, 1, 0]);
  });

  it('mean (9.5-4.5+2+0-19.5)/5 = -2.5, mean absolute 35.5/5 = 7.1, RMS sqrt(494.75/5), max 19.5 at row 4', () => {
    expect(c.meanDeviation).toBeCloseTo(-2.5, 10);
    expect(c.meanAbsDeviation).toBeCloseTo(7.1, 10);
    expect(c.rmsDeviation).toBeCloseTo(Math.sqrt((90.25 + 20.25 + 4 + 0 + 380.25) / 5), 10);
    expect(c.maxAbsDeviation).toBeCloseTo(19.5, 10);
    expect(c.maxAbsRow).toBe(4);
  });

  it('shares within 5/10/20 % of the counted points (inclusive): 3/5, 4/5, 5/5 -> 60, 80, 100 per cent', () => {
    expect(c.within5).toBe(60);
    expect(c.within10).toBe(80);
    expect(c.within20).toBe(100);
  });

  it('the median ratio of the counted rows is 1.00 (deviations 9.5, -4.5, 2, 0, -19.5: median 0 %)', () => {
    expect(c.medianRatio).toBeCloseTo(1, 12);
    expect(c.warnings).toEqual([]);
  });
});

describe('compareWithCorrelation: the new fit and arguments', () => {
  it('fitDeviation is the deviation of the fitted curve from the form over the counted rows (fit put in at +3 %)', () => {
    const fitted = Float64Array.from(re, (r) => 0.3164 * Math.pow(r, -0.25) * 1.03);
    const c = compareWithCorrelation({ response, inputs: { Re: re }, fitted }, BLASIUS);
    expect(c.fitDeviation?.counted).toBe(5);
    expect(c.fitDeviation?.meanDeviation).toBeCloseTo(3, 10);
    expect(c.fitDeviation?.maxAbsDeviation).toBeCloseTo(3, 10);
  });

  it('args fix an input that is not a column (roughness = 1e-4) and take precedence over a column of the same name', () => {
    const f = Float64Array.from(re, (r) => correlationAt(COLEBROOK, { Re: r, roughness: 1e-4 }));
    const c = compareWithCorrelation({ response: f, inputs: { Re: re, roughness: new Float64Array(6).fill(0.04) } }, COLEBROOK, { roughness: 1e-4 });
    expect(c.maxAbsDeviation).toBeLessThan(1e-12);
    expect(c.counted).toBe(6);
  });

  it('a row whose data is NaN is not evaluable, and is neither counted nor out of range', () => {
    const r2 = Float64Array.from(response);
    r2[1] = NaN;
    const c = compareWithCorrelation({ response: r2, inputs: { Re: re } }, BLASIUS);
    expect(c.notEvaluable).toBe(1);
    expect(c.counted).toBe(4);
    expect(c.deviation[1]).toBeNaN();
  });

  it('when no row is in range, the figures are NaN and a comparison-out-of-range warning says why', () => {
    const high = Float64Array.from([2e5, 3e5, 5e5]);
    const c = compareWithCorrelation({ response: Float64Array.from(high, (r) => 0.3164 * r ** -0.25), inputs: { Re: high } }, BLASIUS);
    expect(c.counted).toBe(0);
    expect(c.meanDeviation).toBeNaN();
    expect(c.warnings.map((w) => w.code)).toEqual(['comparison-out-of-range']);
  });

  it('a missing input is an InputError located where the caller says', () => {
    try {
      compareWithCorrelation({ response, inputs: { Re: re } }, COLEBROOK, {}, { file: 'study.yaml', line: 9 });
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).kind).toBe('correlation-missing-input');
      expect((e as InputError).where.line).toBe(9);
    }
  });
});

describe('summarizeDeviations', () => {
  it('NaN figures and row -1 when nothing is counted', () => {
    const s = summarizeDeviations(Float64Array.from([1, 2]), new Uint8Array(2));
    expect(s.counted).toBe(0);
    expect(s.rmsDeviation).toBeNaN();
    expect(s.maxAbsRow).toBe(-1);
  });
});

describe('parseCompareEntry (a study compare: entry, issue 6)', () => {
  it('an id alone: blasius', () => {
    const r = parseCompareEntry('blasius');
    expect(r.correlation.id).toBe('blasius');
    expect(r.args.size).toBe(0);
  });
  it('an id with arguments: {colebrook: {roughness: 0.0015}}, or a name of a constant or column', () => {
    expect(parseCompareEntry({ colebrook: { roughness: 0.0015 } }).args.get('roughness')).toBe(0.0015);
    expect(parseCompareEntry({ colebrook: { roughness: 'eps_rel' } }).args.get('roughness')).toBe('eps_rel');
  });
  it('an argument the correlation does not take is correlation-unknown-input with the nearest name', () => {
    try {
      parseCompareEntry({ colebrook: { rougness: 0.001 } }, { file: 'study.yaml', line: 4 });
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).kind).toBe('correlation-unknown-input');
      expect((e as InputError).hint).toMatch(/roughness/);
    }
  });
  it('other shapes are compare-syntax: a list, two keys, a number, a boolean argument', () => {
    for (const bad of [['blasius'], { blasius: {}, colebrook: {} }, 42, { colebrook: { roughness: true } }, { colebrook: [1] }]) {
      expect(() => parseCompareEntry(bad)).toThrow(InputError);
    }
  });
});
