import { WarningList } from '../../src/common/errors.js';
import { applyStudyFlags, emptyStudy, loadStudy, parseRigText, type StudyFlags, type Study } from '../../src/data/index.js';
import { planReduction, reduceTable, type PlanOptions, type ReducedFile } from '../../src/reduce/index.js';

/** A study from YAML text (file 'study.yaml'), or from flags alone. */
export function studyOf(yaml: string | null, flags: StudyFlags = {}, warnings = new WarningList()): Study {
  const base = yaml === null ? emptyStudy() : loadStudy(yaml, 'study.yaml', warnings);
  return applyStudyFlags(base, flags, warnings);
}

/** Reduces rig texts (file name -> text) with a study, the way the CLI does: plan, then rows (Monte Carlo warnings included). */
export function reduceTexts(files: Record<string, string>, study: Study, options: PlanOptions = {}): { reduced: ReducedFile[]; warnings: WarningList } {
  const warnings = new WarningList();
  const reduced = Object.entries(files).map(([file, text]) => {
    const table = parseRigText(text, { file, sink: warnings });
    const plan = planReduction(study, table.head, options, warnings);
    return reduceTable(table, plan, plan.functions, warnings);
  });
  return { reduced, warnings };
}

/** The values of one output column of a reduced file. */
export function column(r: ReducedFile, name: string): number[] {
  const k = r.outputs.findIndex((o) => o.name === name);
  if (k < 0) throw new Error(`no output ${name}`);
  return Array.from(r.values[k]!);
}

/** The combined standard uncertainties of one output of a reduced file (fails when it has none). */
export function uncertaintyColumn(r: ReducedFile, name: string): number[] {
  const k = r.outputs.findIndex((o) => o.name === name);
  const u = r.uncertainties[k];
  if (k < 0 || u === null || u === undefined) throw new Error(`no uncertainty for ${name}`);
  return Array.from(u);
}
