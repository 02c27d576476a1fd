import { stat } from 'node:fs/promises';
import { resolve } from 'node:path';
import { InputError, type SourceSpan, type Warning } from '../../common/errors.js';
import { DATA_ERROR, loadStudy, readRigHead, STUDY_MAX_BYTES, type Study } from '../../data/index.js';
import {
  checkStudyGroups,
  classifyVariable,
  findGroups,
  GROUPS_ERROR,
  type GroupAnalysis,
  type VariableInput,
} from '../../dimensional/index.js';
import { checkUserName } from '../../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../../properties/index.js';
import { parseUnit } from '../../units/index.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { formatTable } from '../format.js';
import { fileChunks, readInputText, resolveInputs } from '../reduce-inputs.js';

/**
 * `similis groups`: the dimensionless groups of a problem (Buckingham Pi), recognised against
 * the named groups of the trade. Variables come from rig CSV files (header columns with a unit,
 * `# name = value unit` constants; with --study, the study's `data:` files), the study's
 * constants, and `--var NAME=UNIT[:kind]` (which replaces a variable of the same name). With a
 * study, its groups are also checked ('groups-incomplete', 'groups-dependent'), counting the
 * files' columns as varied and constants as fixed. No maths here: src/dimensional does the work.
 */

export interface GroupsCommandOptions {
  /** `NAME=UNIT` or `NAME=UNIT:kind`, repeatable. */
  readonly var?: readonly string[];
  /** `NAME=kind`, repeatable: the kind of a variable from a file (or from --var). */
  readonly kind?: readonly string[];
  readonly response?: string;
  /** Comma-separated repeating variables. */
  readonly repeat?: string;
  readonly study?: string;
}

const REPEAT_ERRORS: ReadonlySet<string> = new Set([
  GROUPS_ERROR.repeatCount,
  GROUPS_ERROR.repeatDependent,
  GROUPS_ERROR.repeatResponse,
  GROUPS_ERROR.repeatDimensionless,
]);

/** A variable as the command shows it: the engine's input, the unit as written, where it came from. */
interface ShownVariable {
  readonly input: VariableInput;
  readonly unit: string;
  /** '--var', 'loop-a.csv', 'loop-a.csv (constant)'. */
  readonly source: string;
  /** Where to point an error about its kind. */
  readonly where: SourceSpan;
  /** A file column (varied in the data), as opposed to a constant or a --var. */
  readonly varied: boolean;
}

const VAR_FORM = 'NAME=UNIT or NAME=UNIT:kind (for example dp=Pa or g=m/s^2:gravity)';

/**
 * Runs `similis groups [data-file] [--var ...] [--response N] [--repeat a,b,c]`.
 * @throws {InputError} bad --var/--kind text (kind 'usage'), unit errors ('unit-*'), names a
 *   formula cannot use ('formula-*'), the 'groups-*' errors of the engine, file and study errors
 *   ('file-not-found', 'data-no-match', 'csv-*', 'study-*').
 */
export async function runGroups(ctx: CommandContext, files: readonly string[], opts: GroupsCommandOptions): Promise<CommandOutcome> {
  const study = opts.study === undefined ? null : await readStudy(ctx, opts.study);
  const shown: ShownVariable[] = [];
  const skipped = new Set<string>();
  const add = (v: ShownVariable, replace: boolean): void => {
    const i = shown.findIndex((s) => s.input.name === v.input.name);
    if (i < 0) shown.push(v);
    else if (replace) shown[i] = v;
  };
  if (files.length > 0 || (study !== null && study.study.data.length > 0)) {
    for (const f of await resolveInputs(ctx.io, files, study?.study.data ?? [], study?.path ?? null)) {
      const head = await readRigHead(fileChunks(f.path, undefined, f.label), { file: f.label, sink: ctx.warnings });
      for (const c of head.columns) {
        if (c.hasUnit) add({ input: toInput(c.name, c.unit), unit: c.unit.text, source: f.label, where: c.where, varied: true }, false);
        else skipped.add(c.name);
      }
      for (const k of head.constants) add({ input: toInput(k.name, k.unit), unit: k.unit.text, source: `${f.label} (constant)`, where: k.where, varied: false }, false);
    }
  }
  for (const k of study?.study.constants ?? []) add({ input: toInput(k.name, k.unit), unit: k.unit.text, source: `${k.where.file ?? 'study'} (constant)`, where: k.where, varied: false }, false);
  const given = new Set<string>();
  for (const arg of opts.var ?? []) {
    const v = parseVarArgument(ctx, arg);
    if (given.has(v.input.name)) throw new InputError(GROUPS_ERROR.duplicateName, `--var gives ${v.input.name} twice`, v.where);
    given.add(v.input.name);
    add(v, true);
  }
  applyKinds(shown, opts.kind ?? []);
  for (const v of shown) checkKind(v);
  const analysis = analyse(shown, opts);
  const checked = study === null ? [] : checkStudy(study.study, shown);
  for (const w of checked) ctx.warnings.warn(w);
  const skippedNote = skipped.size === 0 ? '' : `Columns without a unit, left out: ${[...skipped].join(', ')} (add a dimensionless one with --var NAME=1).\n\n`;
  const studyNote = study === null ? '' : studyText(study.study, checked);
  return {
    text: skippedNote + groupsText(analysis, shown) + studyNote,
    json: { ...groupsJson(analysis, shown), skippedColumns: [...skipped], ...(study === null ? {} : { studyCheck: checked }) },
  };
}

/** Reads and validates a study file (as `similis reduce` does). */
async function readStudy(ctx: CommandContext, file: string): Promise<{ study: Study; path: string }> {
  const path = resolve(ctx.io.cwd, file);
  const s = await stat(path).catch(() => undefined);
  if (s === undefined || !s.isFile()) throw new InputError('file-not-found', `no such study file: ${file}; give the path of an existing study file (YAML)`, { file });
  if (s.size > STUDY_MAX_BYTES) {
    throw new InputError(DATA_ERROR.studyLimits, `the study file is ${s.size} bytes long; the limit is ${STUDY_MAX_BYTES}`, { file });
  }
  return { study: loadStudy(await readInputText(path, file), file, ctx.warnings), path };
}

/** The study's groups against the variables: columns count as varied, constants as fixed. */
function checkStudy(study: Study, shown: readonly ShownVariable[]): Warning[] {
  const variables = shown.map((v) => ({ name: v.input.name, dimension: v.input.dimension, varied: v.varied, where: v.where }));
  const groups = study.groups.map((g) => ({ name: g.name, formula: g.formula, where: g.nameWhere }));
  return checkStudyGroups(variables, groups, { derived: study.derived.map((d) => ({ name: d.name, formula: d.formula, where: d.nameWhere })) });
}

function studyText(study: Study, warnings: readonly Warning[]): string {
  const names = study.groups.map((g) => g.name);
  if (names.length === 0) return '';
  const verdict = warnings.length === 0 ? 'they cover every varied column and are independent' : `see the ${warnings.length} warning${warnings.length === 1 ? '' : 's'}`;
  return `\nThe study's groups (${study.file}): ${names.join(', ')}: ${verdict}.\n`;
}

function analyse(shown: readonly ShownVariable[], opts: GroupsCommandOptions): GroupAnalysis {
  const repeating = opts.repeat === undefined ? undefined : opts.repeat.split(',').map((s) => s.trim()).filter((s) => s !== '');
  try {
    return findGroups(
      shown.map((s) => s.input),
      { ...(opts.response === undefined ? {} : { response: opts.response }), ...(repeating === undefined ? {} : { repeating }) },
    );
  } catch (e) {
    if (!(e instanceof InputError) || e.where.file !== undefined) throw e;
    const text = opts.repeat ?? '';
    if (REPEAT_ERRORS.has(e.kind) || (repeating !== undefined && e.message.startsWith('the repeating variable'))) {
      throw e.relocate({ file: '--repeat', column: 1, endColumn: text.length + 1, text });
    }
    if (e.kind === GROUPS_ERROR.responseAlone || e.message.startsWith('the response')) throw e.relocate({ file: '--response' });
    if (e.kind === GROUPS_ERROR.duplicateName) throw e.relocate({ file: '--var' });
    throw e;
  }
}

/** `dp=Pa`, `g=m/s^2:gravity` -> a variable, with errors placed in the argument text. */
function parseVarArgument(ctx: CommandContext, arg: string): ShownVariable {
  const where = (column: number, endColumn: number): SourceSpan => ({ file: '--var', column, endColumn, text: arg });
  const eq = arg.indexOf('=');
  if (eq <= 0) throw new InputError('usage', `expected ${VAR_FORM}, found '${arg}'`, where(1, arg.length + 1));
  const name = arg.slice(0, eq).trim();
  // A study may call the fluid properties: a variable may not take one of their names.
  checkUserName(name, where(1, eq + 1), PROPERTY_FUNCTIONS);
  const rest = arg.slice(eq + 1);
  const colon = rest.lastIndexOf(':');
  const unitText = colon < 0 ? rest : rest.slice(0, colon);
  const kind = colon < 0 ? undefined : rest.slice(colon + 1).trim();
  const unitColumn = eq + 2;
  let unit;
  try {
    unit = parseUnit(unitText, {
      warn: (w) => ctx.warnings.warn({ ...w, where: { file: '--var', column: unitColumn + (w.where?.column ?? 1) - 1, text: arg } }),
    });
  } catch (e) {
    if (e instanceof InputError) throw e.relocate({ file: '--var', column: unitColumn, text: arg });
    throw e;
  }
  const kindColumn = unitColumn + unitText.length + 1;
  return {
    input: { name, dimension: unit.dimension, temperature: unit.temperature, ...(kind === undefined || kind === '' ? {} : { kind }) },
    unit: unit.text,
    source: '--var',
    where: kind === undefined ? where(1, arg.length + 1) : where(kindColumn, arg.length + 1),
    varied: false,
  };
}

/** `--kind NAME=kind` sets the kind of a variable given in a file or with --var. */
function applyKinds(shown: ShownVariable[], kinds: readonly string[]): void {
  for (const arg of kinds) {
    const eq = arg.indexOf('=');
    const span: SourceSpan = { file: '--kind', column: 1, endColumn: arg.length + 1, text: arg };
    if (eq <= 0) throw new InputError('usage', `expected NAME=kind (for example g=gravity), found '${arg}'`, span);
    const name = arg.slice(0, eq).trim();
    const i = shown.findIndex((s) => s.input.name === name);
    if (i < 0) {
      throw new InputError('groups-unknown-name', `--kind names ${name}, which is not one of the variables (${shown.map((s) => s.input.name).join(', ')})`, span);
    }
    const s = shown[i]!;
    shown[i] = { ...s, input: { ...s.input, kind: arg.slice(eq + 1).trim() }, where: { ...span, column: eq + 2 } };
  }
}

/** Checks a kind hint where it was written, so that an error points at it. */
function checkKind(v: ShownVariable): void {
  if (v.input.kind === undefined) return;
  try {
    classifyVariable(v.input);
  } catch (e) {
    if (e instanceof InputError) throw e.relocate(v.where);
    throw e;
  }
}

function toInput(name: string, unit: { dimension: VariableInput['dimension']; temperature: VariableInput['temperature'] }): VariableInput {
  return { name, dimension: unit.dimension, ...(unit.temperature === undefined ? {} : { temperature: unit.temperature }) };
}

const PREFERENCE = '  (chosen: most groups with a name, then a density, a velocity or flow rate, a length; choose with --repeat)';

/** The text report: matrix, rank, groups with names, related named groups, other sets, a study block. */
function groupsText(a: GroupAnalysis, shown: readonly ShownVariable[]): string {
  const out: string[] = [];
  const bases = a.matrix.bases;
  out.push(`Dimensional matrix: ${a.variables.length} variables over ${bases.length > 0 ? bases.join(' ') : 'no base dimension'}`);
  const widths = a.matrix.entries.map((row, i) => Math.max(bases[i]!.length, ...row.map((e) => e.toString().length)));
  const rows = a.variables.map((v, j) => [
    v.name,
    shown[j]!.unit,
    v.kind.words + (v.assumed ? ' *' : ''),
    ...a.matrix.entries.map((row, i) => row[j]!.toString().padStart(widths[i]!)),
  ]);
  const head = ['variable', 'unit', 'kind', ...bases.map((b, i) => b.padStart(widths[i]!))];
  out.push(indent(formatTable([head, ...rows])));
  if (a.variables.some((v) => v.assumed)) {
    out.push('  * assumed from the dimension alone; say otherwise with --var NAME=UNIT:kind or --kind NAME=kind');
  }
  const n = a.variables.length;
  const k = a.groups.length;
  out.push('', `Rank ${a.rank}, so ${n} - ${a.rank} = ${k} dimensionless group${k === 1 ? '' : 's'} (Buckingham Pi theorem).`);
  if (k === 0) {
    out.push('The variables are dimensionally independent: no dimensionless group can be formed from them.');
    return out.join('\n') + '\n';
  }
  out.push(`Repeating variables: ${a.repeating.length > 0 ? a.repeating.join(', ') : '(none)'}${a.chosenBy === 'user' ? ' (as given)' : ''}`);
  if (a.chosenBy === 'preference') out.push(PREFERENCE);
  const responseGroup = a.groups.find((g) => g.isResponse);
  if (responseGroup !== undefined) out.push(`Response: ${a.response}, in group ${responseGroup.key} only.`);
  const table = a.groups.map((g) => [g.key, g.formula, g.relation ?? '-', groupName(g), g.recognition?.physics ?? '-']);
  out.push('', indent(formatTable([['group', 'formula', 'as named', 'name', 'measures'], ...table])));
  const notes = a.groups.flatMap((g) => (g.recognition?.notes ?? []).map((note) => `  ${g.key}: ${note}; ${g.key} = ${g.studyFormula}`));
  if (notes.length > 0) out.push('', 'Notes:', ...notes);
  if (a.absent.length > 0) out.push('', 'In no group:', ...a.absent.map((x) => `  ${x.name}: ${x.reason}`));
  if (a.related.length > 0) {
    out.push('', 'Also formed from these groups:');
    for (const r of a.related) {
      out.push(`  ${r.name}: ${r.symbol} = ${r.formula} = ${r.relation}`);
      for (const note of r.notes) out.push(`    (${note})`);
    }
  }
  if (a.alternatives.length > 0) {
    out.push('', 'Other repeating sets give other groups:');
    for (const alt of a.alternatives) out.push(`  --repeat ${alt.repeating.join(',')}: ${alt.groups.join(', ')}`);
  }
  out.push('', 'For a study file:', '  groups:');
  for (const g of a.groups) {
    if (g.recognition?.type === 'input') out.push(`    # ${g.key} is dimensionless already: use it as it is`);
    else out.push(`    ${g.key}: ${g.studyFormula}`);
  }
  return out.join('\n') + '\n';
}

function groupName(g: GroupAnalysis['groups'][number]): string {
  const rec = g.recognition;
  if (rec === null) return '(no common name)';
  if (rec.type === 'input') return '(a dimensionless input)';
  return rec.type === 'named' ? `${rec.name} ${rec.symbol}` : (rec.name ?? '-');
}

function indent(text: string): string {
  return text
    .split('\n')
    .map((l) => `  ${l}`)
    .join('\n');
}

/** The JSON document (the runner adds `warnings`). Exponents are exact rationals as strings. */
function groupsJson(a: GroupAnalysis, shown: readonly ShownVariable[]): Record<string, unknown> {
  return {
    variables: a.variables.map((v, j) => ({
      name: v.name,
      unit: shown[j]!.unit,
      source: shown[j]!.source,
      dimension: v.dimension.toString(),
      kind: v.kind.id,
      kindWords: v.kind.words,
      kindFrom: v.decidedBy,
      assumed: v.assumed,
    })),
    bases: a.matrix.bases,
    matrix: a.matrix.entries.map((row) => row.map((e) => e.toString())),
    rank: a.rank,
    groupCount: a.groups.length,
    response: a.response,
    repeating: a.repeating,
    repeatingChosenBy: a.chosenBy,
    groups: a.groups.map((g) => {
      const rec = g.recognition;
      const named = rec !== null && rec.type !== 'input';
      return {
        key: g.key,
        formula: g.formula,
        exponents: Object.fromEntries([...g.exponents].map(([name, e]) => [name, e.toString()])),
        name: named ? rec.name : null,
        symbol: rec?.type === 'named' ? rec.symbol : null,
        power: rec?.type === 'named' ? rec.power.toString() : null,
        factor: rec?.type === 'named' && !rec.factor.isOne() ? rec.factor.toString() : null,
        factorValue: rec?.type === 'named' && !rec.factor.isOne() ? rec.factor.value : null,
        relation: g.relation,
        studyFormula: g.studyFormula,
        physics: rec?.physics ?? null,
        notes: rec?.notes ?? [],
        source: rec?.entry?.source ?? null,
        isResponse: g.isResponse,
      };
    }),
    absent: a.absent,
    related: a.related,
    alternatives: a.alternatives,
  };
}
