import { readFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { InputError } from '../../common/errors.js';
import { compileFormula, inferDimension, parseFormula } from '../../expr/index.js';
import { describeDimension, parseUnit, toSI, type Dimension } from '../../units/index.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { formatNumber, formatTable } from '../format.js';

/**
 * `similis demo`: runs what exists of the pipeline on the invented example in data-demo/.
 *
 * Today that is: units in the file's header and `#` constants converted to SI by the unit engine,
 * then derived quantities and groups computed by the formula engine after a dimension check.
 * The file is read here by a minimal reader that only knows this example's shape; the real rig
 * reader (csv-parse, every error with file, line and column) arrives with `similis reduce`, and
 * the demo campaigns with their generator replace this example then.
 */

const EXAMPLE = 'data-demo/mini-loop/loop-a.csv';

/** The study the demo applies, in the order it is evaluated: name, formula, expected dimension. */
const STEPS: readonly { name: string; formula: string; meaning: string }[] = [
  { name: 'U', formula: '4*Q/(pi*D^2)', meaning: 'mean velocity from the volume flow' },
  { name: 'Re', formula: 'rho*U*D/mu', meaning: 'Reynolds number' },
  { name: 'f', formula: 'dp*D/(L*0.5*rho*U^2)', meaning: 'Darcy friction factor' },
  { name: 'LD', formula: 'L/D', meaning: 'length to diameter ratio' },
  // The generator's stated truth: Hagen-Poiseuille below Re 2000, Blasius (1913) above 3000.
  { name: 'f_laminar', formula: '64/Re', meaning: 'truth used below Re 2000 (Hagen-Poiseuille)' },
  { name: 'f_blasius', formula: '0.3164*Re^-0.25', meaning: 'truth used above Re 3000 (Blasius 1913)' },
];

interface MiniTable {
  labels: string[];
  columns: Map<string, { unit: string; values: number[] }>;
  constants: Map<string, { value: number; unit: string }>;
}

export async function runDemo(ctx: CommandContext): Promise<CommandOutcome> {
  const root = fileURLToPath(new URL('../../../', import.meta.url));
  const text = await readFile(root + EXAMPLE, 'utf8');
  const table = readMiniTable(text);
  const n = table.labels.length;

  // 1. Units -> SI, exactly as the rig reader will do it.
  const dims = new Map<string, Dimension>();
  const vectors = new Map<string, Float64Array>();
  const scalars = new Map<string, number>();
  const conversions: string[][] = [['quantity', 'as logged', 'in SI', 'dimension']];
  for (const [name, c] of table.constants) {
    const unit = parseUnit(c.unit, ctx.warnings);
    const si = toSI(unit).apply(c.value);
    dims.set(name, unit.dimension);
    scalars.set(name, si);
    conversions.push([name, `${c.value} ${c.unit}`, formatNumber(si, 8), describeDimension(unit.dimension)]);
  }
  for (const [name, c] of table.columns) {
    const unit = parseUnit(c.unit, ctx.warnings);
    const si = toSI(unit).applyArray(Float64Array.from(c.values));
    dims.set(name, unit.dimension);
    vectors.set(name, si);
    conversions.push([name, `column [${c.unit}]`, `x ${formatNumber(toSI(unit).apply(1), 8)}`, describeDimension(unit.dimension)]);
  }

  // 2. Formulas: dimension-checked, compiled, evaluated over the whole column at once.
  const checks: string[][] = [['name', 'formula', 'dimension', 'meaning']];
  for (const step of STEPS) {
    const formula = parseFormula(step.formula);
    const { dimension } = inferDimension(formula, dims);
    dims.set(step.name, dimension);
    const layout = { vectors: [...vectors.keys()], scalars: [...scalars.keys()], params: [] };
    const values = compileFormula(formula, layout).bind({ n, vectors, scalars }).evaluate([]);
    vectors.set(step.name, values);
    checks.push([step.name, step.formula, describeDimension(dimension), step.meaning]);
  }

  // 3. The reduced table.
  const col = (name: string): Float64Array => vectors.get(name)!;
  const rows: string[][] = [['run', 'Q [L/min]', 'dp [kPa]', 'U [m/s]', 'Re', 'f', 'f_truth', 'f/f_truth']];
  const json: Record<string, unknown>[] = [];
  for (let i = 0; i < n; i++) {
    const f = col('f')[i]!;
    const truth = col('Re')[i]! < 2000 ? col('f_laminar')[i]! : col('f_blasius')[i]!;
    rows.push([
      table.labels[i]!,
      formatNumber(table.columns.get('Q')!.values[i]!, 6),
      formatNumber(table.columns.get('dp')!.values[i]!, 6),
      formatNumber(col('U')[i]!, 5),
      formatNumber(col('Re')[i]!, 6),
      formatNumber(f, 5),
      formatNumber(truth, 5),
      formatNumber(f / truth, 4),
    ]);
    json.push({ run: table.labels[i], U: col('U')[i], Re: col('Re')[i], f, fTruth: truth, LD: col('LD')[i] });
  }

  const textOut = [
    `similis demo: ${EXAMPLE} (invented data, not measured; generator: data-demo/generate-mini-loop.mjs)`,
    '',
    '1. Units converted to SI by the unit engine (exact factors, NIST SP 811 Appendix B):',
    indent(formatTable(conversions)),
    '',
    '2. Formulas checked for dimensions, then evaluated over every row:',
    indent(formatTable(checks)),
    '',
    `3. Reduced table (${n} rows; L/D = ${formatNumber(col('LD')[0]!, 6)}):`,
    indent(formatTable(rows)),
    '',
    'f/f_truth scatters around 1 by the 1.5 % noise the generator added: the units, the groups and',
    'the Darcy factor (not Fanning) come out right. Next stages (reading any rig file, fitting,',
    'reports) are not built yet; see README.md.',
    '',
  ].join('\n');
  return { text: textOut, json: { example: EXAMPLE, rows: json } };
}

function indent(s: string): string {
  return s
    .split('\n')
    .map((l) => '   ' + l)
    .join('\n');
}

/** Reads the demo file's own shape: '# name = value unit' lines, a 'name [unit]' header, plain rows. */
function readMiniTable(text: string): MiniTable {
  const constants = new Map<string, { value: number; unit: string }>();
  const lines = text.split(/\r?\n/);
  let i = 0;
  for (; i < lines.length && lines[i]!.startsWith('#'); i++) {
    const m = /^#\s*(\w+)\s*=\s*(\S+)\s+(.+?)\s*$/.exec(lines[i]!);
    if (m) constants.set(m[1]!, { value: Number(m[2]), unit: m[3]! });
  }
  const header = (lines[i] ?? '').split(',').map((h) => /^(\w+)(?:\s*\[(.*)\])?$/.exec(h.trim()));
  const columns = new Map<string, { unit: string; values: number[] }>();
  header.slice(1).forEach((h) => h && columns.set(h[1]!, { unit: h[2] ?? '1', values: [] }));
  const labels: string[] = [];
  for (const [k, line] of lines.slice(i + 1).entries()) {
    if (line.trim() === '') continue;
    const cells = line.split(',');
    labels.push(cells[0]!);
    [...columns.values()].forEach((c, j) => {
      const v = Number(cells[j + 1]);
      if (!Number.isFinite(v)) {
        throw new InputError('demo-data', `not a number: '${cells[j + 1]}'`, { file: EXAMPLE, line: i + k + 2 });
      }
      c.values.push(v);
    });
  }
  return { labels, columns, constants };
}
