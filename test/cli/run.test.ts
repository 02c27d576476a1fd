import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { EXIT, memoryIo } from '../../src/cli/io.js';
import { handleFailure, runCli } from '../../src/cli/run.js';

async function run(...argv: string[]) {
  const io = memoryIo();
  const code = await runCli(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

describe('runCli: units', () => {
  it('converts 12.5 psi to kPa (psi = 6894.757293168 Pa, NIST SP 811 B.9)', async () => {
    const r = await run('units', '12.5', 'psi', '--to', 'kPa');
    expect(r.code).toBe(EXIT.ok);
    // 12.5 x 6.894757293168361 = 86.18446616460451 kPa; printed to 12 significant digits.
    expect(r.out).toBe('12.5 psi = 86.1844661646 kPa\n');
    expect(r.err).toBe('');
  });

  it('68 degF is 20 degC exactly (NIST SP 811 B.9: t/degC = (t/degF - 32)/1.8)', async () => {
    const r = await run('units', '68', 'degF', '--to', 'degC', '--json');
    expect(r.code).toBe(EXIT.ok);
    expect(JSON.parse(r.out).result).toBe(20);
  });

  it('accepts a negative value without mistaking it for an option (-40 degF = -40 degC, SP 811 B.9)', async () => {
    const r = await run('units', '-40', 'degF', '--to', 'degC', '--json');
    expect(r.code).toBe(EXIT.ok);
    expect(JSON.parse(r.out).result).toBe(-40);
  });

  it('with --json, stdout is exactly one JSON document and warnings are inside it', async () => {
    // 1 gpm = 3.785411784e-3/60 m^3/s (US gallon, SP 811 B.9; check-values.md 5.2)
    const r = await run('units', '1', 'gpm', '--to', 'm^3/s', '--json');
    expect(r.code).toBe(EXIT.ok);
    const doc = JSON.parse(r.out) as { result: number; warnings: { code: string }[] };
    expect(doc.result).toBeCloseTo(6.30901964e-5, 17);
    expect(doc.warnings.map((w) => w.code)).toContain('unit-assumed-convention');
    expect(r.err).toContain('[unit-assumed-convention]');
  });

  it('describes a unit: lb/ft^3 is a density, 16.01846337 kg/m^3 (SP 811 B.9 prints 1.601 846 E+01)', async () => {
    const r = await run('units', 'lb/ft^3', '--json');
    const doc = JSON.parse(r.out) as { factor: number; quantity: string; dimension: string };
    expect(doc.factor).toBeCloseTo(16.01846, 4);
    expect(doc.dimension).toBe('M L^-3');
    expect(doc.quantity).toContain('density');
  });

  it('an unknown unit is exit 2 with its column, a caret and suggestions', async () => {
    const r = await run('units', '12', 'psu', '--to', 'kPa');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.out).toBe('');
    expect(r.err).toContain('command line, column 4');
    expect(r.err).toContain("unknown unit 'psu'");
    expect(r.err).toContain('       ^^^');
    expect(r.err).toMatch(/hint: did you mean psi/);
  });

  it('incompatible units name both dimensions in words (exit 2)', async () => {
    const r = await run('units', '1', 'kPa', '--to', 'L/min');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain('kPa is a pressure');
    expect(r.err).toContain('L/min is a volume flow');
  });

  it('--json errors go to stdout as JSON too, with kind and column', async () => {
    const r = await run('units', 'kg//m', '--json');
    expect(r.code).toBe(EXIT.badInput);
    const doc = JSON.parse(r.out) as { error: { kind: string; column: number } };
    expect(doc.error.kind).toBe('unit-syntax');
    expect(doc.error.column).toBe(4);
  });

  it('--strict turns warnings into exit code 1 after doing the work', async () => {
    const r = await run('units', 'm/s/s', '--strict');
    expect(r.code).toBe(EXIT.warningsAsErrors);
    expect(r.out).toContain('an acceleration');
    expect(r.err).toContain('[unit-slash-chain]');
  });

  it('--list shows every required unit family', async () => {
    const r = await run('units', '--list', '--json');
    const symbols = (JSON.parse(r.out) as { units: { symbol: string }[] }).units.map((u) => u.symbol);
    for (const s of ['m', 'in', 'ft', 'L', 'gal', 's', 'g', 'lb', 'slug', 'N', 'lbf', 'Pa', 'psi', 'inH2O', 'J', 'BTU', 'W', 'hp', 'K', 'degC', 'degF', 'degR', 'P', 'St', 'gpm', 'lpm', 'cfm', 'fps']) {
      expect(symbols, s).toContain(s);
    }
  });
});

describe('runCli: shell', () => {
  it('--help answers with examples and exit 0', async () => {
    const r = await run('--help');
    expect(r.code).toBe(EXIT.ok);
    expect(r.out).toContain('similis units 12.5 psi --to kPa');
    expect(r.out).toContain('Exit codes');
  });
  it('every command has its own help with examples', async () => {
    for (const cmd of ['units', 'demo']) {
      const r = await run(cmd, '--help');
      expect(r.code, cmd).toBe(EXIT.ok);
      expect(r.out, cmd).toContain('Example');
    }
  });
  it('an unknown option is a usage error, exit 2', async () => {
    const r = await run('units', '1', 'm', '--too', 'ft');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain("unknown option '--too'");
  });
  it('an unknown command suggests the nearest one, exit 2', async () => {
    const r = await run('unit', '1', 'm');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain('units');
  });
});

describe('handleFailure', () => {
  it('maps InputError to exit 2 and anything else to exit 3 with a hint to report it', () => {
    const io = memoryIo();
    expect(handleFailure(new InputError('x-test', 'what was found', { file: 'a.csv', line: 3, column: 7 }), io, false, undefined)).toBe(
      EXIT.badInput,
    );
    expect(io.err.join('')).toContain('a.csv, line 3, column 7: what was found [x-test]');
    const io2 = memoryIo();
    expect(handleFailure(new TypeError('boom'), io2, true, undefined)).toBe(EXIT.internal);
    expect(io2.err.join('')).toContain('internal fault: boom');
    expect(io2.err.join('')).toContain('Please report it');
    expect(JSON.parse(io2.out.join('')).error.kind).toBe('internal');
  });
});
