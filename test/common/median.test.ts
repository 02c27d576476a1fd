import { describe, expect, it } from 'vitest';
import { finiteMedian } from '../../src/common/median.js';

// The median: the middle value of the sorted sample, or the mean of the two middle values for an
// even count (common practice, e.g. NIST/SEMATECH e-Handbook 1.3.5.1).
describe('finiteMedian', () => {
  it('odd and even counts', () => {
    expect(finiteMedian(Float64Array.of(3, 1, 2))).toBe(2);
    expect(finiteMedian(Float64Array.of(3, 1, 2, 10))).toBe(2.5);
  });
  it('leaves out NaN and infinities, NaN when nothing finite is left, and does not change its argument', () => {
    const x = Float64Array.of(5, NaN, -Infinity, 1, Infinity);
    expect(finiteMedian(x)).toBe(3);
    expect(Number.isNaN(finiteMedian(Float64Array.of(NaN, Infinity)))).toBe(true);
    expect(Number.isNaN(finiteMedian([]))).toBe(true);
    expect([...x]).toEqual([5, NaN, -Infinity, 1, Infinity]);
  });
});
