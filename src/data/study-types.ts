import type { SourceSpan } from '../common/errors.js';
import type { Formula } from '../expr/index.js';
import type { Unit } from '../units/index.js';
import type { UncertaintySpec } from './table.js';

/**
 * A study file, validated: every formula parsed, every value in SI, every item with the position
 * of its text (file, line, column) so that later stages can place their messages in the file.
 */

/** Where an item was defined: in a study file, or by a command-line flag. */
export type Origin = 'study' | 'command line';

/** A value with the position of its text. */
export interface Located<T> {
  readonly value: T;
  readonly where: SourceSpan;
}

/** `name: formula` under `derived` or `groups`, parsed. */
export interface NamedFormula {
  readonly name: string;
  readonly formula: Formula;
  /** Where the formula text starts (an error at formula column c is at where.column + c - 1). */
  readonly where: SourceSpan;
  /** False when the text does not map one to one onto the file (YAML escapes, folded lines). */
  readonly columnsExact: boolean;
  /** Where the name is. */
  readonly nameWhere: SourceSpan;
  readonly origin: Origin;
}

/** A formula that is not named (fit.model, fit.where, fit.weights). */
export interface LocatedFormula {
  readonly formula: Formula;
  readonly where: SourceSpan;
  /** False when the text does not map one to one onto the file (YAML escapes, folded lines). */
  readonly columnsExact: boolean;
}

/** `name: value unit` under `constants` (or `--const`). */
export interface StudyConstant {
  readonly name: string;
  readonly valueSI: number;
  /** As written ('0.5 in'). */
  readonly text: string;
  readonly unit: Unit;
  readonly where: SourceSpan;
  readonly origin: Origin;
}

/** A fit parameter with its starting value. */
export interface FitParameter {
  readonly name: string;
  readonly start: number;
  readonly where: SourceSpan;
}

export type FitMethod = 'auto' | 'log-linear' | 'nonlinear';

/**
 * How rows are weighted in the fit: not at all, from the propagated uncertainties (1/u^2, in log
 * space (y/u)^2), by constant relative weights in linear space (1/y^2), or by a formula.
 */
export type WeightsSpec =
  | { readonly kind: 'none'; readonly where: SourceSpan }
  | { readonly kind: 'uncertainty'; readonly where: SourceSpan }
  | { readonly kind: 'relative'; readonly where: SourceSpan }
  | { readonly kind: 'formula'; readonly formula: LocatedFormula };

/**
 * A YAML value kept as written, with positions, for sections another stage validates
 * (compare, fit.regimes).
 */
export type RawNode =
  | { readonly kind: 'scalar'; readonly value: string | number | boolean | null; readonly where: SourceSpan }
  | { readonly kind: 'list'; readonly items: readonly RawNode[]; readonly where: SourceSpan }
  | { readonly kind: 'map'; readonly entries: readonly { readonly key: string; readonly keyWhere: SourceSpan; readonly value: RawNode }[]; readonly where: SourceSpan };

/** The `fit` section (the fitting stage uses it; reduce uses `where`). */
export interface FitSpec {
  readonly response: Located<string> | null;
  readonly model: LocatedFormula | null;
  readonly parameters: readonly FitParameter[];
  readonly method: Located<FitMethod>;
  readonly weights: WeightsSpec;
  readonly where: LocatedFormula | null;
  /** Kept as written; the regimes stage validates it. */
  readonly regimes: RawNode | null;
  readonly robust: Located<'huber' | 'bisquare' | 'none'> | null;
  readonly at: SourceSpan;
}

export interface Study {
  /** The study file name as given, or 'command line' for a study made of flags only. */
  readonly file: string;
  readonly title: string | null;
  /** Globs of rig files, relative to the study file's folder. */
  readonly data: readonly Located<string>[];
  readonly constants: readonly StudyConstant[];
  readonly derived: readonly NamedFormula[];
  readonly groups: readonly NamedFormula[];
  readonly fit: FitSpec | null;
  /** Kept as written; the handbook comparison stage validates it. */
  readonly compare: RawNode | null;
  readonly uncertainty: readonly UncertaintySpec[];
}
