import { InputError, type SourceSpan } from '../common/errors.js';
import { nearestNames } from '../expr/nearest.js';
import { findCorrelation } from './library.js';
import { MESSAGES } from './messages.js';
import type { Correlation } from './types.js';

/**
 * One entry of a study's `compare:` list, validated: a correlation id alone (`blasius`), or an id
 * with its arguments (`{colebrook: {roughness: 0.0015}}`), where an argument is a number or the
 * name of a constant or column (resolved later, by the caller that has the data).
 */
export interface CompareRequest {
  readonly correlation: Correlation;
  /** Argument name -> a number, or the name of a constant or column of the study. */
  readonly args: ReadonlyMap<string, number | string>;
}

/**
 * Validates one `compare:` entry as read from YAML (a string, or a one-key mapping to a mapping).
 * @throws {InputError} 'compare-syntax' for any other shape; 'correlation-unknown' for an unknown id;
 *   'correlation-unknown-input' for an argument the correlation does not take (with the nearest names).
 * @example parseCompareEntry({ colebrook: { roughness: 0.0015 } }).args.get('roughness') // => 0.0015
 */
export function parseCompareEntry(raw: unknown, where: SourceSpan = {}): CompareRequest {
  if (typeof raw === 'string') return { correlation: findCorrelation(raw, where), args: new Map() };
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) throw syntax(where);
  const keys = Object.keys(raw);
  if (keys.length !== 1) throw syntax(where);
  const id = keys[0]!;
  const correlation = findCorrelation(id, where);
  const body = (raw as Record<string, unknown>)[id];
  const args = new Map<string, number | string>();
  if (body === null || body === undefined) return { correlation, args };
  if (typeof body !== 'object' || Array.isArray(body)) throw syntax(where);
  for (const [name, value] of Object.entries(body as Record<string, unknown>)) {
    if (!correlation.inputs.some((i) => i.name === name)) {
      const near = nearestNames(name, correlation.inputs.map((i) => i.name), 3);
      throw new InputError('correlation-unknown-input', MESSAGES.unknownInput(correlation, name), where, { hint: `did you mean ${near.join(', ')}?` });
    }
    if (typeof value === 'number' && Number.isFinite(value)) args.set(name, value);
    else if (typeof value === 'string' && value.trim() !== '') args.set(name, value.trim());
    else throw new InputError('compare-syntax', `the argument ${name} of '${id}' must be a number or the name of a constant or column`, where);
  }
  return { correlation, args };
}

function syntax(where: SourceSpan): InputError {
  return new InputError(
    'compare-syntax',
    'a compare entry is a correlation id (blasius) or an id with its arguments ({colebrook: {roughness: 0.0015}})',
    where,
  );
}
