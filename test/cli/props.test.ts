import { describe, expect, it } from 'vitest';
import { InputError, WarningList } from '../../src/common/errors.js';
import type { CommandContext } from '../../src/cli/context.js';
import { runProps } from '../../src/cli/commands/props.js';
import { EXIT, memoryIo } from '../../src/cli/io.js';
import { handleFailure } from '../../src/cli/run.js';

function context(json = false): CommandContext & { io: ReturnType<typeof memoryIo> } {
  return { io: memoryIo(), json, warnings: new WarningList(), argv: [] };
}

interface PropsJson {
  fluid: string;
  temperatureK: number;
  pressurePa: number;
  pressureAssumed: boolean;
  properties: { quantity: string; function: string; value: number; unit: string; source: string }[];
  range: string;
}
const valueOf = (json: Record<string, unknown>, quantity: string) =>
  (json as unknown as PropsJson).properties.find((p) => p.quantity === quantity)!.value;

/** Runs the command as the runner would, returning the exit code and what was printed. */
function runAsCli(fluid: string, ...state: string[]) {
  const ctx = context();
  try {
    const o = runProps(ctx, fluid, state);
    ctx.io.stdout(o.text);
    return { code: EXIT.ok as number, out: ctx.io.out.join(''), err: ctx.io.err.join('') };
  } catch (e) {
    const code = handleFailure(e, ctx.io, false, ctx);
    return { code: code as number, out: ctx.io.out.join(''), err: ctx.io.err.join('') };
  }
}

describe('runProps: water', () => {
  it('water 20 degC: 998.21 kg/m^3 (Tanaka 2001) and 1.0016 mPa s (ISO/TR 3666), with sources', () => {
    const o = runProps(context(), 'water', ['20', 'degC']);
    expect(Math.abs(valueOf(o.json, 'density') - 998.21)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(valueOf(o.json, 'dynamic viscosity') * 1e3 - 1.0016)).toBeLessThanOrEqual(0.00005);
    expect(Math.abs(valueOf(o.json, 'kinematic viscosity') * 1e6 - 1.0034)).toBeLessThanOrEqual(0.00005);
    expect(o.json['pressureAssumed']).toBe(true);
    expect(o.text).toContain('p = 101.325 kPa (standard atmosphere: no pressure given)');
    expect(o.text).toContain('IAPWS-IF97 region 1');
    expect(o.text).toContain('IAPWS R12-08');
    expect(o.text).toContain('water_density(T[, p])');
    expect(o.text).toMatch(/density\s+998\.2061\s+kg m\^-3/);
  });

  it('68 degF is 20 degC (NIST SP 811 B.9): the same state', () => {
    const a = runProps(context(), 'water', ['68', 'degF']);
    const b = runProps(context(), 'water', ['20degC']);
    expect(valueOf(a.json, 'density')).toBe(valueOf(b.json, 'density'));
  });

  it('water 120 degC 3 bar is liquid; at 1 atm it is refused with exit code 2 and the range', () => {
    expect(runProps(context(), 'Water', ['120', 'degC', '3', 'bar']).json['pressurePa']).toBe(3e5);
    const r = runAsCli('water', '120', 'degC');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain('the water is not liquid');
    expect(r.err).toContain('[property-out-of-range]');
  });
});

describe('runProps: air', () => {
  it('air 20 degC 101.325 kPa: 1.2041 kg/m^3 (handbook value, from memory) and 1.81341e-5 Pa s (check-values.md 3.4)', () => {
    const o = runProps(context(true), 'air', ['20', 'degC', '101.325', 'kPa']);
    expect(Math.abs(valueOf(o.json, 'density') - 1.2041)).toBeLessThanOrEqual(5e-5);
    expect(Math.abs(valueOf(o.json, 'dynamic viscosity') - 1.81341e-5)).toBeLessThanOrEqual(5e-11);
    expect(o.json['pressureAssumed']).toBe(false);
    expect(o.text).toContain("Sutherland's law");
  });

  it('air 15 degC without a pressure: the standard atmosphere, 1.2250 kg/m^3 (U.S. Standard Atmosphere 1976)', () => {
    const o = runProps(context(), 'air', ['15', 'degC']);
    expect(Math.abs(valueOf(o.json, 'density') - 1.225)).toBeLessThanOrEqual(5e-5);
  });

  it('accepts a negative temperature: -40 degF = -40 degC (SP 811 B.9) = 233.15 K', () => {
    expect(runProps(context(), 'air', ['-40', 'degF']).json['temperatureK']).toBeCloseTo(233.15, 10);
  });
});

describe('runProps: bad input (exit code 2)', () => {
  it.each([
    [['oil', '20', 'degC'], /unknown fluid "oil": the known fluids are water, air/],
    [['water', '20'], /the temperature 20 has no unit/],
    [['water', '20', 'kPa'], /kPa is a pressure or stress .* but a temperature is expected/],
    [['water', '20', 'delta_degC'], /a temperature difference; a fluid state needs an absolute temperature/],
    [['water', '20', 'degC', '1', 'm'], /m is a length .* but a pressure is expected/],
    [['water', 'hot'], /expected a number first, found "hot"/],
    [['water', '20', 'degC', '1', 'bar', '3', 'K'], /give a temperature with its unit/],
    [['water', '20', 'degQ'], /unknown unit/],
  ] as const)('%j', (argv, message) => {
    const [fluid, ...state] = argv;
    const r = runAsCli(fluid!, ...state);
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toMatch(message);
    expect(r.out).toBe('');
  });

  it('errors are InputError with a column under the offending unit', () => {
    try {
      runProps(context(), 'water', ['20', 'kPa']);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).where.column).toBe(4);
    }
  });
});
