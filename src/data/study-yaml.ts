import { isAlias, isMap, isScalar, isSeq, LineCounter, parseDocument, type Document, type Node, type Scalar, type YAMLMap } from 'yaml';
import { InputError, type SourceSpan } from '../common/errors.js';
import { parseFormula, type Formula, type FunctionTable } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import type { RawNode } from './study-types.js';
import { didYouMean } from './suggest.js';

/**
 * YAML for study files, read safely and with positions. The `yaml` package parses with its
 * 'core' schema (strings, numbers, booleans, null: no custom tags, so no object can be
 * constructed from the file), rejects duplicate keys and `<<` merges, and alias expansion is
 * bounded (maxAliasCount) against "billion laughs" inputs. Every node keeps its offset; a
 * LineCounter turns offsets into 1-based lines and columns.
 */

/** The largest study file read (a study holds formulas and settings, not data). */
export const STUDY_MAX_BYTES = 1 << 20;
const MAX_ALIAS_COUNT = 100;

/** A parsed study document and what is needed to place messages in it. */
export interface YamlSource {
  readonly file: string;
  readonly text: string;
  readonly doc: Document.Parsed;
  readonly counter: LineCounter;
}

/**
 * Parses study text.
 * @throws {InputError} 'study-limits' (too large, too many aliases), 'study-yaml' (syntax,
 *   duplicate keys, tags) at the line and column the YAML parser reports.
 * @example parseStudyYaml('title: loop A\n', 'study.yaml').doc.get('title') // => 'loop A'
 */
export function parseStudyYaml(text: string, file: string): YamlSource {
  if (text.length > STUDY_MAX_BYTES) {
    throw new InputError(DATA_ERROR.studyLimits, dataMessages.studyTooLarge(text.length, STUDY_MAX_BYTES), { file });
  }
  const counter = new LineCounter();
  const doc = parseDocument(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text, {
    lineCounter: counter,
    schema: 'core',
    merge: false,
    uniqueKeys: true,
    prettyErrors: false,
    strict: true,
    // YAML 1.1's !!binary, !!set, !!omap, !!pairs and !!timestamp would build objects: refused as unknown tags.
    resolveKnownTags: false,
  });
  const source: YamlSource = { file, text: text.charCodeAt(0) === 0xfeff ? text.slice(1) : text, doc, counter };
  const problem = doc.errors[0] ?? doc.warnings.find((w) => w.code === 'TAG_RESOLVE_FAILED');
  if (problem !== undefined) {
    const where = spanAt(source, problem.pos[0], problem.pos[1]);
    // The text where the parser stopped, to the end of its line (at most 40 characters).
    const lineEnd = source.text.indexOf('\n', problem.pos[0]);
    const found = source.text.slice(problem.pos[0], Math.min(lineEnd === -1 ? source.text.length : lineEnd, problem.pos[0] + 40)).trim();
    if (problem.code === 'TAG_RESOLVE_FAILED') {
      const tag = /^!\S*/.exec(found)?.[0] ?? found;
      throw new InputError(DATA_ERROR.studyYaml, dataMessages.studyTag(tag), where);
    }
    const reason = problem.message.replace(/ at line \d+, column \d+.*$/s, '');
    throw new InputError(DATA_ERROR.studyYaml, dataMessages.studyYaml(reason, found), where, { hint: dataMessages.studyYamlHint() });
  }
  try {
    doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
  } catch (e) {
    if (e instanceof ReferenceError) throw new InputError(DATA_ERROR.studyLimits, dataMessages.studyAliases(), { file });
    throw e;
  }
  return source;
}

/**
 * The position of offsets [start, end) of the source: line, column and the line's text.
 * @example spanAt(parseStudyYaml('a: 1\nb: 2\n', 's.yaml'), 8) // => { file: 's.yaml', line: 2, column: 4, text: 'b: 2' }
 */
export function spanAt(source: YamlSource, start: number, end?: number): SourceSpan {
  const pos = source.counter.linePos(start);
  const lineStart = source.counter.lineStarts[pos.line - 1] ?? 0;
  const nextLine = source.text.indexOf('\n', lineStart);
  const text = source.text.slice(lineStart, nextLine === -1 ? source.text.length : nextLine).replace(/\r$/, '');
  const sameLine = end !== undefined && end > start && source.counter.linePos(end).line === pos.line;
  return {
    file: source.file,
    line: pos.line,
    column: pos.col,
    ...(sameLine ? { endColumn: pos.col + (end - start) } : {}),
    text,
  };
}

/**
 * The position of a node (its first character).
 * @example spanOf(source, source.doc.get('groups', true)) // => { file, line, column, text }
 */
export function spanOf(source: YamlSource, node: Node | null | undefined): SourceSpan {
  const range = node?.range;
  if (range === undefined || range === null) return { file: source.file };
  return spanAt(source, range[0], range[1]);
}

/**
 * Follows an alias to the node it names (other nodes are returned as they are).
 * @example resolved(source, aliasNode) // => the anchored node
 */
export function resolved(source: YamlSource, node: unknown): unknown {
  return isAlias(node) ? node.resolve(source.doc) : node;
}

/**
 * A phrase for what a node is, for "expected ..., found ..." messages.
 * @example describeNode(listNode) // => 'a list'
 */
export function describeNode(node: unknown): string {
  if (node === null || node === undefined) return 'nothing';
  if (isMap(node)) return 'a mapping (key: value lines)';
  if (isSeq(node)) return 'a list';
  if (isScalar(node)) {
    const v = node.value;
    if (v === null) return 'nothing (null)';
    if (typeof v === 'boolean') return `the truth value ${String(v)}`;
    if (typeof v === 'number') return `the number ${String(v)}`;
    return `the text '${String(v)}'`;
  }
  return 'an unsupported YAML value';
}

/**
 * The entries of a mapping node, each with its key text and position; keys are checked against
 * `known` (null: any key). Nothing (an empty section) gives no entries.
 * @throws {InputError} 'study-type' for a value that is not a mapping; 'study-unknown-key' with
 *   the nearest known key.
 * @example mapEntries(source, fitNode, 'fit', FIT_KEYS).map((e) => e.key) // => ['response', 'where']
 */
export function mapEntries(
  source: YamlSource,
  node: unknown,
  section: string,
  known: readonly string[] | null,
): { key: string; keyWhere: SourceSpan; value: unknown }[] {
  const map = resolved(source, node);
  if (map === null || map === undefined || (isScalar(map) && map.value === null)) return [];
  if (!isMap(map)) {
    throw new InputError(DATA_ERROR.studyType, dataMessages.expected('a mapping (name: value lines)', section, describeNode(map)), spanOf(source, map as Node));
  }
  return (map as YAMLMap<unknown, unknown>).items.map((pair) => {
    const keyNode = pair.key as Node | null;
    const key = isScalar(keyNode) ? String(keyNode.value) : '';
    const keyWhere = spanOf(source, keyNode);
    if (!isScalar(keyNode)) {
      throw new InputError(DATA_ERROR.studyType, dataMessages.expected('a plain key', section, describeNode(keyNode)), keyWhere);
    }
    if (known !== null && !known.includes(key)) {
      throw new InputError(DATA_ERROR.studyUnknownKey, dataMessages.unknownKey(key, section, known, didYouMean(key, known)), keyWhere);
    }
    return { key, keyWhere, value: pair.value };
  });
}

/**
 * The text of a scalar as written, and whether it maps one to one onto the source (for columns).
 * @example scalarText(source, plainScalar) // => { text: 'rho*U*D/mu', exact: true, start: 27 }
 */
export function scalarText(source: YamlSource, node: Scalar): { text: string; exact: boolean; start: number } {
  const range = node.range ?? [0, 0, 0];
  const raw = source.text.slice(range[0], range[1]);
  if (node.type === 'PLAIN' && !raw.includes('\n')) return { text: raw, exact: true, start: range[0] };
  const text = String(node.value);
  const quoted = node.type === 'QUOTE_DOUBLE' || node.type === 'QUOTE_SINGLE';
  const inner = quoted ? source.text.slice(range[0] + 1, range[0] + 1 + text.length) : '';
  return quoted && inner === text ? { text, exact: true, start: range[0] + 1 } : { text, exact: false, start: range[0] };
}

/**
 * A scalar that must be text (or a number written as text).
 * @throws {InputError} 'study-type' for a mapping, list, truth value or nothing.
 * @example textValue(source, titleNode, 'title').text // => 'Mini loop, tube A'
 */
export function textValue(source: YamlSource, node: unknown, key: string): { text: string; where: SourceSpan; exact: boolean } {
  const n = resolved(source, node);
  if (!isScalar(n) || n.value === null || typeof n.value === 'boolean') {
    throw new InputError(DATA_ERROR.studyType, dataMessages.expected('text', key, describeNode(n)), spanOf(source, (n ?? null) as Node | null));
  }
  const { text, exact, start } = scalarText(source, n);
  return { text, exact, where: spanAt(source, start, start + text.length) };
}

/**
 * A scalar parsed as a formula (calling the functions of `functions`, default the built-in ones
 * and the fluid properties), with errors placed in the study file.
 * @throws {InputError} 'study-type' for a non-scalar; formula kinds at their column in the file.
 * @example formulaValue(source, node, 'groups.Re').formula.text // => 'rho*U*D/mu'
 */
export function formulaValue(
  source: YamlSource,
  node: unknown,
  key: string,
  functions: FunctionTable = PROPERTY_FUNCTIONS,
): { formula: Formula; where: SourceSpan; columnsExact: boolean } {
  const n = resolved(source, node);
  if (!isScalar(n) || n.value === null || typeof n.value === 'boolean') {
    throw new InputError(DATA_ERROR.studyType, dataMessages.formulaExpected(key, describeNode(n)), spanOf(source, (n ?? null) as Node | null));
  }
  const { text, exact, start } = scalarText(source, n);
  const where = spanAt(source, start, start + text.length);
  try {
    return { formula: parseFormula(text, { functions }), where, columnsExact: exact };
  } catch (e) {
    if (e instanceof InputError) throw placeInside(e, where, exact);
    throw e;
  }
}

/**
 * An error found inside a piece of text (columns relative to it) placed at the text's position:
 * exactly when the text maps one to one onto the file, else at the text's start.
 * @example placeInside(formulaErrorAtColumn3, { file: 's.yaml', line: 7, column: 6 }, true).where.column // => 8
 */
export function placeInside(e: InputError, where: SourceSpan, exact: boolean): InputError {
  if (exact) return e.relocate({ ...where, ...(where.text === undefined ? {} : { text: where.text }) });
  const outer: SourceSpan = { ...where };
  return new InputError(e.kind, e.message, outer, { ...(e.hint === undefined ? {} : { hint: e.hint }), cause: e });
}

/**
 * Any node as a RawNode (kept as written, with positions).
 * @example rawNode(source, compareNode).kind // => 'list'
 */
export function rawNode(source: YamlSource, node: unknown): RawNode {
  const n = resolved(source, node);
  const where = spanOf(source, (n ?? null) as Node | null);
  if (isMap(n)) {
    const entries = mapEntries(source, n, 'this section', null).map((e) => ({ key: e.key, keyWhere: e.keyWhere, value: rawNode(source, e.value) }));
    return { kind: 'map', entries, where };
  }
  if (isSeq(n)) return { kind: 'list', items: n.items.map((item) => rawNode(source, item)), where };
  if (isScalar(n)) {
    const v = n.value;
    const value = typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean' || v === null ? v : String(v);
    return { kind: 'scalar', value, where };
  }
  return { kind: 'scalar', value: null, where };
}
