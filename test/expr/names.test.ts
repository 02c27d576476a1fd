import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import {
  BUILTIN_FUNCTIONS,
  checkUserName,
  evaluateConstant,
  FunctionTable,
  isConstantNode,
  isReservedName,
  isValidName,
  namesIn,
  parseFormula,
  RESERVED_NAMES,
} from '../../src/expr/index.js';
import { editDistance, nearestNames } from '../../src/expr/nearest.js';

describe('namesIn', () => {
  it('lists free names in order of first appearance, without functions or pi', () => {
    expect([...namesIn(parseFormula('rho*U*D/mu + 2*pi*sqrt(U) - rho'))]).toEqual(['rho', 'U', 'D', 'mu']);
    expect([...namesIn(parseFormula('Re > 4000 and LD >= 20'))]).toEqual(['Re', 'LD']);
    expect(namesIn(parseFormula('4/(pi*2^2)')).size).toBe(0);
  });
});

describe('isConstantNode', () => {
  it('is true without free names and false with one', () => {
    expect(isConstantNode(parseFormula('4/(pi*2^2) + ln(10)').root)).toBe(true);
    expect(isConstantNode(parseFormula('4/(pi*D^2)').root)).toBe(false);
  });
});

describe('evaluateConstant', () => {
  // Exact values by rational arithmetic on the decimal literals (common practice); doubles from
  // the ECMAScript Math constants (ECMA-262, 21.3.1).
  it('is exact for + - * / and integer powers of literals', () => {
    expect(evaluateConstant(parseFormula('-1/3').root)?.exact?.toString()).toBe('-1/3');
    expect(evaluateConstant(parseFormula('2^-2').root)?.exact?.toString()).toBe('1/4');
    expect(evaluateConstant(parseFormula('(1/3)*3').root)?.exact?.toString()).toBe('1');
    expect(evaluateConstant(parseFormula('0.1 + 0.2').root)?.exact?.toString()).toBe('3/10');
    expect(evaluateConstant(parseFormula('-0.5').root)?.exact?.toString()).toBe('-1/2');
    expect(evaluateConstant(parseFormula('2.5E+3/1e-3').root)?.exact?.toString()).toBe('2500000');
  });
  it('gives the double the compiled code computes, IEEE rounding included', () => {
    expect(evaluateConstant(parseFormula('0.1 + 0.2').root)?.value).toBe(0.30000000000000004);
  });
  it('gives only a double for pi, functions, non-integer powers and huge powers', () => {
    const pi = evaluateConstant(parseFormula('pi').root);
    expect(pi?.value).toBe(Math.PI);
    expect(pi?.exact).toBeUndefined();
    expect(evaluateConstant(parseFormula('ln(2)').root)?.value).toBe(Math.LN2);
    expect(evaluateConstant(parseFormula('ln(2)').root)?.exact).toBeUndefined();
    expect(evaluateConstant(parseFormula('4^0.5').root)?.exact).toBeUndefined();
    expect(evaluateConstant(parseFormula('10^100000').root)?.exact).toBeUndefined();
    expect(evaluateConstant(parseFormula('1/0').root)?.value).toBe(Infinity);
    expect(evaluateConstant(parseFormula('1/0').root)?.exact).toBeUndefined();
  });
  it('is undefined when a free name is present', () => {
    expect(evaluateConstant(parseFormula('2*x').root)).toBeUndefined();
  });
});

describe('isReservedName, RESERVED_NAMES, isValidName', () => {
  it('reserves keywords, pi, log and every built-in function name', () => {
    for (const n of ['and', 'or', 'not', 'pi', 'log', ...BUILTIN_FUNCTIONS.names()]) {
      expect(isReservedName(n), n).toBe(true);
      expect(RESERVED_NAMES.has(n), n).toBe(true);
    }
    for (const n of ['Re', 'rho', 'exp_1', 'Pi', 'PI', 'e', 'constructor']) expect(isReservedName(n), n).toBe(false);
  });
  it('reserves the names of an extended table', () => {
    const table = BUILTIN_FUNCTIONS.with([{ ...BUILTIN_FUNCTIONS.get('exp')!, name: 'water_density' }]);
    expect(isReservedName('water_density')).toBe(false);
    expect(isReservedName('water_density', table)).toBe(true);
  });
  it('tells names from other text', () => {
    for (const n of ['Re', 'ρ_w', '_x1', 'Δp', 'μ']) expect(isValidName(n), n).toBe(true);
    for (const n of ['', 'L/D', '2x', 'a b', 'a.b', 'x-1']) expect(isValidName(n), n).toBe(false);
  });
});

describe('checkUserName', () => {
  function kindOf(name: string, table?: FunctionTable): string | undefined {
    try {
      checkUserName(name, { file: 'rig.csv', line: 3, column: 7 }, table);
    } catch (e) {
      expect((e as InputError).where).toEqual({ file: 'rig.csv', line: 3, column: 7 });
      return (e as InputError).kind;
    }
    return undefined;
  }
  it('refuses reserved names with formula-reserved-name and non-names with formula-invalid-name', () => {
    expect(kindOf('exp')).toBe('formula-reserved-name');
    expect(kindOf('pi')).toBe('formula-reserved-name');
    expect(kindOf('and')).toBe('formula-reserved-name');
    expect(kindOf('L/D')).toBe('formula-invalid-name');
    expect(kindOf('Re')).toBeUndefined();
  });
  it('says what the name is in formulas', () => {
    try {
      checkUserName('pi');
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).message).toBe('pi cannot be used as a name: it is a constant in formulas; choose another name (e.g. pi_1)');
    }
  });
});

describe('FunctionTable', () => {
  it('refuses duplicate, invalid and reserved function names', () => {
    const exp = BUILTIN_FUNCTIONS.get('exp')!;
    expect(() => BUILTIN_FUNCTIONS.with([exp])).toThrow(RangeError);
    expect(() => new FunctionTable([{ ...exp, name: 'pi' }])).toThrow(RangeError);
    expect(() => new FunctionTable([{ ...exp, name: 'a.b' }])).toThrow(RangeError);
    expect(() => new FunctionTable([{ ...exp, name: 'f', minArgs: 2, maxArgs: 1 }])).toThrow(RangeError);
  });
});

describe('editDistance and nearestNames', () => {
  it('edit distances of textbook pairs (from memory: kitten/sitting = 3; OSA distance of ca/abc = 3)', () => {
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('ca', 'abc')).toBe(3);
    expect(editDistance('rho', 'rhO')).toBe(1);
    expect(editDistance('ab', 'ba')).toBe(1);
  });
  it('orders names nearest first, case-insensitively, with prefixes first among equals', () => {
    expect(nearestNames('RHO', ['mu', 'rho', 'Re'])).toEqual(['rho', 'Re', 'mu']);
    expect(nearestNames('mu_', ['rho', 'mu', 'D'])).toEqual(['mu', 'D', 'rho']);
  });
});
