import { InputError, type WarningSink } from '../common/errors.js';
import { describeDimension } from '../units/index.js';
import { REDUCE_ERROR } from './kinds.js';
import { reduceMessages } from './messages.js';
import type { OutputColumn, ReductionPlan } from './plan.js';
import type { ReducedFile } from './reduce.js';
import { csvCell } from './csv-text.js';

/**
 * The reduced table as text: CSV with `file,line`, then every derived quantity (`U [m s^-1]`)
 * and group, in study order, then (when some uncertainty is stated) the combined standard
 * uncertainty of each, `u_U [m s^-1]`, `u_Re`, in the same order; numbers in full double
 * precision, as the shortest text that reads back to the same double (ECMA-262 Number::toString),
 * so that nothing is lost. The output is itself a rig file: similis can read it again.
 */

/**
 * The output columns shared by every file's plan.
 * @throws {InputError} 'reduce-dimension-differs' when a derived quantity has one dimension in
 *   one file and another in the next (a column logged in units of another kind).
 * @example commonOutputs([planA, planB]).map((o) => o.header) // => ['U [m s^-1]', 'Re']
 */
export function commonOutputs(plans: readonly ReductionPlan[]): readonly OutputColumn[] {
  const first = plans[0];
  if (first === undefined) return [];
  for (const plan of plans.slice(1)) {
    plan.outputs.forEach((o, k) => {
      const a = first.outputs[k]!;
      if (!a.dimension.equals(o.dimension)) {
        const step = plan.steps.find((s) => s.name === o.name)!;
        const message = reduceMessages.dimensionDiffers(o.name, first.file, describeDimension(a.dimension), plan.file, describeDimension(o.dimension));
        throw new InputError(REDUCE_ERROR.dimensionDiffers, message, step.definition.nameWhere);
      }
    });
  }
  return first.outputs;
}

/**
 * The CSV header line; with `uncertainty`, the u_ columns after the values.
 * @example csvHeader(outputs) // => 'file,line,U [m s^-1],Re,f\n'
 * @example csvHeader(outputs, true) // => 'file,line,U [m s^-1],Re,f,u_U [m s^-1],u_Re,u_f\n'
 */
export function csvHeader(outputs: readonly OutputColumn[], uncertainty = false): string {
  const u = uncertainty ? outputs.map((o) => csvCell(`u_${o.header}`)) : [];
  return ['file', 'line', ...outputs.map((o) => csvCell(o.header)), ...u].join(',') + '\n';
}

/**
 * The name of an output's uncertainty column. @example uncertaintyName('Re') // => 'u_Re'
 */
export function uncertaintyName(output: string): string {
  return `u_${output}`;
}

/**
 * The kept rows as objects for JSON: { file, line, U, Re, f }, and with `uncertainty`
 * { ..., u_U, u_Re, u_f } (0 where no input of an output has a stated uncertainty).
 * @example jsonRows(reduced)[0] // => { file: 'loop-a.csv', line: 8, U: 0.0394, Re: 503.2, f: 0.127 }
 */
export function jsonRows(reduced: ReducedFile, uncertainty = false): Record<string, string | number>[] {
  const rows: Record<string, string | number>[] = [];
  for (let i = 0; i < reduced.rowCount; i++) {
    const row: Record<string, string | number> = { file: reduced.file, line: reduced.lines[i]! };
    reduced.outputs.forEach((o, j) => (row[o.name] = reduced.values[j]![i]!));
    if (uncertainty) reduced.outputs.forEach((o, j) => (row[uncertaintyName(o.name)] = reduced.uncertainties[j]?.[i] ?? 0));
    rows.push(row);
  }
  return rows;
}

/**
 * Whether the reduced output gets u_ columns: when the study or some file states an
 * uncertainty. A file that states none while others do is reported ('uncertainty-not-stated'):
 * its u_ columns are 0, which treats its inputs as exact.
 * @example uncertaintyColumns(plans, sink) // => true when a study says uncertainty: { dp: 0.5 % }
 */
export function uncertaintyColumns(plans: readonly ReductionPlan[], sink: WarningSink): boolean {
  const stating = plans.filter((p) => p.uncertainty !== null);
  if (stating.length === 0) return false;
  for (const p of plans) {
    if (p.uncertainty !== null) continue;
    sink.warn({ code: 'uncertainty-not-stated', message: reduceMessages.uncertaintyNotStated(p.file, stating[0]!.file), where: { file: p.file } });
  }
  return true;
}
