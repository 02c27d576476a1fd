import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { Dimension } from '../../src/units/dimension.js';
import { compileFormula, differentiate, evaluateAt, inferDimension, parseFormula } from '../../src/expr/index.js';

// Names that are special to JavaScript objects: as formula names they must be ordinary names,
// resolved through Maps or own properties, never through the prototype chain.
const TRICKY = ['constructor', '__proto__', 'toString', 'prototype', 'hasOwnProperty', 'valueOf', '__defineGetter__'];

/** A record with the given own properties and no prototype (so '__proto__' is an ordinary key). */
function nullRecord<T>(entries: readonly (readonly [string, T])[]): Record<string, T> {
  const r = Object.create(null) as Record<string, T>;
  for (const [k, v] of entries) r[k] = v;
  return r;
}

describe('safety: prototype-related names are ordinary names', () => {
  it('as data columns, constants and parameters (Map inputs and null-prototype records)', () => {
    const [c0, c1, s0, p0, p1] = ['constructor', '__proto__', 'toString', 'prototype', 'valueOf'];
    const text = `${c0}*${p0} + ${c1}^${p1} - ${s0}`;
    const layout = { vectors: [c0, c1], scalars: [s0], params: [p0, p1] };
    const a = new Float64Array([1.5, 2, 3]);
    const b = new Float64Array([2, 0.5, 4]);
    const compiled = compileFormula(parseFormula(text), layout);
    const fromMaps = compiled
      .bind({ n: 3, vectors: new Map([[c0, a], [c1, b]]), scalars: new Map([[s0, 0.25]]) })
      .evaluate([3, 2]);
    const fromRecords = compiled.bind({ n: 3, vectors: nullRecord([[c0, a], [c1, b]]), scalars: nullRecord([[s0, 0.25]]) }).evaluate([3, 2]);
    for (let i = 0; i < 3; i++) {
      // The same arithmetic written out in JavaScript.
      const expected = a[i]! * 3 + Math.pow(b[i]!, 2) - 0.25;
      expect(fromMaps[i]).toBe(expected);
      expect(fromRecords[i]).toBe(expected);
    }
  });

  it('bind does not pick up Object.prototype members for a missing column or constant', () => {
    const compiled = compileFormula(parseFormula('constructor + toString'), { vectors: ['constructor'], scalars: ['toString'], params: [] });
    expect(() => compiled.bind({ n: 1, vectors: {}, scalars: { toString: 1 } })).toThrow(RangeError);
    expect(() => compiled.bind({ n: 1, vectors: { constructor: new Float64Array(1) }, scalars: {} })).toThrow(RangeError);
  });

  it('every tricky name works in dimension inference, evaluation at a point and differentiation', () => {
    for (const name of TRICKY) {
      const f = parseFormula(`2*${name}^2`);
      const dims = new Map([[name, Dimension.of({ L: 1 })]]);
      expect(inferDimension(f, dims).dimension.toString()).toBe('L^2');
      expect(evaluateAt(f, new Map([[name, 3]]))).toBe(18);
      expect(differentiate(f, name).text).toBe(`4*${name}`);
    }
  });

  it('an unknown tricky name is formula-unknown-name, not a prototype member', () => {
    for (const name of TRICKY) {
      try {
        inferDimension(parseFormula(`${name} + 1`), new Map([['x', Dimension.NONE]]));
        expect.unreachable();
      } catch (e) {
        expect((e as InputError).kind).toBe('formula-unknown-name');
      }
    }
  });
});

describe('safety: code-like formulas are errors and never run', () => {
  const dims = new Map([['x', Dimension.NONE]]);
  const cases: readonly [string, string][] = [
    ['process.exit()', 'formula-syntax'],
    ['this', 'formula-unknown-name'],
    ['globalThis', 'formula-unknown-name'],
    ['process', 'formula-unknown-name'],
    ['`${x}`', 'formula-syntax'],
    ["require('fs')", 'formula-syntax'],
    ['constructor.constructor("return process")()', 'formula-syntax'],
    ['x[0]', 'formula-syntax'],
    ['x => x', 'formula-syntax'],
    ['new Function', 'formula-syntax'],
    ['eval(x)', 'formula-function'],
    ['Function(x)', 'formula-function'],
    ['exit()', 'formula-function'],
    ['__proto__(x)', 'formula-function'],
    ['x; process.exit(1)', 'formula-syntax'],
    ['x /* comment */', 'formula-syntax'],
    ['x // comment', 'formula-syntax'],
  ];
  for (const [text, kind] of cases) {
    it(`${text} -> ${kind}`, () => {
      let err: unknown;
      try {
        inferDimension(parseFormula(text), dims);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(InputError);
      expect((err as InputError).kind).toBe(kind);
    });
  }

  it('the generated source holds no user name and no user text', () => {
    const names = ['process', 'globalThis', 'require', 'constructor', '__proto__', 'Function', 'window', 'exit'];
    const text = names.map((n, k) => `${n}^${k + 2}`).join(' + ') + ' + 12345.678*ln(process)';
    const compiled = compileFormula(parseFormula(text), { vectors: names.slice(0, 4), scalars: names.slice(4, 6), params: names.slice(6) });
    for (const n of names) expect(compiled.source.includes(n), n).toBe(false);
    expect(compiled.source).toContain('12345.678'); // numbers are printed (after a finiteness check)
  });
});
