import { createHash } from 'node:crypto';
import { cpSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { EXIT, memoryIo } from '../../src/cli/io.js';
import { runCli } from '../../src/cli/run.js';

/**
 * The bad-input corpus: one folder per case under test/bad-input/cases/, each with its input
 * files and a case.json (see DEVELOPERS.md, "How to add a bad-input case"). Every case runs
 * through the whole CLI in-process with --json and must
 * - exit with the stated code (2),
 * - report the stated error kind,
 * - name the stated location (file, line, column: each one stated is checked exactly),
 * - be actionable (ACTIONABLE below: the message quotes what was found and says what was expected),
 * - leave the folder as it was: no new file (no output, no temporary file) and no input changed.
 */

interface CaseSpec {
  readonly about: string;
  /** Which entry point the case exercises (csv, hash-line, unit, study, formula, predict, option, batch). */
  readonly entry: string;
  /** A folder of test/bad-input/base/ copied first; the case's own files are copied over it. */
  readonly base?: string;
  /** Command lines run first, each of which must succeed (e.g. a fit whose report predict reads). */
  readonly setup?: readonly (readonly string[])[];
  /** Symbolic links to make: link name -> target (git keeps none that dangle well across systems). */
  readonly symlinks?: Readonly<Record<string, string>>;
  /** Large files made at run time (so that the corpus stays small): name -> pieces. */
  readonly generated?: Readonly<Record<string, Pieces>>;
  /** The command line; a long argument is given as pieces. */
  readonly argv: readonly (string | { readonly pieces: Pieces })[];
  readonly exit: number;
  readonly kind: string;
  readonly where: { readonly file?: string; readonly line?: number; readonly column?: number };
  /** Text the message (or its hint) must quote: what was found. */
  readonly found?: string;
}

/** Text as [piece, times repeated] pairs: [['x=', 1], ['(', 200]] is x= followed by 200 '('. */
type Pieces = readonly (readonly [string, number])[];
const joinPieces = (pieces: Pieces): string => pieces.map(([text, times]) => text.repeat(times)).join('');

const HERE = dirname(fileURLToPath(import.meta.url));
const CASES = join(HERE, 'cases');
/** The file of a case folder that describes the case (not an input). */
const NOT_INPUT = /^case\.json$/;

/**
 * The one rule for an actionable message, applied to every case: besides quoting what was found
 * (CaseSpec.found), the message or its hint says what was expected, with one of these phrases.
 */
const ACTIONABLE = new RegExp(
  [
    'expected', 'expects', 'did you mean', 'one of', 'must', 'should', 'needs?', 'required', 'write', 'use', 'give', 'save',
    'choose', 'check', 'remove', 'name the', 'the names are', 'known', 'available', 'allowed', 'such as', 'e\\.g\\.', 'as in',
    'instead', 'the limit', 'the largest', 'at most', 'between', 'each', 'every', 'a name is', 'zero or positive', 'keys of',
  ]
    .map((p) => `\\b${p}\\b`)
    .join('|'),
  'i',
);

function walk(root: string, dir = root, out = new Map<string, string>()): Map<string, string> {
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    if (e.isDirectory()) walk(root, p, out);
    else out.set(relative(root, p), e.isFile() ? createHash('sha256').update(readFileSync(p)).digest('hex') : 'link');
  }
  return out;
}

async function cli(cwd: string, argv: readonly string[]) {
  const io = memoryIo(cwd);
  const code = await runCli(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

const names = readdirSync(CASES).filter((n) => statSync(join(CASES, n)).isDirectory()).sort();
const specs = names.map((name) => ({ name, spec: JSON.parse(readFileSync(join(CASES, name, 'case.json'), 'utf8')) as CaseSpec }));

describe('bad-input corpus (test/bad-input/cases)', () => {
  it(`holds at least 60 cases across every entry point (${specs.length})`, () => {
    expect(specs.length).toBeGreaterThanOrEqual(60);
    const entries = new Set(specs.map((s) => s.spec.entry));
    for (const e of ['csv', 'hash-line', 'unit', 'study', 'formula', 'predict', 'option', 'batch']) expect(entries, e).toContain(e);
  });

  for (const { name, spec } of specs) {
    it(`${name}: ${spec.about} -> exit ${spec.exit}, ${spec.kind}`, async () => {
      const root = mkdtempSync(join(tmpdir(), 'similis-bad-'));
      try {
        if (spec.base !== undefined) cpSync(join(HERE, 'base', spec.base), root, { recursive: true });
        cpSync(join(CASES, name), root, { recursive: true, filter: (src) => !NOT_INPUT.test(relative(join(CASES, name), src)) });
        for (const [file, pieces] of Object.entries(spec.generated ?? {})) {
          mkdirSync(dirname(join(root, file)), { recursive: true });
          writeFileSync(join(root, file), joinPieces(pieces));
        }
        for (const [link, target] of Object.entries(spec.symlinks ?? {})) {
          mkdirSync(dirname(join(root, link)), { recursive: true });
          symlinkSync(target, join(root, link));
        }
        for (const argv of spec.setup ?? []) {
          const s = await cli(root, argv);
          expect(s.code, `setup ${argv.join(' ')}: ${s.err}`).toBe(EXIT.ok);
        }
        const argv = spec.argv.map((a) => (typeof a === 'string' ? a : joinPieces(a.pieces)));
        const before = walk(root);
        const r = await cli(root, [...argv, '--json']);
        expect(r.code, r.err).toBe(spec.exit);
        const error = (JSON.parse(r.out) as { error: { kind: string; message: string; hint?: string; file?: string; line?: number; column?: number } }).error;
        expect(error.kind, error.message).toBe(spec.kind);
        if (spec.where.file !== undefined) expect(error.file, 'file').toBe(spec.where.file);
        if (spec.where.line !== undefined) expect(error.line, 'line').toBe(spec.where.line);
        if (spec.where.column !== undefined) expect(error.column, 'column').toBe(spec.where.column);
        const text = `${error.message} ${error.hint ?? ''}`;
        if (spec.found !== undefined) expect(text, 'quotes what was found').toContain(spec.found);
        expect(text, 'says what was expected').toMatch(ACTIONABLE);
        expect(r.err, 'stderr names the kind').toContain(`[${spec.kind}]`);
        expect([...walk(root).entries()], 'no file appeared, none changed').toEqual([...before.entries()]);
      } finally {
        rmSync(root, { recursive: true, force: true });
      }
    });
  }
});
