/**
 * Test helper: reads the NIST Statistical Reference Datasets (StRD) `.dat` files in
 * ../shared/reference/nist-strd/ (NIST ITL, https://www.itl.nist.gov/div898/strd/; layout described
 * in that folder's README.md) and measures accuracy as NIST does, by the log relative error.
 *
 * Nonlinear model lines are translated to the similis formula syntax, and nothing else is changed:
 * `exp[...]`, `log[...]`, `arctan[...]` brackets -> parentheses, `**` -> `^`, `arctan` -> `atan`.
 * (`log[y]` in Nelson.dat is the natural logarithm: the certified values fit ln y.)
 */
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const STRD_DIR = fileURLToPath(new URL('../../../shared/reference/nist-strd/', import.meta.url));
export const STRD_PRESENT = existsSync(STRD_DIR + 'linear') && existsSync(STRD_DIR + 'nonlinear');

export interface NonlinearProblem {
  readonly name: string;
  /** The model as written in the file, right-hand side, without `+ e`. */
  readonly modelAsWritten: string;
  /** The same in similis syntax. */
  readonly model: string;
  /** 'y' or 'ln(y)' (Nelson). */
  readonly response: 'y' | 'ln(y)';
  readonly params: readonly string[];
  readonly starts: readonly [readonly number[], readonly number[]];
  readonly certified: readonly number[];
  readonly certifiedSd: readonly number[];
  readonly certifiedRss: number;
  readonly columns: ReadonlyMap<string, Float64Array>;
  readonly n: number;
}

export interface LinearProblem {
  readonly name: string;
  readonly certified: readonly number[];
  readonly certifiedSd: readonly number[];
  readonly residualSd: number;
  readonly rSquared: number;
  /** Data columns by header name (y, x or x1..x6). */
  readonly columns: ReadonlyMap<string, Float64Array>;
  readonly n: number;
}

const lines = (file: string) => readFileSync(file, 'utf8').split(/\r?\n/);
const numbers = (line: string) => line.trim().split(/\s+/).map(Number);

/** "(lines 61 to 188)" after `label`. */
function lineRange(text: readonly string[], label: string): [number, number] {
  const re = new RegExp(`${label}\\s*\\(lines\\s+(\\d+)\\s+to\\s+(\\d+)\\)`);
  for (const l of text) {
    const m = re.exec(l);
    if (m) return [Number(m[1]), Number(m[2])];
  }
  throw new Error(`no "${label} (lines a to b)" in file`);
}

function dataColumns(text: readonly string[]): { columns: Map<string, Float64Array>; n: number } {
  const [from, to] = lineRange(text, 'Data');
  const header = text[from - 2]!.replace(/^\s*Data:\s*/, '').trim().split(/\s+/);
  const n = to - from + 1;
  const columns = new Map(header.map((h) => [h, new Float64Array(n)] as const));
  for (let i = 0; i < n; i++) {
    const v = numbers(text[from - 1 + i]!);
    if (v.length !== header.length || v.some((x) => !Number.isFinite(x))) throw new Error(`bad data row ${from + i}`);
    header.forEach((h, k) => (columns.get(h)![i] = v[k]!));
  }
  return { columns, n };
}

/** Translates a StRD model line to similis formula syntax (see the module comment). */
export function translateModel(asWritten: string): string {
  return asWritten.replace(/\[/g, '(').replace(/\]/g, ')').replace(/\*\*/g, '^').replace(/\barctan\b/g, 'atan');
}

export function readNonlinear(name: string): NonlinearProblem {
  const text = lines(`${STRD_DIR}nonlinear/${name}.dat`);
  const [pFrom, pTo] = lineRange(text, 'Starting Values');
  const params: string[] = [];
  const s1: number[] = [];
  const s2: number[] = [];
  const cert: number[] = [];
  const sd: number[] = [];
  for (let l = pFrom; l <= pTo; l++) {
    const m = /^\s*(b\d+)\s*=\s*(.*)$/.exec(text[l - 1]!);
    if (!m) throw new Error(`${name}: no parameter on line ${l}`);
    const v = numbers(m[2]!);
    params.push(m[1]!);
    s1.push(v[0]!);
    s2.push(v[1]!);
    cert.push(v[2]!);
    sd.push(v[3]!);
  }
  const rssLine = text.find((l) => l.startsWith('Residual Sum of Squares:'))!;
  // The model: from the line with '=' after 'Model:' (skipping 'pi = ...'), up to '+ e'.
  const start = text.findIndex((l, i) => i > text.findIndex((x) => x.startsWith('Model:')) && /=/.test(l) && !/^\s*pi\s*=/.test(l));
  let model = '';
  for (let i = start; i < text.length; i++) {
    model += ' ' + text[i]!.trim();
    if (/\+\s*e\s*$/.test(text[i]!.trimEnd())) break;
  }
  const [lhs, rhs] = model.split(/=(.*)/s).map((s) => s.trim());
  const modelAsWritten = rhs!.replace(/\+\s*e\s*$/, '').trim();
  const { columns, n } = dataColumns(text);
  return {
    name,
    modelAsWritten,
    model: translateModel(modelAsWritten),
    response: lhs === 'log[y]' ? 'ln(y)' : 'y',
    params,
    starts: [s1, s2],
    certified: cert,
    certifiedSd: sd,
    certifiedRss: Number(rssLine.split(':')[1]),
    columns,
    n,
  };
}

export function readLinear(name: string): LinearProblem {
  const text = lines(`${STRD_DIR}linear/${name}.dat`);
  const certified: number[] = [];
  const certifiedSd: number[] = [];
  for (const l of text) {
    const m = /^\s*B\d+\s+(\S+)\s+(\S+)\s*$/.exec(l);
    if (m) {
      certified.push(Number(m[1]));
      certifiedSd.push(Number(m[2]));
    }
  }
  const value = (label: string) => {
    const m = text.map((l) => new RegExp(`^\\s*${label}\\s+(\\S+)\\s*$`).exec(l)).find((x) => x !== null);
    if (!m) throw new Error(`${name}: no "${label}" value`);
    return Number(m[1]);
  };
  const { columns, n } = dataColumns(text);
  return { name, certified, certifiedSd, residualSd: value('Standard Deviation'), rSquared: value('R-Squared'), columns, n };
}

export function problemNames(kind: 'linear' | 'nonlinear'): string[] {
  return readdirSync(`${STRD_DIR}${kind}`)
    .filter((f) => f.endsWith('.dat'))
    .map((f) => f.slice(0, -4))
    .sort();
}

/**
 * Log relative error, NIST's accuracy measure (McCullough (1998), "Assessing the reliability of
 * statistical software: Part I", The American Statistician 52(4):358-366): -log10(|est - cert| /
 * |cert|), or -log10(|est|) when the certified value is 0; capped at the certified digits.
 */
export function lre(estimate: number, certified: number, cap: number): number {
  if (!Number.isFinite(estimate)) return 0;
  const err = certified === 0 ? Math.abs(estimate) : Math.abs(estimate - certified) / Math.abs(certified);
  if (err === 0) return cap;
  return Math.max(0, Math.min(cap, -Math.log10(err)));
}
