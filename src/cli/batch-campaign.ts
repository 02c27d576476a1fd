import { WarningList, type Warning } from '../common/errors.js';
import type { Study } from '../data/index.js';
import { adjustHeld, fileAgreement, PREDICT_WARNING, predictMessages, userIntervals, type Agreement, type UserInterval } from '../predict/index.js';
import type { FileFailure, FileResult } from './batch-job.js';
import type { PooledSummary } from './batch-pooled.js';
import { runStamp, type RunStamp } from './run-stamp.js';

/**
 * The campaign as a whole, in the main thread: each file's own fit compared with the pooled one
 * (src/predict/agreement.ts states the test), and the index model (every number the index page
 * and index.json show).
 */

export interface IndexParameter {
  readonly name: string;
  readonly estimate: number;
  readonly low: number;
  readonly high: number;
}

export interface IndexFile {
  readonly label: string;
  /** 'files/NAME.html', or null when the file's report was not written. */
  readonly link: string | null;
  /** The input file that failed (`file`) and where the fault is (`where`: in it, or in the study). */
  readonly failure: (FileFailure & { readonly file: string }) | null;
  /** Whether its rows are in the pooled fit. */
  readonly pooled: boolean;
  readonly rowsRead: number;
  readonly rowsUsed: number;
  readonly rowsExcluded: number;
  /** The rows left out, by reason, with their lines (at most 20 lines per reason). */
  readonly exclusions: readonly { readonly cause: string; readonly reason: string; readonly lines: readonly number[]; readonly count: number }[];
  /** Estimates and intervals; a held exponent is absent, a coefficient is at the pooled exponents. */
  readonly parameters: readonly IndexParameter[];
  readonly held: readonly { readonly param: string; readonly group: string; readonly groupValue: number; readonly fixedAt: number }[];
  readonly comparisons: readonly { readonly id: string; readonly meanDeviation: number; readonly rmsDeviation: number }[];
  readonly warnings: readonly { readonly code: string; readonly message: string }[];
  readonly agreement: Agreement | null;
}

export interface CampaignIndex {
  readonly title: string;
  readonly response: string;
  readonly model: string;
  readonly level: number;
  readonly parameters: readonly string[];
  readonly logCoefficient: string | null;
  readonly compareIds: readonly string[];
  readonly pooled: {
    readonly link: string | null;
    readonly failure: string | null;
    readonly n: number;
    readonly files: number;
    readonly fitted: string;
    readonly parameters: readonly IndexParameter[];
    readonly rmsRelative: number | null;
    readonly comparisons: readonly { readonly id: string; readonly meanDeviation: number; readonly rmsDeviation: number }[];
    readonly warnings: readonly { readonly code: string; readonly message: string }[];
  };
  readonly files: readonly IndexFile[];
  readonly counts: { readonly files: number; readonly fitted: number; readonly failed: number; readonly disagree: number; readonly rowsRead: number; readonly rowsUsed: number };
  readonly agreementTest: string;
  readonly provenance: RunStamp & { readonly study: string | null };
  readonly cautions: readonly string[];
}

/** The cautions of a campaign page (DESIGN.md, "Cautions"). */
export const CAMPAIGN_CAUTIONS: readonly string[] = [
  'A fitted correlation holds only inside the range of the data it came from (each report gives that range). Outside it, it is an extrapolation, however good the fit looks.',
  'Sizing of piping, pressure equipment or anything whose failure can hurt someone follows the applicable codes and standards and a qualified engineer\u2019s judgement, not these reports alone.',
  'The intervals are statistical: they assume the model form is right and the residuals independent. They do not include systematic errors of the rig.',
];

/** The statement of the file-disagrees test, as the index prints it. */
export const AGREEMENT_TEST =
  'Each file is fitted on its own. The pooled parameters are then put to the file\u2019s own data: with S the file\u2019s weighted residual sum of squares ' +
  '(of ln y for a correlation fitted on logarithms), F = [(S at the pooled parameters - S at its own) / k] / [S at its own / its residual degrees of freedom], ' +
  'k the number of parameters the file determines, is compared with the F distribution: a file with p < 1 - level is flagged file-disagrees, ' +
  'which means the pooled parameters lie outside the file\u2019s joint confidence region (Beale 1960; Bates & Watts 1988, section 2.6; ' +
  'the extra-sum-of-squares test of Draper & Smith 1998, exact for a model linear in its parameters). The pooled estimate is taken as exact; ' +
  'its uncertainty is much smaller than a single file\u2019s. At a 95 % level about one file in twenty that agrees is flagged by chance. ' +
  'An exponent of a group that is constant within a file (L/D of one tube) cannot be fitted from that file: it is held there at its start value, the file\u2019s ' +
  'coefficient absorbs it, and the table and plots show that coefficient moved to the pooled exponent.';

/** The index model of a campaign; `sink` receives one 'file-disagrees' warning per flagged file. */
export function campaignIndex(
  study: Study,
  results: readonly FileResult[],
  pooled: PooledSummary,
  meta: { argv: readonly string[]; studyLabel: string | null },
  sink: WarningList,
): CampaignIndex {
  const fit = pooled.fit;
  const level = fit?.level ?? 0.95;
  const pooledIntervals = fit === null ? [] : intervalsOf(userIntervals(fit.fitSpace, fit.dof, level));
  const pooledNames = new Set(pooled.pooledLabels);
  const files = results.map((r): IndexFile => {
    let parameters: IndexParameter[] = [];
    let agreement: Agreement | null = null;
    if (r.fit !== null) {
      const adjusted = fit === null ? r.fit.fitSpace : adjustHeld(r.fit.fitSpace, r.fit.held, fit.fitSpace, r.fit.coefficient);
      parameters = intervalsOf(userIntervals(adjusted, r.fit.dof, r.fit.level));
      const rssPooled = pooled.rssByFile[r.label];
      if (fit !== null && rssPooled !== undefined) {
        agreement = fileAgreement({ parameters: r.fit.fitSpace.parameters, rss: r.fit.rss, dof: r.fit.dof }, rssPooled, level);
      }
      if (agreement?.disagrees === true) {
        const params = agreement.compared.join(', ');
        sink.warn({ code: PREDICT_WARNING.fileDisagrees, message: predictMessages.fileDisagrees(r.label, params, agreement.statistic.toPrecision(3), agreement.pValue.toPrecision(2)), where: { file: r.label } });
      }
    }
    return {
      label: r.label,
      link: r.written.length > 0 ? `files/${r.outName}.html` : null,
      failure: r.failure === null ? null : { ...r.failure, file: r.label },
      pooled: pooledNames.has(r.label) && fit !== null,
      rowsRead: r.rowsRead,
      rowsUsed: r.rowsKept,
      rowsExcluded: r.excluded.length,
      exclusions: byReason(r.excluded),
      parameters,
      held: (r.fit?.held ?? []).map((h) => ({ param: h.param, group: h.group, groupValue: h.groupValue, fixedAt: h.fixedAt })),
      comparisons: r.fit?.comparisons.map((c) => ({ id: c.id, meanDeviation: c.meanDeviation, rmsDeviation: c.rmsDeviation })) ?? [],
      warnings: r.warnings.map(plain),
      agreement,
    };
  });
  const failed = files.filter((f) => f.failure !== null).length;
  return {
    title: study.title ?? `${fit?.response ?? 'campaign'}`,
    response: fit?.response ?? study.fit?.response?.value ?? '',
    model: fit?.model ?? study.fit?.model?.formula.text ?? '',
    level,
    parameters: fit?.fitSpace.parameters ?? study.fit?.parameters.map((p) => p.name) ?? [],
    logCoefficient: fit?.fitSpace.logCoefficient ?? null,
    compareIds: fit?.comparisons.map((c) => c.id) ?? [],
    pooled: {
      link: pooled.written.length > 0 ? 'pooled.html' : null,
      failure: pooled.failure,
      n: fit?.n ?? 0,
      files: pooled.pooledLabels.length,
      fitted: fit?.fitted ?? '',
      parameters: pooledIntervals,
      rmsRelative: fit?.rmsRelative ?? null,
      comparisons: fit?.comparisons ?? [],
      warnings: pooled.warnings.map(plain),
    },
    files,
    counts: {
      files: files.length,
      fitted: files.filter((f) => f.failure === null).length,
      failed,
      disagree: files.filter((f) => f.agreement?.disagrees === true).length,
      rowsRead: files.reduce((s, f) => s + f.rowsRead, 0),
      rowsUsed: files.reduce((s, f) => s + f.rowsUsed, 0),
    },
    agreementTest: AGREEMENT_TEST,
    provenance: { ...runStamp(meta.argv), study: meta.studyLabel },
    cautions: CAMPAIGN_CAUTIONS,
  };
}

/** Excluded rows grouped by reason, in order of first appearance. */
function byReason(rows: FileResult['excluded']): IndexFile['exclusions'] {
  const groups = new Map<string, { cause: string; reason: string; lines: number[]; count: number }>();
  for (const r of rows) {
    const g = groups.get(r.reason) ?? { cause: r.cause, reason: r.reason, lines: [], count: 0 };
    if (g.lines.length < 20) g.lines.push(r.line);
    g.count++;
    groups.set(r.reason, g);
  }
  return [...groups.values()];
}

function intervalsOf(list: readonly UserInterval[]): IndexParameter[] {
  return list.map((u) => ({ name: u.name, estimate: u.estimate, low: u.low, high: u.high }));
}

function plain(w: Warning): { code: string; message: string } {
  return { code: w.code, message: w.message };
}
