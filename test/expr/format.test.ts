import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatFormula, parseFormula, sameTree } from '../../src/expr/index.js';
import { anyRootTree, parenText } from './arbitraries.js';
import { SEED } from '../seed.js';

describe('formatFormula', () => {
  // Expected texts: the fewest parentheses that keep the grouping under the precedence rules of
  // the formula language (see parser.test.ts for the rules and their source).
  const cases: readonly [string, string][] = [
    ['((rho*U)*D)/(mu)', 'rho*U*D/mu'],
    ['dp*D/(L*0.5*rho*U^2)', 'dp*D/(L*0.5*rho*U^2)'],
    ['-(x^2) + (a - (b - c))', '-x^2 + (a - (b - c))'],
    ['(x + a) - (b - c)', 'x + a - (b - c)'],
    ['(a - b) - c', 'a - b - c'],
    ['a / (b / c)', 'a/(b/c)'],
    ['a / (b * c)', 'a/(b*c)'],
    ['(-2)^2', '(-2)^2'],
    ['(a^b)^c', '(a^b)^c'],
    ['a^(b^c)', 'a^b^c'],
    ['2^(-1)', '2^-1'],
    ['(a*b)^2', '(a*b)^2'],
    ['-(a*b)', '-(a*b)'],
    ['(-a)*b', '-a*b'],
    ['a*(-b)', 'a*-b'],
    ['a - (-b)', 'a - -b'],
    ['-(-(x))', '--x'],
    ['(a < b) and ((c > d) or e == f)', 'a < b and (c > d or e == f)'],
    ['not (a < b and c < d)', 'not (a < b and c < d)'],
    ['(not a < b) and c < d', 'not a < b and c < d'],
    ['max((a), (b + c))', 'max(a, b + c)'],
    ['4*Q/(pi*D^2)', '4*Q/(pi*D^2)'],
    ['1e-3 * x', '1e-3*x'],
  ];
  for (const [input, printed] of cases) {
    it(`prints ${input} as ${printed}`, () => {
      expect(formatFormula(parseFormula(input).root)).toBe(printed);
    });
  }

  it('round trip: parse(format(tree)) is the same tree, for random trees (property test, seeded)', () => {
    fc.assert(
      fc.property(anyRootTree(), (tree) => {
        const text = formatFormula(tree);
        const back = parseFormula(text, { limits: { maxLength: 1_000_000 } }).root;
        if (!sameTree(back, tree)) {
          throw new Error(`${text}\n  was read as ${parenText(back)}\n  expected   ${parenText(tree)}`);
        }
        expect(formatFormula(back)).toBe(text);
      }),
      { seed: SEED, numRuns: 2000 },
    );
  });

  it('round trip: parse(format(parse(s))) equals parse(s) for the texts of random trees with extra parentheses', () => {
    fc.assert(
      fc.property(anyRootTree(), (tree) => {
        const first = parseFormula(parenText(tree), { limits: { maxLength: 1_000_000, maxNesting: 400 } }).root;
        const second = parseFormula(formatFormula(first), { limits: { maxLength: 1_000_000 } }).root;
        expect(sameTree(first, second)).toBe(true);
      }),
      { seed: SEED, numRuns: 1000 },
    );
  });
});
