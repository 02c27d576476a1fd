import { describe, expect, it } from 'vitest';
import { notFiniteIn, notFiniteWarning } from '../../src/common/not-finite.js';
import { jsonReplacer } from '../../src/cli/run.js';

describe('no NaN or Infinity unannounced', () => {
  it('finds raw non-finite numbers (arrays shown as [*]) and the notFinite lists of values already written as null', () => {
    const doc = { a: 1, b: [2, NaN, Infinity], c: { d: -Infinity }, fit: { r2: null, notFinite: [{ path: 'r2', value: 'NaN', count: 1 }] } };
    expect(notFiniteIn(doc)).toEqual({ count: 4, paths: ['b[*]', 'c.d', 'fit.r2'] });
    expect(notFiniteIn({ a: [1, 2], b: { c: 'NaN text is text' } })).toEqual({ count: 0, paths: [] });
  });
  it('the warning names the places and how they are written; none for a clean document', () => {
    const w = notFiniteWarning({ x: NaN }, 'out.json')!;
    expect(w.code).toBe('not-finite');
    expect(w.message).toContain('1 value is not a finite number (NaN or Infinity) in out.json: x.');
    expect(notFiniteWarning({ x: 1 }, 'out.json')).toBeUndefined();
  });
  it('JSON writes them as strings a script can see, never as a silent null', () => {
    expect(JSON.stringify({ a: NaN, b: -Infinity }, jsonReplacer)).toBe('{"a":"NaN","b":"-Infinity"}');
  });
});
