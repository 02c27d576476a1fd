import { describe, expect, it } from 'vitest';
import { InputError, WarningList } from '../../src/common/errors.js';
import { runHandbook } from '../../src/cli/commands/handbook.js';
import type { CommandContext } from '../../src/cli/context.js';
import { memoryIo } from '../../src/cli/io.js';
import { renderInputError } from '../../src/cli/render.js';

/**
 * `similis handbook`, tested in-process by calling the command's run function with a context built
 * as src/cli/run.ts builds it (the command is declared in program.ts by the lead).
 */

function context(json = false): CommandContext {
  return { io: memoryIo(), json, warnings: new WarningList(), argv: [] };
}

function failure(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}

describe('runHandbook: list', () => {
  it('lists the three families with id, range, source and form; Fanning twins in one line of text', () => {
    const out = runHandbook(context(), undefined, [], {});
    expect(out.text).toMatch(/^Pipe friction\n/);
    expect(out.text).toContain('Sphere drag\n');
    expect(out.text).toContain('Heat transfer in tubes\n');
    expect(out.text).toMatch(/colebrook\s+4000 <= Re <= 1e8, 0 <= roughness <= 0\.05\s+Colebrook \(1939\)\s+1\/sqrt\(f_D\) = -2\*log10/);
    expect(out.text).toContain("Fanning twin '<id>-fanning'");
    expect(out.text).not.toMatch(/^colebrook-fanning/m);
  });

  it('--json lists every entry, Fanning twins included, with its range as data', () => {
    const out = runHandbook(context(true), 'list', [], {});
    const list = out.json['correlations'] as { id: string; range: { input: string; min: number | null; max: number | null }[] }[];
    expect(list.map((c) => c.id)).toContain('colebrook-fanning');
    expect(list.find((c) => c.id === 'schiller-naumann')?.range).toEqual([
      { input: 'Re', min: null, max: 800, source: 'Clift, Grace & Weber (1978), Bubbles, Drops and Particles, Academic Press, ch. 5: Re < 800' },
    ]);
  });

  it('--family heat lists only the heat-transfer forms; an unknown family is a usage error', () => {
    const out = runHandbook(context(), 'list', [], { family: 'heat' });
    expect(out.text).toMatch(/^Heat transfer in tubes\n/);
    expect(out.text).not.toContain('colebrook');
    expect(failure(() => runHandbook(context(), 'list', [], { family: 'mass' })).kind).toBe('usage');
  });
});

describe('runHandbook: show', () => {
  it('prints one entry in full: equation, inputs, range with its source, method, source', () => {
    const out = runHandbook(context(), 'show', ['swamee-jain'], {});
    expect(out.text).toMatch(/^swamee-jain: Swamee-Jain explicit approximation to Colebrook\n/);
    expect(out.text).toContain('f_D = 0.25/(log10(roughness/3.7 + 5.74/Re^0.9))^2');
    expect(out.text).toContain('5000 <= Re <= 1e8');
    expect(out.text).toContain('Swamee & Jain (1976), J. Hydraul. Div. ASCE 102(5):657-664');
    expect(out.text).toContain('2.83 %');
    expect(out.json['id']).toBe('swamee-jain');
  });

  it('an unknown id is correlation-unknown at its column, with a caret and the nearest ids', () => {
    const e = failure(() => runHandbook(context(), 'show', ['haalnd'], {}));
    expect(e.kind).toBe('correlation-unknown');
    expect(e.where.column).toBe(15);
    expect(e.hint).toMatch(/^did you mean haaland/);
    expect(renderInputError(e)).toContain('    handbook show haalnd\n                  ^^^^^^');
  });
});

describe('runHandbook: eval', () => {
  it('colebrook Re=1e5 roughness=1e-4 gives f_D = 0.0185138660775 (check-values.md 1.2; [S] fluids docstring 0.018513866077471)', () => {
    const ctx = context();
    const out = runHandbook(ctx, 'eval', ['colebrook', 'Re=1e5', 'roughness=1e-4'], {});
    expect(out.text).toBe(
      'colebrook at Re = 1e5, roughness = 1e-4:\nf_D = 0.0185138660775   (Darcy friction factor f_D = dp*D/(L*rho*U^2/2))\n',
    );
    expect(Math.abs((out.json['value'] as number) / 0.018513866077471 - 1)).toBeLessThan(1e-12);
    expect(ctx.warnings.items).toEqual([]);
  });

  it('warns outside-range, at the column of the input, when Re is outside the stated range (Blasius at 5e5 > 1e5)', () => {
    const ctx = context();
    const out = runHandbook(ctx, 'eval', ['blasius', 'Re=5e5'], {});
    // Blasius (1913): 0.3164 x (5e5)^-0.25 = 0.011898548... (arithmetic)
    expect(out.json['value']).toBeCloseTo(0.3164 * 5e5 ** -0.25, 15);
    expect(ctx.warnings.items.map((w) => w.code)).toEqual(['outside-range']);
    expect(ctx.warnings.items[0]!.message).toMatch(/^Re = 5e5 is outside the range of 'blasius' \(3000 <= Re <= 1e5;/);
    expect(ctx.warnings.items[0]!.where?.column).toBe(23);
    expect((out.json['outsideRange'] as { max: number }[])[0]!.max).toBe(1e5);
  });

  it('accepts a constant expression as a value: roughness=0.045/100 (commercial steel 0.045 mm in a 100 mm pipe) = 4.5e-4', () => {
    const out = runHandbook(context(), 'eval', ['haaland', 'Re=2e5', 'roughness=0.045/100'], {});
    expect((out.json['inputs'] as Record<string, number>)['roughness']).toBeCloseTo(4.5e-4, 18);
  });

  it('an optional input may be left out: gnielinski uses the Filonenko factor and says so', () => {
    const out = runHandbook(context(), 'eval', ['gnielinski', 'Re=1e5', 'Pr=1.2'], {});
    expect(out.text).toMatch(/default f_D = the smooth-tube factor of Filonenko/);
  });

  it('bad input is exit-2 material (InputError): unknown input with suggestion, missing input, not a number, no "="', () => {
    const unknown = failure(() => runHandbook(context(), 'eval', ['colebrook', 'Re=1e5', 'rougness=1e-4'], {}));
    expect(unknown.kind).toBe('correlation-unknown-input');
    expect(unknown.hint).toMatch(/roughness/);
    expect(unknown.where.column).toBe(32);
    expect(failure(() => runHandbook(context(), 'eval', ['colebrook', 'Re=1e5'], {})).kind).toBe('correlation-missing-input');
    expect(failure(() => runHandbook(context(), 'eval', ['colebrook', 'Re=abc', 'roughness=0'], {})).message).toMatch(/Re must be a number/);
    expect(failure(() => runHandbook(context(), 'eval', ['colebrook', 'Re'], {})).kind).toBe('usage');
    expect(failure(() => runHandbook(context(), 'eval', ['colebrook', 'Re=1', 'Re=2'], {})).message).toMatch(/given twice/);
    expect(failure(() => runHandbook(context(), 'eval', [], {})).kind).toBe('usage');
  });
});

describe('runHandbook: settle', () => {
  it('1 mm glass bead in water with Clift-Gauvin: 0.1457 m/s at Re 145.2 (check-values.md 2.4 [C]), units converted (mPa*s, kg/m^3)', () => {
    const out = runHandbook(
      context(),
      'settle',
      ['clift-gauvin', 'diameter=1mm', 'particleDensity=2500kg/m^3', 'fluidDensity=998.2kg/m^3', 'viscosity=1.0016mPa*s'],
      {},
    );
    expect(Math.abs((out.json['velocityMPerS'] as number) / 0.1457 - 1)).toBeLessThan(3.5e-4);
    expect(out.json['reynolds'] as number).toBeCloseTo(145.2, 1);
    expect(out.text).toContain('terminal velocity  0.145737 m/s');
  });

  it('a quantity of the wrong dimension names both, and a missing one is asked for with an example', () => {
    const e = failure(() => runHandbook(context(), 'settle', ['stokes', 'diameter=1kg', 'particleDensity=2500kg/m^3', 'fluidDensity=1000kg/m^3', 'viscosity=1mPa*s'], {}));
    expect(e.message).toBe('diameter must be a length (L); kg is a mass (M)');
    expect(failure(() => runHandbook(context(), 'settle', ['stokes', 'diameter=1mm'], {})).message).toMatch(/settle needs particleDensity=2500kg\/m\^3/);
  });
});

describe('runHandbook: actions', () => {
  it('an unknown action is a usage error with a hint', () => {
    const e = failure(() => runHandbook(context(), 'evaluate', ['colebrook'], {}));
    expect(e.kind).toBe('usage');
    expect(e.message).toMatch(/not a handbook action/);
  });
});
