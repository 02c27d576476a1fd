import { InputError, type SourceSpan, type WarningSink } from '../common/errors.js';
import type { RigHead, Study } from '../data/index.js';
import type { Dimension, Unit } from '../units/index.js';
import { REDUCE_ERROR } from './kinds.js';
import { reduceMessages } from './messages.js';

/**
 * What each name means for one file. Resolution order: columns, file constants, study
 * constants, derived quantities, groups. A file constant overrides a study constant of the same
 * name, and a column overrides a study constant (both reported as 'constant-overridden'); a
 * derived quantity or group named like a column or constant is refused.
 */

export type NameKind = 'column' | 'file-constant' | 'study-constant' | 'derived' | 'group';

export interface NameInfo {
  readonly name: string;
  readonly kind: NameKind;
  /** Known for data names; filled in order for derived quantities and groups by the plan. */
  readonly dimension: Dimension | null;
  /** SI value of a constant. */
  readonly valueSI?: number;
  /** 'dp [kPa]', 'D = 0.5 in' for messages. */
  readonly label: string;
  /** The unit a column was logged in or a constant written in (data names only): says whether a temperature is absolute or a difference. */
  readonly unit?: Unit;
  readonly where: SourceSpan;
}

/**
 * The data names of a file and a study (columns and constants), and the checks on the names
 * the study defines.
 * @throws {InputError} 'reduce-name-clash' for a derived quantity or group named like a column
 *   or constant of the file.
 * @example dataNames(study, head, sink).get('dp')?.kind // => 'column'
 */
export function dataNames(study: Study, head: RigHead, sink: WarningSink): Map<string, NameInfo> {
  const names = new Map<string, NameInfo>();
  for (const c of head.columns) {
    const label = c.hasUnit ? `${c.name} [${c.unit.text}]` : c.name;
    names.set(c.name, { name: c.name, kind: 'column', dimension: c.unit.dimension, label, where: c.where, unit: c.unit });
  }
  for (const k of head.constants) {
    names.set(k.name, { name: k.name, kind: 'file-constant', dimension: k.unit.dimension, valueSI: k.valueSI, label: `${k.name} = ${k.text}`, where: k.where, unit: k.unit });
  }
  for (const k of study.constants) {
    const existing = names.get(k.name);
    const studyWhere = k.where.line === undefined ? ` (${k.where.file ?? 'study'})` : ` (${k.where.file} line ${k.where.line})`;
    if (existing?.kind === 'column') {
      sink.warn({ code: 'constant-overridden', message: reduceMessages.columnOverrides(k.name, k.text, studyWhere), where: existing.where });
      continue;
    }
    if (existing?.kind === 'file-constant') {
      // Reported only when the values differ (998.21 kg/m^3 in both places is no news).
      if (!sameValue(existing.valueSI!, k.valueSI)) {
        const fileValue = existing.label.slice(k.name.length + 3);
        sink.warn({ code: 'constant-overridden', message: reduceMessages.fileConstantOverrides(k.name, fileValue, k.text, studyWhere), where: existing.where });
      }
      continue;
    }
    names.set(k.name, { name: k.name, kind: 'study-constant', dimension: k.unit.dimension, valueSI: k.valueSI, label: `${k.name} = ${k.text}`, where: k.where, unit: k.unit });
  }
  for (const [role, items] of [['derived quantity', study.derived], ['group', study.groups]] as const) {
    for (const item of items) {
      const existing = names.get(item.name);
      if (existing !== undefined) {
        const what = existing.kind === 'column' ? `a column (header line ${existing.where.line ?? '?'})` : `a constant (${existing.label})`;
        throw new InputError(REDUCE_ERROR.nameClash, reduceMessages.nameClash(item.name, role, head.file, what), item.nameWhere);
      }
    }
  }
  return names;
}

/** Equal to the last few bits (the same value written in two units: 0.0010016 Pa*s and 1.0016 mPa*s). */
function sameValue(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b));
}
