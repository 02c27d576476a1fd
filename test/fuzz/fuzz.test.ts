import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { EXIT, memoryIo } from '../../src/cli/io.js';
import { runCli } from '../../src/cli/run.js';
import { InputError, WarningList } from '../../src/common/errors.js';
import { loadStudy, parseRigText } from '../../src/data/index.js';
import { differentiate, inferDimension, parseFormula } from '../../src/expr/index.js';
import { planReduction, reduceTable } from '../../src/reduce/index.js';
import { Dimension, parseUnit, toSI } from '../../src/units/index.js';
import { SEED } from '../seed.js';

/**
 * Fuzzing every input a user writes: mutated rig files and study files (byte flips, deleted and
 * repeated lines, swapped cells, injected quotes, delimiters, BOM, NUL, huge numbers), random
 * formulas and random unit strings. The invariant: every input is either accepted or refused as
 * bad input (InputError; exit code 0 or 2 through the CLI, with a message), never an internal
 * fault (exit 3), never an unhandled rejection, never a hang (each case is timed).
 *
 * The bulk runs through the core parsers in memory; a smaller share runs through the whole CLI
 * in-process on files in a temporary folder. SIMILIS_FUZZ_RUNS=<n> multiplies every count
 * (`npm run fuzz` runs 20 times as many); the seed is test/seed.ts's.
 */

const SCALE = Number(process.env['SIMILIS_FUZZ_RUNS'] ?? 1);
const runs = (n: number) => Math.max(1, Math.round(n * SCALE));
/** Longest time one in-memory case may take; one CLI case gets CLI_CASE_MS. */
const CORE_CASE_MS = 2_000;
const CLI_CASE_MS = 15_000;

const GOOD_CSVS = [
  '# rig: loop A, water\n# D = 0.5 in\n# L = 1.2 m\n# u(dp) = 0.5 % + 0.01 kPa\nrun,Q [L/min],dp [kPa],T [degC]\nR1,0.3,0.009432,20.1\nR2,0.5,0.01548,20.3\nR3,0.8,0.02472,20.2\nR4,1.1,0.03455,20.4\n',
  '# D = 12.7 mm\n# L = 3.937 ft\nQ [gal/min];dp [inH2O];note\n0.3;0.25;"first, run"\n0.5;0.61;NA\n0.9;1.8;"a ""quoted"" word"\n',
  'Q [L/min]\tdp [psi]\tD [in]\tL [m]\n1\t0.1\t0.5\t1.2\n2\t0.3\t0.5\t1.2\n',
];
const GOOD_STUDIES = [
  'title: Loop A\nconstants:\n  rho: 998.21 kg/m^3\n  mu: 1.0016 mPa*s\nderived:\n  U: 4*Q/(pi*D^2)\ngroups:\n  Re: rho*U*D/mu\n  f: dp*D/(L*0.5*rho*U^2)\nfit:\n  response: f\n  model: C*Re^a\n  parameters: { C: 0.3, a: -0.25 }\n  where: Re > 10 and f < 10\ncompare: [blasius]\n',
  'title: "with T"\nderived:\n  rho: water_density(T)\n  mu: water_viscosity(T)\n  U: 4*Q/(pi*D^2)\ngroups:\n  Re: rho*U*D/mu\n  f: dp*D/(L*0.5*rho*U^2)\nuncertainty:\n  Q: 1 %\n  T: 0.1 K\nfit:\n  response: f\n  model: C*Re^a\n  parameters: { C: 0.3, a: -0.25 }\n  method: nonlinear\n  weights: uncertainty\n',
];

/** Text injected by the mutations: structure characters, encodings, extreme numbers, code. */
const INJECTIONS = ['"', "'", ',', ';', '\t', '\n', '\r\n', '\r', '#', '[', ']', ':', '- ', '  ', '\uFEFF', '\u0000', '\u202E', '\uFFFD', 'é', '1e308', '1e999', '-1e400', '4.9e-324', '0', '-0', 'NaN', 'Infinity', '1'.repeat(400), 'NA', '&a', '*a', '!!binary', '!!js/function', '{', '}', '|', '>', '%', 'u(', 'constructor', '__proto__', 'process.exit()', '`x`', '(((((', ')))'];

type Mutation = readonly [kind: number, at: number, other: number, injection: string];
const mutation: fc.Arbitrary<Mutation> = fc.tuple(fc.nat(7), fc.nat(), fc.nat(), fc.oneof(fc.constantFrom(...INJECTIONS), fc.string({ maxLength: 4, unit: 'binary' })));
const mutations = fc.array(mutation, { minLength: 1, maxLength: 6 });

/** Applies mutations to a text: byte flips, line deletion, duplication and swaps, cell swaps, injections. */
function mutate(text: string, ms: readonly Mutation[]): string {
  let t = text;
  for (const [kind, at, other, inj] of ms) {
    const lines = t.split('\n');
    const li = at % Math.max(1, lines.length);
    const pos = t.length === 0 ? 0 : at % t.length;
    switch (kind) {
      case 0: // flip one character's low bits
        t = t.slice(0, pos) + String.fromCharCode((t.charCodeAt(pos) ^ (1 + (other % 127))) & 0xffff) + t.slice(pos + 1);
        break;
      case 1: // delete a line
        lines.splice(li, 1);
        t = lines.join('\n');
        break;
      case 2: // repeat a line
        lines.splice(li, 0, lines[li] ?? '');
        t = lines.join('\n');
        break;
      case 3: {
        // swap two cells of a line
        const cells = (lines[li] ?? '').split(/([,;\t])/);
        const a = (other % Math.max(1, cells.length)) & ~1;
        const b = ((other >> 3) % Math.max(1, cells.length)) & ~1;
        [cells[a], cells[b]] = [cells[b] ?? '', cells[a] ?? ''];
        lines[li] = cells.join('');
        t = lines.join('\n');
        break;
      }
      case 4: // swap two lines
        [lines[li], lines[other % lines.length]] = [lines[other % lines.length] ?? '', lines[li] ?? ''];
        t = lines.join('\n');
        break;
      case 5: // cut the text short
        t = t.slice(0, pos);
        break;
      default: // inject
        t = t.slice(0, pos) + inj + t.slice(pos);
    }
  }
  return t;
}

/** Runs f and returns 'ok' or 'input-error'; anything else thrown fails the case, as does a slow case. */
function acceptedOrRefused(f: () => void): 'ok' | 'input-error' {
  const start = performance.now();
  let outcome: 'ok' | 'input-error' = 'ok';
  try {
    f();
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    expect(e.message.length).toBeGreaterThan(0);
    outcome = 'input-error';
  }
  const ms = performance.now() - start;
  if (ms > CORE_CASE_MS) throw new Error(`one case took ${ms.toFixed(0)} ms (bound ${CORE_CASE_MS} ms)`);
  return outcome;
}

const DIMS = new Map<string, Dimension>([
  ['x', Dimension.NONE],
  ['Re', Dimension.NONE],
  ['D', parseUnit('m').dimension],
  ['U', parseUnit('m/s').dimension],
  ['rho', parseUnit('kg/m^3').dimension],
  ['mu', parseUnit('Pa*s').dimension],
  ['constructor', Dimension.NONE],
]);

const FORMULA_TOKENS = ['x', 'Re', 'D', 'U', 'rho', 'mu', 'C', 'a', 'constructor', '__proto__', 'prototype', 'this', 'process', 'exit', 'require', 'globalThis', 'eval', '1', '2.5', '0', '1e308', '1e999', '.5', '1e-400', '+', '-', '*', '/', '^', '**', '(', ')', ',', '<', '>', '<=', '==', '!=', 'and', 'or', 'not', 'ln', 'sqrt', 'exp', 'min', 'max', 'pi', 'water_density', '`', "'", '"', '.', '[', ']', '{', '}', ';', '=>', '${', '=', '!', '&&', '\u0000', '\u202E', 'ρ', ' ', '#'];
const formulaText = fc.oneof(
  { weight: 4, arbitrary: fc.array(fc.constantFrom(...FORMULA_TOKENS), { maxLength: 30 }).chain((ts) => fc.array(fc.boolean(), { minLength: ts.length, maxLength: ts.length }).map((sp) => ts.map((t, i) => (sp[i] ? ` ${t}` : t)).join(''))) },
  { weight: 1, arbitrary: fc.string({ maxLength: 40 }) },
  { weight: 1, arbitrary: fc.nat(400).map((n) => '('.repeat(n) + 'x' + ')'.repeat(n)) },
);

const UNIT_TOKENS = ['m', 'kg', 's', 'K', 'Pa', 'kPa', 'psi', 'in', 'ft', 'L', 'gal', 'gal_UK', 'min', 'h', 'degC', 'degF', 'delta_degC', 'inH2O', 'N', 'lbf', 'W', 'BTU', 'mPa', 'µm', 'um', 'm2', 'm²', '^', '^-1', '^(1/2)', '^0', '^999', '/', '*', '.', '·', ' ', '(', ')', '%', '1', 'e', 'kpsi', 'foo', '\u0000', 'constructor', '__proto__'];
const unitText = fc.oneof(
  { weight: 4, arbitrary: fc.array(fc.constantFrom(...UNIT_TOKENS), { maxLength: 12 }).map((ts) => ts.join('')) },
  { weight: 1, arbitrary: fc.string({ maxLength: 20 }) },
);

const unhandled: unknown[] = [];
const onUnhandled = (e: unknown) => void unhandled.push(e);
process.on('unhandledRejection', onUnhandled);
afterAll(() => {
  process.off('unhandledRejection', onUnhandled);
});

describe('fuzz: core parsers in memory (accepted or InputError, each case time-bounded)', () => {
  it(`mutated rig files through the reader and a reduction (${runs(4000)} cases)`, () => {
    const study = loadStudy(GOOD_STUDIES[0]!, 'study.yaml');
    fc.assert(
      fc.property(fc.nat(GOOD_CSVS.length - 1), mutations, (k, ms) => {
        const text = mutate(GOOD_CSVS[k]!, ms);
        acceptedOrRefused(() => {
          const warnings = new WarningList();
          const table = parseRigText(text, { file: 'rig.csv', sink: warnings });
          const plan = planReduction(study, table.head, {}, warnings);
          reduceTable(table, plan, plan.functions, warnings);
        });
      }),
      { seed: SEED, numRuns: runs(4000) },
    );
  });

  it(`mutated study files (${runs(3000)} cases)`, () => {
    fc.assert(
      fc.property(fc.nat(GOOD_STUDIES.length - 1), mutations, (k, ms) => {
        acceptedOrRefused(() => void loadStudy(mutate(GOOD_STUDIES[k]!, ms), 'study.yaml', new WarningList()));
      }),
      { seed: SEED + 1, numRuns: runs(3000) },
    );
  });

  it(`random formulas: parse, dimensions, derivative (${runs(3000)} cases)`, () => {
    fc.assert(
      fc.property(formulaText, (text) => {
        acceptedOrRefused(() => {
          const f = parseFormula(text);
          inferDimension(f, (n) => DIMS.get(n));
          differentiate(f, 'x');
        });
      }),
      { seed: SEED + 2, numRuns: runs(3000) },
    );
  });

  it(`random unit strings: parse and convert (${runs(2000)} cases)`, () => {
    fc.assert(
      fc.property(unitText, fc.double({ noNaN: false }), (text, v) => {
        acceptedOrRefused(() => {
          const u = parseUnit(text, new WarningList());
          toSI(u).apply(v);
        });
      }),
      { seed: SEED + 3, numRuns: runs(2000) },
    );
  });
});

describe('fuzz: the whole CLI in-process (exit 0 or 2 with a message; never 3, never a hang)', () => {
  const root = mkdtempSync(join(tmpdir(), 'similis-fuzz-'));
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  async function cliCase(argv: readonly string[]): Promise<void> {
    const io = memoryIo(root);
    let timer: NodeJS.Timeout | undefined;
    const timeout = new Promise<'timeout'>((done) => (timer = setTimeout(() => done('timeout'), CLI_CASE_MS)));
    const code = await Promise.race([runCli(argv, io), timeout]);
    clearTimeout(timer);
    const err = io.err.join('');
    if (code === 'timeout') throw new Error(`similis ${argv.join(' ')} ran longer than ${CLI_CASE_MS} ms`);
    expect(code, err).not.toBe(EXIT.internal);
    expect([EXIT.ok, EXIT.badInput], err).toContain(code);
    if (code === EXIT.badInput) expect(err).toMatch(/similis: (usage )?error/);
    expect(unhandled, 'unhandled rejections').toEqual([]);
  }

  it(`similis reduce and fit on mutated rig and study files (${runs(240)} cases)`, async () => {
    await fc.assert(
      fc.asyncProperty(fc.nat(GOOD_CSVS.length - 1), fc.nat(GOOD_STUDIES.length - 1), mutations, fc.boolean(), fc.nat(9), async (k, s, ms, mutateStudy, which) => {
        writeFileSync(join(root, 'rig.csv'), mutateStudy ? GOOD_CSVS[k]! : mutate(GOOD_CSVS[k]!, ms));
        writeFileSync(join(root, 'study.yaml'), mutateStudy ? mutate(GOOD_STUDIES[s]!, ms) : GOOD_STUDIES[s]!);
        // One case in ten writes a fit report (HTML and all); the rest reduce.
        await cliCase(which === 0 ? ['fit', 'rig.csv', '--study', 'study.yaml', '--out', 'rep/r'] : ['reduce', 'rig.csv', '--study', 'study.yaml', '-o', 'out.csv', '--json']);
      }),
      { seed: SEED + 4, numRuns: runs(240) },
    );
  });

  it(`formulas and units through the command line (${runs(300)} cases)`, async () => {
    writeFileSync(join(root, 'rig2.csv'), GOOD_CSVS[0]!);
    await fc.assert(
      fc.asyncProperty(formulaText, unitText, fc.nat(3), async (formula, unit, which) => {
        const argv =
          which === 0
            ? ['reduce', 'rig2.csv', '--derive', `y=${formula}`, '-o', 'out2.csv']
            : which === 1
              ? ['reduce', 'rig2.csv', '--group', 'Re=Q/(D*1 m^2/s)', '--where', formula, '-o', 'out2.csv']
              : which === 2
                ? ['units', '1.5', unit, '--to', 'kPa']
                : ['handbook', 'eval', 'blasius', `Re=${formula}`];
        await cliCase(argv);
      }),
      { seed: SEED + 5, numRuns: runs(300) },
    );
  });
});
