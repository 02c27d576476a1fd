import { InputError, type SourceSpan } from '../../common/errors.js';
import {
  compactNumber,
  correlationAt,
  describeBounds,
  describeRange,
  FAMILIES,
  findCorrelation,
  listCorrelations,
  rangeViolations,
  terminalVelocity,
  CORRELATION_MESSAGES as MESSAGES,
  type Correlation,
  type CorrelationFamily,
} from '../../correlations/index.js';
import { evaluateConstant, parseFormula } from '../../expr/index.js';
import { nearestNames } from '../../expr/nearest.js';
import { describeDimension, Dimension, parseUnit, toSI, type Unit } from '../../units/index.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { formatNumber, formatTable } from '../format.js';

const WHERE = 'command line';
const FAMILY_WORDS: Readonly<Record<string, CorrelationFamily>> = { friction: 'pipe-friction', drag: 'sphere-drag', heat: 'heat-transfer' };

/**
 * `similis handbook [list|show|eval|settle] ...`: lists the handbook correlations, shows one in
 * full, evaluates one at given inputs (warning 'outside-range' outside its stated range), or
 * solves the settling velocity of a sphere with a drag law. No maths here: it all lives in
 * src/correlations.
 */
export function runHandbook(ctx: CommandContext, action: string | undefined, args: readonly string[], opts: { family?: string }): CommandOutcome {
  switch (action ?? 'list') {
    case 'list':
      return listOutcome(opts.family);
    case 'show':
      return showOutcome(correlationArgument('show', args));
    case 'eval':
      return evalOutcome(ctx, correlationArgument('eval', args), args.slice(1));
    case 'settle':
      return settleOutcome(ctx, correlationArgument('settle', args), args.slice(1));
    default:
      throw new InputError('usage', `'${action}' is not a handbook action: use list, show ID, eval ID name=value..., or settle ID ...`, { file: WHERE }, {
        hint: `to see one correlation: similis handbook show ${nearestNames(action ?? '', listCorrelations().map((c) => c.id), 1)[0] ?? 'colebrook'}`,
      });
  }
}

/** The correlation named by the first argument, with its column on the command line for errors. */
function correlationArgument(action: string, args: readonly string[]): Correlation {
  const id = args[0];
  if (id === undefined || id.trim() === '') {
    throw new InputError('usage', `'handbook ${action}' needs a correlation id (similis handbook lists them)`, { file: WHERE });
  }
  const prefix = `handbook ${action}`;
  const column = prefix.length + 2;
  return findCorrelation(id, { file: WHERE, column, endColumn: column + id.length, text: [prefix, ...args].join(' ') });
}

/** 'Colebrook (1939)' from 'Colebrook (1939), J. Inst. ...'. */
function shortSource(c: Correlation): string {
  const m = /^[^()]*\(\d{4}\)/.exec(c.source);
  return m === null ? c.source : m[0];
}


function correlationJson(c: Correlation): Record<string, unknown> {
  return {
    id: c.id,
    title: c.title,
    family: c.family,
    returns: c.returns,
    equation: `${c.equation.left} = ${c.equation.right}`,
    words: c.words,
    inputs: c.inputs.map((i) => ({ name: i.name, meaning: i.meaning, ...(i.default === undefined ? {} : { default: i.default }) })),
    range: c.range.map((b) => ({ input: b.input, min: b.min ?? null, max: b.max ?? null, source: b.source })),
    rangeNote: c.rangeNote ?? null,
    accuracy: c.accuracy ?? null,
    method: c.method ?? null,
    source: c.source,
  };
}

function listOutcome(familyWord: string | undefined): CommandOutcome {
  let family: CorrelationFamily | undefined;
  if (familyWord !== undefined) {
    family = FAMILY_WORDS[familyWord];
    if (family === undefined) {
      throw new InputError('usage', `--family must be friction, drag or heat, not '${familyWord}'`, { file: '--family' });
    }
  }
  const blocks: string[] = [];
  for (const f of FAMILIES) {
    if (family !== undefined && f.family !== family) continue;
    // Fanning twins are listed in JSON; in text, one line says they exist.
    const shown = listCorrelations(f.family).filter((c) => c.returns.symbol !== 'f_F');
    const rows = [['id', 'range', 'source', 'form'], ...shown.map((c) => [c.id, describeRange(c), shortSource(c), `${c.equation.left} = ${c.equation.right}`])];
    const note =
      f.family === 'pipe-friction'
        ? "Each returns the Darcy factor f_D; each has a Fanning twin '<id>-fanning' returning f_F = f_D/4.\n"
        : '';
    blocks.push(`${f.heading}\n${note}${formatTable(rows)}\n`);
  }
  const text = blocks.join('\n') + "\nMore on one: similis handbook show ID. Evaluate one: similis handbook eval ID name=value ...\n";
  return { text, json: { correlations: listCorrelations(family).map(correlationJson) } };
}

function showOutcome(c: Correlation): CommandOutcome {
  const rows: string[][] = [
    ['returns', c.returns.name],
    ['equation', `${c.equation.left} = ${c.equation.right}`],
    ['in words', c.words],
  ];
  c.inputs.forEach((i, k) => {
    const dflt = i.default === undefined ? '' : `; optional, default ${i.default.words}`;
    rows.push([k === 0 ? 'inputs' : '', `${i.name}: ${i.meaning}${dflt}`]);
  });
  if (c.range.length === 0) rows.push(['range', 'no stated range']);
  c.range.forEach((b, k) => rows.push([k === 0 ? 'range' : '', `${describeBounds([b])}   (${b.source})`]));
  if (c.rangeNote !== undefined) rows.push(['', c.rangeNote]);
  if (c.accuracy !== undefined) rows.push(['accuracy', c.accuracy]);
  if (c.method !== undefined) rows.push(['method', c.method]);
  rows.push(['source', c.source]);
  if (c.returns.symbol === 'f_D') rows.push(['Fanning twin', `${c.id}-fanning`]);
  const text = `${c.id}: ${c.title}\n${formatTable(rows)}\n`;
  return { text, json: correlationJson(c) };
}

/** One `name=value` word of the command line, with where it starts in the joined text. */
interface Assignment {
  readonly raw: string;
  readonly name: string;
  readonly valueText: string;
  readonly where: SourceSpan;
}

function assignments(words: readonly string[], offset: string): Assignment[] {
  const text = [offset, ...words].join(' ');
  let column = offset.length + 2;
  const seen = new Set<string>();
  return words.map((w) => {
    const where: SourceSpan = { file: WHERE, column, endColumn: column + w.length, text };
    column += w.length + 1;
    const eq = w.indexOf('=');
    const name = eq < 0 ? '' : w.slice(0, eq).trim();
    if (eq < 0 || name === '' || w.slice(eq + 1).trim() === '') {
      throw new InputError('usage', `expected name=value (for example Re=1e5), got '${w}'`, where);
    }
    if (seen.has(name)) throw new InputError('usage', `${name} is given twice`, where);
    seen.add(name);
    return { raw: w, name, valueText: w.slice(eq + 1).trim(), where };
  });
}

/** A number or a constant expression ('1e5', '0.045/100'). */
function numberFrom(a: Assignment): number {
  let v: number | undefined;
  try {
    v = evaluateConstant(parseFormula(a.valueText).root)?.value;
  } catch {
    v = undefined;
  }
  if (v === undefined || !Number.isFinite(v)) {
    throw new InputError('usage', `${a.name} must be a number (or a constant expression such as 0.045/100), got '${a.valueText}'`, a.where);
  }
  return v;
}

function evalOutcome(ctx: CommandContext, c: Correlation, words: readonly string[]): CommandOutcome {
  const given = assignments(words, `handbook eval ${c.id}`);
  const point: Record<string, number> = {};
  for (const a of given) {
    if (!c.inputs.some((i) => i.name === a.name)) {
      const near = nearestNames(a.name, c.inputs.map((i) => i.name), 3);
      throw new InputError('correlation-unknown-input', MESSAGES.unknownInput(c, a.name), a.where, { hint: `did you mean ${near.join(', ')}?` });
    }
    point[a.name] = numberFrom(a);
  }
  const value = correlationAt(c, point, { file: WHERE });
  const outside = rangeViolations(c, point);
  for (const v of outside) {
    const at = given.find((a) => a.name === v.input)?.where;
    const bound = describeBounds([v.bound]);
    ctx.warnings.warn({ code: 'outside-range', message: MESSAGES.outsideRange(c, v.input, compactNumber(v.value), bound, v.bound.source), ...(at === undefined ? {} : { where: at }) });
  }
  const defaults = c.inputs.filter((i) => i.default !== undefined && point[i.name] === undefined).map((i) => `${i.name} = ${i.default?.words}`);
  const at = Object.entries(point).map(([k, v]) => `${k} = ${compactNumber(v)}`).join(', ');
  const text =
    `${c.id} at ${at}${defaults.length > 0 ? ` (default ${defaults.join(', ')})` : ''}:\n` +
    `${c.returns.symbol} = ${formatNumber(value)}   (${c.returns.name})\n`;
  return {
    text,
    json: {
      id: c.id,
      returns: c.returns,
      inputs: point,
      value,
      outsideRange: outside.map((v) => ({ input: v.input, value: v.value, min: v.bound.min ?? null, max: v.bound.max ?? null, source: v.bound.source })),
    },
  };
}

/** What `settle` needs, with the dimension each must have. */
const SETTLE_INPUTS = [
  { name: 'diameter', dimension: Dimension.of({ L: 1 }), example: 'diameter=1mm' },
  { name: 'particleDensity', dimension: Dimension.of({ M: 1, L: -3 }), example: 'particleDensity=2500kg/m^3' },
  { name: 'fluidDensity', dimension: Dimension.of({ M: 1, L: -3 }), example: 'fluidDensity=998.2kg/m^3' },
  { name: 'viscosity', dimension: Dimension.of({ M: 1, L: -1, T: -1 }), example: 'viscosity=1.0016mPa*s' },
  { name: 'gravity', dimension: Dimension.of({ L: 1, T: -2 }), example: 'gravity=9.81m/s^2' },
] as const;

const QUANTITY = /^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/;

/** A value with its unit ('1mm', '2500kg/m^3'), converted to SI and checked against the expected dimension. */
function quantitySI(ctx: CommandContext, a: Assignment, expected: Dimension): number {
  const m = QUANTITY.exec(a.valueText);
  if (m === null || (m[2] ?? '') === '') {
    throw new InputError('usage', `${a.name} needs a number and a unit (for example ${SETTLE_INPUTS.find((s) => s.name === a.name)?.example})`, a.where);
  }
  const unitText = m[2] ?? '';
  const outer = { ...a.where, column: (a.where.column ?? 1) + a.raw.lastIndexOf(unitText) };
  let unit: Unit;
  try {
    unit = parseUnit(unitText, { warn: (w) => ctx.warnings.warn({ ...w, where: outer }) });
  } catch (e) {
    if (e instanceof InputError) throw e.relocate(outer);
    throw e;
  }
  if (!unit.dimension.equals(expected)) {
    throw new InputError('unit-dimension', `${a.name} must be ${describeDimension(expected)}; ${unit.text} is ${describeDimension(unit.dimension)}`, a.where);
  }
  return toSI(unit).apply(Number(m[1]));
}

function settleOutcome(ctx: CommandContext, c: Correlation, words: readonly string[]): CommandOutcome {
  const given = assignments(words, `handbook settle ${c.id}`);
  const si: Record<string, number> = {};
  for (const a of given) {
    const spec = SETTLE_INPUTS.find((s) => s.name === a.name);
    if (spec === undefined) {
      const near = nearestNames(a.name, SETTLE_INPUTS.map((s) => s.name), 3);
      throw new InputError('usage', `settle takes ${SETTLE_INPUTS.map((s) => s.name).join(', ')}; not '${a.name}'`, a.where, { hint: `did you mean ${near.join(', ')}?` });
    }
    si[a.name] = quantitySI(ctx, a, spec.dimension);
  }
  const missing = SETTLE_INPUTS.filter((s) => s.name !== 'gravity' && si[s.name] === undefined);
  if (missing.length > 0) {
    throw new InputError('usage', `settle needs ${missing.map((s) => s.example).join(' ')}`, { file: WHERE });
  }
  const r = terminalVelocity(
    {
      diameterM: si['diameter']!,
      particleDensityKgM3: si['particleDensity']!,
      fluidDensityKgM3: si['fluidDensity']!,
      viscosityPaS: si['viscosity']!,
      ...(si['gravity'] === undefined ? {} : { gravityMPerS2: si['gravity'] }),
    },
    c,
    { file: WHERE },
  );
  for (const w of r.warnings) ctx.warnings.warn(w);
  const rows = [
    ['terminal velocity', `${formatNumber(r.velocityMPerS, 6)} m/s`],
    ['Reynolds number', formatNumber(r.reynolds, 6)],
    ['drag coefficient', formatNumber(r.dragCoefficient, 6)],
    ['Archimedes number', formatNumber(r.archimedes, 6)],
  ];
  const text = `sphere settling with ${c.id} (C_D*Re^2 = 4*Ar/3 solved for Re):\n${formatTable(rows)}\n`;
  return {
    text,
    json: { id: c.id, inputsSI: si, velocityMPerS: r.velocityMPerS, reynolds: r.reynolds, dragCoefficient: r.dragCoefficient, archimedes: r.archimedes },
  };
}
