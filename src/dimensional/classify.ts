import { InputError } from '../common/errors.js';
import { describeDimension, type Dimension } from '../units/index.js';
import { kindById, kindsOf, KINDS, otherKind, type QuantityKind } from './kinds.js';
import { GROUPS_ERROR, groupsMessages } from './messages.js';

/**
 * Decides the kind of each variable (see kinds.ts for the rules and their order).
 */

/** A variable as the user gives it. */
export interface VariableInput {
  readonly name: string;
  readonly dimension: Dimension;
  /** A kind id given by the user (`--var g=m/s^2:gravity`). */
  readonly kind?: string;
  /** From the unit: degC is 'absolute', delta_degC 'difference'; K, or no unit, 'either'. */
  readonly temperature?: 'absolute' | 'difference' | 'either';
}

/** How a variable's kind was decided. */
export type KindSource = 'hint' | 'unit' | 'name' | 'dimension' | 'default';

export interface ClassifiedVariable {
  readonly name: string;
  readonly dimension: Dimension;
  readonly kind: QuantityKind;
  readonly decidedBy: KindSource;
  /** True when the kind is a guess between distinct quantities of one dimension. */
  readonly assumed: boolean;
}

/**
 * The kind of one variable: the hint if given (checked against the dimension), else the unit's
 * temperature sense, else the first kind whose name pattern matches, else the dimension's
 * default; a dimension no kind has gets the kind 'other'.
 * @throws {InputError} 'groups-kind-unknown' for a hint that names no kind,
 *   'groups-kind-dimension' for a hint whose kind has another dimension.
 * @example classifyVariable({ name: 'g', dimension: L T^-2 }).kind.id // => 'gravity' (by name)
 * @example classifyVariable({ name: 'Vt', dimension: L T^-1 }).kind.id // => 'settling-velocity'
 */
export function classifyVariable(v: VariableInput): ClassifiedVariable {
  const candidates = kindsOf(v.dimension);
  const base = { name: v.name, dimension: v.dimension };
  if (v.kind !== undefined) return { ...base, kind: hintedKind(v, candidates), decidedBy: 'hint', assumed: false };
  if (candidates.length === 0) {
    return { ...base, kind: otherKind(v.dimension, describeDimension(v.dimension)), decidedBy: 'dimension', assumed: false };
  }
  if (candidates.length === 1) return { ...base, kind: candidates[0]!, decidedBy: 'dimension', assumed: false };
  if (v.temperature === 'absolute' || v.temperature === 'difference') {
    const id = v.temperature === 'absolute' ? 'temperature' : 'temperature-difference';
    const byUnit = candidates.find((k) => k.id === id);
    if (byUnit !== undefined) return { ...base, kind: byUnit, decidedBy: 'unit', assumed: false };
  }
  const byName = candidates.find((k) => k.names?.test(v.name) === true);
  if (byName !== undefined) return { ...base, kind: byName, decidedBy: 'name', assumed: false };
  const fallback = candidates.find((k) => k.isDefault === true) ?? candidates[candidates.length - 1]!;
  return { ...base, kind: fallback, decidedBy: 'default', assumed: fallback.guess === true };
}

function hintedKind(v: VariableInput, candidates: readonly QuantityKind[]): QuantityKind {
  const hint = v.kind!.trim().toLowerCase().replace(/[\s_]+/g, '-');
  const kind = kindById(hint);
  if (kind === undefined || kind.id === 'other') {
    const choices = (candidates.length > 0 ? candidates : KINDS).map((k) => k.id);
    throw new InputError(GROUPS_ERROR.kindUnknown, groupsMessages.kindUnknown(v.kind!, choices));
  }
  if (!kind.dimension.equals(v.dimension)) {
    throw new InputError(
      GROUPS_ERROR.kindDimension,
      groupsMessages.kindDimension(v.name, kind.id, kind.dimension.toString(), describeDimension(v.dimension)),
      {},
      { hint: candidates.length > 0 ? `kinds with this dimension: ${candidates.map((k) => k.id).join(', ')}` : undefined },
    );
  }
  return kind;
}
