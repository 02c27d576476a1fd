import { InputError, relocatingSink, type SourceSpan, type WarningSink } from '../common/errors.js';
import type { Dimension, Unit } from '../units/index.js';
import { describeDimension } from '../units/index.js';
import { dataMessages } from './messages.js';
import { parseQuantityText } from './quantity-text.js';
import type { UncertaintySpec } from './table.js';

/**
 * Standard uncertainties as a technician writes them beside a column or constant:
 * `0.5 %` (relative to the reading), `0.02 kPa` (absolute), `0.5 % + 0.02 kPa` (both; a later
 * stage combines them in quadrature, GUM JCGM 100:2008 eq. 10 for uncorrelated components).
 */

const PERCENT_TERM = /^(\s*)([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*%\s*$/;

/** The parts of `0.5 % + 0.02 kPa` with their offsets in the text (0-based). */
function splitTerms(text: string): { term: string; offset: number }[] {
  const terms: { term: string; offset: number }[] = [];
  let start = 0;
  for (let k = 0; k < text.length; k++) {
    if (text[k] !== '+') continue;
    const before = text.slice(start, k).trimEnd();
    // A '+' right after an exponent mark belongs to the number (1e+3); a leading '+' is a sign.
    if (before.trim() === '' || /\d[eE]$/.test(before)) continue;
    terms.push({ term: text.slice(start, k), offset: start });
    start = k + 1;
  }
  terms.push({ term: text.slice(start), offset: start });
  return terms;
}

/**
 * Reads an uncertainty for `name`. `where` is where `text` starts (its column is the column of
 * the first character of `text`); errors are placed there.
 * @throws {InputError} `kind` ('csv-uncertainty' or 'study-uncertainty') for anything but one
 *   relative and/or one absolute non-negative term; unit errors at the unit's column.
 * @example parseUncertainty('dp', '0.5 % + 0.02 kPa', {}, 'csv-uncertainty') // => relative 0.005, absoluteSI 20
 */
export function parseUncertainty(name: string, text: string, where: SourceSpan, kind: string, sink?: WarningSink): UncertaintySpec {
  let relative: number | null = null;
  let absolute: { si: number; unit: UncertaintySpec['absoluteUnit'] } | null = null;
  const fail = (message: string, offset: number, length: number): never => {
    throw new InputError(kind, message, { ...where, ...columnsAt(where, offset, length) });
  };
  if (text.trim() === '') fail(dataMessages.uncertaintyEmpty(name), 0, 1);
  for (const { term, offset } of splitTerms(text)) {
    const lead = term.length - term.trimStart().length;
    const percent = PERCENT_TERM.exec(term);
    if (percent !== null) {
      const value = Number(percent[2]);
      if (relative !== null) fail(dataMessages.uncertaintyTwice(name, 'relative'), offset + lead, term.trim().length);
      if (!(value >= 0)) fail(dataMessages.uncertaintyNegative(name, term.trim()), offset + lead, term.trim().length);
      relative = value / 100;
      continue;
    }
    if (term.trim() === '' || term.includes('%')) fail(dataMessages.uncertaintyTerm(name, text.trim()), offset + lead, Math.max(1, term.trim().length));
    let q;
    try {
      const termWhere = { ...where, ...(where.column === undefined ? {} : { column: where.column + offset }) };
      q = parseQuantityText(term, kind, sink === undefined ? undefined : relocatingSink(sink, termWhere));
    } catch (e) {
      if (e instanceof InputError) {
        throw e.relocate({ ...where, ...(where.column === undefined ? {} : { column: where.column + offset }) });
      }
      throw e;
    }
    if (absolute !== null) fail(dataMessages.uncertaintyTwice(name, 'absolute'), offset + lead, term.trim().length);
    if (!(q.value >= 0)) fail(dataMessages.uncertaintyNegative(name, term.trim()), offset + lead, term.trim().length);
    // An uncertainty is a difference: scale only, never the offset of degC or degF.
    absolute = { si: q.value * q.unit.factor.value, unit: q.unit };
  }
  return {
    name,
    relative,
    absoluteSI: absolute?.si ?? null,
    absoluteUnit: absolute?.unit ?? null,
    text: text.trim(),
    where,
  };
}

/**
 * Refuses an absolute uncertainty whose unit measures something else than the quantity.
 * @throws {InputError} `kind` naming both dimensions in words.
 * @example checkUncertaintyDimension(spec, PRESSURE, 'csv-uncertainty-dimension') // passes for '0.02 kPa'
 */
export function checkUncertaintyDimension(spec: UncertaintySpec, dimension: Dimension, kind: string): void {
  const unit = spec.absoluteUnit;
  if (unit === null || unit.dimension.equals(dimension)) return;
  const message = dataMessages.uncertaintyDimension(spec.name, describeDimension(dimension), unit.text, describeDimension(unit.dimension));
  throw new InputError(kind, message, spec.where);
}

function columnsAt(where: SourceSpan, offset: number, length: number): SourceSpan {
  if (where.column === undefined) return {};
  return { column: where.column + offset, endColumn: where.column + offset + Math.max(1, length) };
}


/**
 * Refuses a relative part (a percentage) on a quantity read in an affine temperature unit (a bare
 * degC or degF): a percentage of a temperature whose zero is arbitrary depends on the scale, so
 * it cannot be a statement about the instrument (common practice: a percentage presupposes a
 * true zero). K and degR have one and accept a percentage; so do temperature differences
 * (delta_degC).
 * @throws {InputError} `kind`, at the uncertainty's position, saying what to write instead.
 * @example checkRelativeTemperature(parseUncertainty('T', '0.5 %', {}, 'csv-uncertainty'), parseUnit('degC'), 'csv-uncertainty-relative-temperature') // throws
 */
export function checkRelativeTemperature(spec: UncertaintySpec, unit: Unit, kind: string): void {
  if (spec.relative === null || unit.temperature !== 'absolute') return;
  throw new InputError(kind, dataMessages.uncertaintyRelativeTemperature(spec.name, spec.text, unit.text), spec.where);
}
