import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { Dimension } from '../../src/units/dimension.js';
import { numNode } from '../../src/expr/ast.js';
import { BUILTIN_FUNCTIONS, checkKinds, fixedDimensionRule, inferDimension, parseFormula } from '../../src/expr/index.js';

// Dimensions of the pipe-flow quantities as exponents of (M, L, T): SI Brochure, 9th ed. (2019),
// Table 4 (derived units in terms of base units), as listed in ../shared/reference/check-values.md
// section 5.1: pressure (1, -1, -2), dynamic viscosity (1, -1, -1), density (1, -3, 0),
// volumetric flow (0, 3, -1); length and velocity from the base units.
const PRESSURE = Dimension.of({ M: 1, L: -1, T: -2 });
const DENSITY = Dimension.of({ M: 1, L: -3 });
const VELOCITY = Dimension.of({ L: 1, T: -1 });
const LENGTH = Dimension.of({ L: 1 });
const VISCOSITY = Dimension.of({ M: 1, L: -1, T: -1 });
const VOLUME_FLOW = Dimension.of({ L: 3, T: -1 });
const TEMPERATURE = Dimension.of({ Θ: 1 });

const PIPE = new Map<string, Dimension>([
  ['dp', PRESSURE],
  ['rho', DENSITY],
  ['U', VELOCITY],
  ['D', LENGTH],
  ['L', LENGTH],
  ['mu', VISCOSITY],
  ['Q', VOLUME_FLOW],
  ['T', TEMPERATURE],
  ['Re', Dimension.NONE],
  ['LD', Dimension.NONE],
  ['a', Dimension.NONE],
]);

const dimOf = (text: string) => inferDimension(parseFormula(text), PIPE);

function refusal(text: string, dims: ReadonlyMap<string, Dimension> = PIPE): InputError {
  try {
    inferDimension(parseFormula(text), dims);
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error(`expected ${text} to be refused`);
}

describe('inferDimension: the pipe-flow groups are dimensionless', () => {
  for (const [label, text] of [
    ['Reynolds number', 'rho*U*D/mu'],
    ['Darcy friction factor (check-values.md preamble: f_D = dp*D/(L*rho*U^2/2))', 'dp*D/(L*0.5*rho*U^2)'],
    ['length ratio', 'L/D'],
    ['Reynolds number from a volume flow, 4*rho*Q/(pi*mu*D) (check-values.md 5.1: differs by 4/pi)', '4*rho*Q/(pi*mu*D)'],
    ['Euler-type group with a fitted exponent on a group', 'dp/(rho*U^2)*Re^a'],
  ] as const) {
    it(`${label}: ${text}`, () => {
      const r = dimOf(text);
      expect(r.kind).toBe('number');
      expect(r.dimension.isDimensionless()).toBe(true);
    });
  }

  it('sqrt(dp/rho) is a velocity (L T^-1)', () => {
    expect(dimOf('sqrt(dp/rho)').dimension.equals(VELOCITY)).toBe(true);
  });
  it('4*Q/(pi*D^2) is a velocity (mean velocity from a volume flow)', () => {
    expect(dimOf('4*Q/(pi*D^2)').dimension.equals(VELOCITY)).toBe(true);
  });
  it('rational exponents are exact: D^(1/3) is L^(1/3), D^-0.5 is L^(-1/2), D^2.0 is L^2', () => {
    expect(dimOf('D^(1/3)').dimension.toString()).toBe('L^(1/3)');
    expect(dimOf('D^-0.5').dimension.toString()).toBe('L^(-1/2)');
    expect(dimOf('D^2.0').dimension.toString()).toBe('L^2');
    expect(dimOf('(D^3)^(2/3)').dimension.toString()).toBe('L^2');
  });
  it('min and max keep the common dimension; abs keeps; a where filter is true/false', () => {
    expect(dimOf('max(D, L)').dimension.equals(LENGTH)).toBe(true);
    expect(dimOf('abs(dp)').dimension.equals(PRESSURE)).toBe(true);
    expect(dimOf('Re > 4000 and L/D >= 20').kind).toBe('boolean');
  });
  it('a literal 0 fits any dimension: dp > 0, dp - 0', () => {
    expect(dimOf('dp > 0').kind).toBe('boolean');
    expect(dimOf('dp - 0').dimension.equals(PRESSURE)).toBe(true);
  });
});

describe('inferDimension: errors say which side has which dimension, in words', () => {
  it('cannot add dp and rho*U (the wording of the brief, exactly)', () => {
    const e = refusal('dp + rho*U');
    expect(e.kind).toBe('formula-dimension');
    expect(e.message).toBe('cannot add dp (a pressure or stress, M L^-1 T^-2) and rho*U (a mass flux, M L^-2 T^-1)');
    expect(e.where.column).toBe(1);
  });
  it('dp + rho names both sides', () => {
    const e = refusal('dp + rho');
    expect(e.kind).toBe('formula-dimension');
    for (const w of ['dp', 'pressure', 'M L^-1 T^-2', 'rho', 'density', 'M L^-3']) expect(e.message).toContain(w);
  });
  it('exp(D): exp needs a dimensionless argument, found D (a length, L)', () => {
    const e = refusal('2*exp(D)');
    expect(e.kind).toBe('formula-dimension');
    expect(e.message).toBe('exp needs a dimensionless argument, found D (a length, L)');
    expect(e.where.column).toBe(7);
  });
  it('D^a: the exponent of a length must be a constant number', () => {
    const e = refusal('D^a');
    expect(e.kind).toBe('formula-dimension');
    expect(e.message).toContain('the exponent of D (a length, L) must be a constant number, found a');
    expect(e.where.column).toBe(3);
  });
  it('D^ln(2): the exponent must be rational', () => {
    const e = refusal('D^ln(2)');
    expect(e.kind).toBe('formula-dimension');
    expect(e.message).toContain('the exponent of D (a length, L) must be a constant rational number');
    expect(e.message).toContain('found ln(2)');
  });
  it('Re^D: an exponent must be dimensionless', () => {
    const e = refusal('Re^D');
    expect(e.message).toBe('the exponent D (a length, L) must be dimensionless');
  });
  it('comparing a length with a number', () => {
    const e = refusal('D > 0.01');
    expect(e.message).toBe('cannot compare D (a length, L) with 0.01 (dimensionless)');
  });
  it('subtracting', () => {
    expect(refusal('dp - rho*U^2/2 - mu').message).toBe(
      'cannot subtract mu (a dynamic viscosity, M L^-1 T^-1) from dp - rho*U^2/2 (a pressure or stress, M L^-1 T^-2)',
    );
  });
  it('max of a length and a velocity', () => {
    const e = refusal('max(D, U)');
    expect(e.message).toBe('the arguments of max must have the same dimension, found D (a length, L) and U (a velocity, L T^-1)');
  });
  it('a dimension with no common name is written as exponents', () => {
    expect(refusal('D^5/T + 1').message).toContain('D^5/T (of dimension L^5 Θ^-1)');
  });
  it('an unknown name lists the available names, nearest first', () => {
    const e = refusal('rho*V*D/mu');
    expect(e.kind).toBe('formula-unknown-name');
    expect(e.where.column).toBe(5);
    expect(e.message).toMatch(/^unknown name V: the available names are \(nearest first\) /);
    expect(e.message).toContain('U');
    const mu = refusal('rho*U*D/mu_w');
    expect(mu.message).toMatch(/\(nearest first\) mu, /);
  });
  it('an unknown name with a lookup function and no list', () => {
    const e = (() => {
      try {
        inferDimension(parseFormula('x + y'), (n) => (n === 'x' ? LENGTH : undefined));
      } catch (err) {
        return err as InputError;
      }
      return undefined;
    })();
    expect(e?.kind).toBe('formula-unknown-name');
    expect(e?.where.column).toBe(5);
  });
});

describe('checkKinds: numbers against true/false values', () => {
  for (const [text, column, words] of [
    ['(Re > 5)*2', 1, '(Re > 5) is a comparison (true or false), but the left side of * needs a number'],
    ['Re and LD', 1, 'Re is a number, but the left side of and needs a comparison'],
    ['not Re', 5, 'Re is a number, but not needs a comparison'],
    ['sqrt(Re > 1)', 6, 'the argument of sqrt needs a number'],
    ['Re > 1 or 2', 11, 'the right side of or needs a comparison'],
    ['-(Re < 1)', 2, 'a minus sign needs a number'],
  ] as const) {
    it(`refuses ${text}`, () => {
      let err: InputError | undefined;
      try {
        checkKinds(parseFormula(text));
      } catch (e) {
        err = e as InputError;
      }
      expect(err?.kind).toBe('formula-type');
      expect(err?.where.column).toBe(column);
      expect(err?.message).toContain(words);
    });
  }
  it('where-filters are true/false, groups are numbers', () => {
    expect(checkKinds(parseFormula('Re > 4000 and LD >= 20'))).toBe('boolean');
    expect(checkKinds(parseFormula('not (Re < 10) or LD == 2'))).toBe('boolean');
    expect(checkKinds(parseFormula('rho*U*D/mu'))).toBe('number');
  });
});

describe('inferDimension with an extended FunctionTable', () => {
  // A stand-in for the fluid-property functions of a later stage: its argument must be a
  // temperature and its result is a density. The numbers are not physical (test double).
  const table = BUILTIN_FUNCTIONS.with([
    {
      name: 'water_density',
      minArgs: 1,
      maxArgs: 1,
      summary: 'test double',
      dimension: fixedDimensionRule([TEMPERATURE], ['a temperature, Θ'], DENSITY),
      evaluate: (t: number) => 1000 - 0.1 * (t - 277),
      partial: () => numNode(0.1),
    },
  ]);
  it('water_density(T)/rho is dimensionless', () => {
    expect(inferDimension(parseFormula('water_density(T)/rho', { functions: table }), PIPE, table).dimension.isDimensionless()).toBe(true);
  });
  it('water_density(D) is refused with the expected dimension in words', () => {
    try {
      inferDimension(parseFormula('water_density(D)', { functions: table }), PIPE, table);
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).kind).toBe('formula-dimension');
      expect((e as InputError).message).toBe('water_density needs an argument that is a temperature, Θ, found D (a length, L)');
    }
  });
});
