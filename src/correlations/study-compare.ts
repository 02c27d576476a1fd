import type { SourceSpan, WarningSink } from '../common/errors.js';
import { InputError } from '../common/errors.js';
import type { RawNode } from '../data/index.js';
import { compareWithCorrelation, type Comparison } from './compare.js';
import { parseCompareEntry, type CompareRequest } from './compare-spec.js';
import { checkExponent } from './exponent.js';
import { finiteMedian } from '../common/median.js';

/**
 * The study's `compare:` list applied to fitted data: each handbook correlation evaluated at every
 * point (inputs taken from the groups by name, or from the entry's arguments: a number, or the name
 * of a group or constant), with its deviation figures, slip warnings, and a sentence on each fitted
 * exponent the handbook form disagrees with.
 */

/** A YAML node kept with positions, as plain data for parseCompareEntry. */
function plain(node: RawNode): unknown {
  switch (node.kind) {
    case 'scalar':
      return node.value;
    case 'list':
      return node.items.map(plain);
    case 'map': {
      const out: Record<string, unknown> = Object.create(null) as Record<string, unknown>;
      for (const e of node.entries) out[e.key] = plain(e.value);
      return out;
    }
  }
}

/**
 * The compare requests of a study (`compare: [blasius, {colebrook: {roughness: 0.0015}}]`).
 * @throws {InputError} 'compare-syntax' when compare is not a list; the entry errors of parseCompareEntry.
 */
export function compareRequests(raw: RawNode | null, extra: readonly string[] = []): { request: CompareRequest; where: SourceSpan }[] {
  const out: { request: CompareRequest; where: SourceSpan }[] = [];
  if (raw !== null) {
    const items = raw.kind === 'list' ? raw.items : raw.kind === 'scalar' && raw.value === null ? [] : null;
    if (items === null) throw new InputError('compare-syntax', 'compare: must be a list, e.g. compare: [blasius, {colebrook: {roughness: 1e-4}}]', raw.where);
    for (const item of items) out.push({ request: parseCompareEntry(plain(item), item.where), where: item.where });
  }
  for (const id of extra) out.push({ request: parseCompareEntry(id, { file: '--compare' }), where: { file: '--compare' } });
  return out;
}

export interface StudyComparisonData {
  /** The measured response at every point. */
  readonly response: Float64Array;
  /** Groups (and other outputs) by name, every point. */
  readonly columns: ReadonlyMap<string, Float64Array>;
  /** Study constants by name (SI), for arguments that name one. */
  readonly constants?: ReadonlyMap<string, number>;
  /** The new fit at every point. */
  readonly fitted?: Float64Array;
}

export interface FittedExponent {
  readonly name: string;
  readonly estimate: number;
  readonly interval: readonly [number, number];
}

/**
 * Runs every request against the data; warnings (slips, ranges, exponents) go to `sink`.
 * @throws {InputError} 'correlation-missing-input' when an input is neither a column, nor given,
 *   nor a known constant ('compare-argument' for an argument naming an unknown name).
 */
export function runComparisons(
  requests: readonly { request: CompareRequest; where: SourceSpan }[],
  data: StudyComparisonData,
  exponents: readonly FittedExponent[],
  sink: WarningSink,
): Comparison[] {
  const results: Comparison[] = [];
  for (const { request, where } of requests) {
    const args = new Map<string, Float64Array | number>();
    for (const [name, value] of request.args) {
      if (typeof value === 'number') args.set(name, value);
      else {
        const resolved = data.columns.get(value) ?? data.constants?.get(value);
        if (resolved === undefined) {
          const known = [...data.columns.keys(), ...(data.constants?.keys() ?? [])].join(', ');
          throw new InputError('compare-argument', `${request.correlation.id}: ${name}: ${value} is not a group, derived quantity or constant of the study (known: ${known})`, where);
        }
        args.set(name, resolved);
      }
    }
    const comparison = compareWithCorrelation(
      { response: data.response, inputs: data.columns, ...(data.fitted === undefined ? {} : { fitted: data.fitted }) },
      request.correlation,
      args,
      where,
    );
    for (const w of comparison.warnings) sink.warn({ ...w, where: w.where ?? where });
    results.push(comparison);
    exponentSentences(request, data, args, exponents, sink);
  }
  return results;
}

/** For each fitted exponent of a group the correlation also takes, a warning when they disagree. */
function exponentSentences(
  request: CompareRequest,
  data: StudyComparisonData,
  args: ReadonlyMap<string, Float64Array | number>,
  exponents: readonly FittedExponent[],
  sink: WarningSink,
): void {
  const c = request.correlation;
  const takes = new Set(c.inputs.map((i) => i.name));
  for (const e of exponents) {
    if (!takes.has(e.name)) continue;
    const point: Record<string, number> = Object.create(null) as Record<string, number>;
    for (const input of c.inputs) {
      const v = args.get(input.name) ?? data.columns.get(input.name);
      if (v === undefined) continue;
      point[input.name] = typeof v === 'number' ? v : finiteMedian(v);
    }
    try {
      const check = checkExponent({ name: e.name, estimate: e.estimate, interval: e.interval, levelPercent: 95 }, c, point);
      if (!check.consistent) sink.warn({ code: 'exponent-differs', message: check.sentence });
    } catch (err) {
      if (!(err instanceof InputError)) throw err;
    }
  }
}
