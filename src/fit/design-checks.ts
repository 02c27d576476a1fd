/**
 * Runs the design diagnostics (design.ts) on the groups a fit used and turns the findings into
 * warnings: a group that never varies, and groups that change together so that their exponents
 * cannot be told apart well.
 */
import type { WarningSink } from '../common/errors.js';
import type { DesignFindings } from './design.js';
import { columnScale, designDiagnostics, designFromFactor } from './design.js';
import type { Solved } from './fit-correlation.js';
import { FIT_WARNING, msg } from './messages.js';
import type { DesignDiagnostics } from './types.js';
import { allPositive } from './vector.js';

/**
 * Design diagnostics of the groups a fit used, with warnings 'group-constant' and 'groups-collinear'.
 * @example designChecks([{ name: 'Re', values: re }], solved, sink)!.vif // => [1]
 */
export function designChecks(groups: readonly { name: string; values: Float64Array }[], solved: Solved, sink: WarningSink): DesignDiagnostics | null {
  if (groups.length === 0) return null;
  const n = solved.solution.n;
  const positive = groups.every((g) => allPositive(g.values));
  const space = positive ? 'log' : 'linear';
  const findings = findingsFor(groups, solved, space, n);
  const pp = solved.powerProduct;
  const paramOf = (k: number) => pp?.powers[k]?.param ?? groups[k]!.name;
  for (const k of findings.constant) {
    if (pp === undefined) sink.warn({ code: FIT_WARNING.groupConstant, message: msg.constantGroup(groups[k]!.name, groups[k]!.values[0]!) });
  }
  const seen = new Set<string>();
  for (const c of findings.collinear) {
    if (c.partner < 0) continue;
    const key = [Math.min(c.group, c.partner), Math.max(c.group, c.partner)].join(',');
    if (seen.has(key)) continue;
    seen.add(key);
    const [a, b] = [Math.min(c.group, c.partner), Math.max(c.group, c.partner)];
    const vif = Math.max(findings.diagnostics.vif[a]!, findings.diagnostics.vif[b]!);
    sink.warn({
      code: FIT_WARNING.groupsCollinear,
      message: msg.collinear(groups[a]!.name, groups[b]!.name, paramOf(a), paramOf(b), c.r, vif, space),
    });
  }
  return findings.diagnostics;
}

/**
 * Findings in `space`, reusing a factor of the plain log design when the fit made one: the
 * log-space fit's own, or the log-space start's of a power law fitted in linear space.
 */
function findingsFor(groups: readonly { name: string; values: Float64Array }[], solved: Solved, space: 'log' | 'linear', n: number): DesignFindings {
  const names = groups.map((g) => g.name);
  const d = solved.logDesign;
  const sol = solved.solution;
  const signs = solved.powerProduct?.powers.map((f) => f.sign);
  const fromStart = solved.logDesignFactor;
  if (fromStart !== undefined && signs !== undefined && space === 'log') {
    return unsign(designFromFactor(fromStart.factor, groups.length, names, 'log', n, fromStart.columnScales), signs);
  }
  if (d !== undefined && signs !== undefined && space === 'log') {
    const offset = d.hasCoefficient ? 1 : 0;
    const columns = groups.map((_, k) => d.x.subarray((k + offset) * n, (k + offset + 1) * n));
    const plain = d.hasCoefficient && sol.sqrtWeights === undefined && sol.factor !== undefined;
    const findings = plain
      ? designFromFactor(sol.factor!, groups.length, names, 'log', n, Float64Array.from(columns, columnScale))
      : designDiagnostics(columns.map((values, k) => ({ name: names[k]!, values })), n, 'log');
    return unsign(findings, signs);
  }
  return designDiagnostics(groups, n, space, space === 'log');
}

/** The log design holds s_k ln x_k: undo the signs in the correlations. */
function unsign(f: DesignFindings, signs: readonly number[]): DesignFindings {
  const correlation = f.diagnostics.correlation.map((row, i) => row.map((r, j) => (i === j ? r : r * signs[i]! * signs[j]!)));
  const collinear = f.collinear.map((c) => ({ ...c, r: c.partner < 0 ? c.r : c.r * signs[c.group]! * signs[c.partner]! }));
  return { ...f, diagnostics: { ...f.diagnostics, correlation }, collinear };
}
