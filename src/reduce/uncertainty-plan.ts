import { InputError, type SourceSpan, type WarningSink } from '../common/errors.js';
import { placeInside, type RigHead, type Study, type UncertaintySpec } from '../data/index.js';
import { namesIn, type Formula, type FunctionTable } from '../expr/index.js';
import { compileFirstOrder, expandDerived, MONTE_CARLO_MIN_SAMPLES, type FirstOrderPropagator } from '../uncertainty/index.js';
import { REDUCE_ERROR } from './kinds.js';
import { reduceMessages } from './messages.js';
import type { NameInfo } from './names.js';

/**
 * Which uncertainties apply to one file and how each output carries them, fixed before any row
 * is read. Sources: the study's `uncertainty:` section, then the file's `# u(name) = ...` lines
 * (a file line overrides the study for the same name: the instrument on that rig is the one
 * that logged it; reported as 'uncertainty-overridden' when the two differ). Each output
 * (derived quantity or group) is rewritten in raw inputs by expandDerived, so that an input
 * used twice (D directly and inside U) is counted once with both paths, and compiled with its
 * sensitivity coefficients (GUM, JCGM 100:2008, 5.1.2-5.1.3, exact derivatives). Inputs without
 * a stated uncertainty are taken as exact.
 */

/** A stated standard uncertainty of a column or constant, and where it came from. */
export interface StatedUncertainty {
  readonly name: string;
  readonly spec: UncertaintySpec;
  readonly origin: 'file' | 'study';
}

/** How one output carries the stated uncertainties. */
export interface OutputPropagation {
  readonly output: string;
  /** The output's formula in raw inputs (derived quantities substituted). */
  readonly expanded: Formula;
  /** Its inputs with a stated uncertainty, in formula order; empty: u = 0 (all its inputs are exact). */
  readonly uncertainInputs: readonly string[];
  /** Columns and constants the expanded formula uses. */
  readonly columns: readonly string[];
  readonly constants: readonly string[];
  /** The compiled formula and sensitivities; null when no input is uncertain. */
  readonly propagator: FirstOrderPropagator | null;
}

/** A Monte Carlo check of the first-order result (JCGM 101:2008), seeded. */
export interface MonteCarloRequest {
  /** Draws per row, at least 100. */
  readonly samples: number;
  /** Seed of the random stream (default 1): the same seed gives the same draws. */
  readonly seed?: number;
}

export interface UncertaintyPlan {
  /** The stated uncertainties that apply to this file, by name (file lines win over the study). */
  readonly stated: readonly StatedUncertainty[];
  /** One per output of the plan, same order. */
  readonly outputs: readonly OutputPropagation[];
  readonly monteCarlo: MonteCarloRequest | null;
}

/** The parts of the plan the uncertainty plan needs. */
export interface PlannedOutput {
  readonly name: string;
  readonly definition: { readonly formula: Formula; readonly where: SourceSpan };
}

/**
 * The uncertainty plan of one file, or null when neither the study nor the file states any
 * uncertainty.
 * @throws {InputError} 'reduce-monte-carlo' for fewer than 100 samples or a non-integer count;
 *   'reduce-name-clash' for an output named like the uncertainty column of another (u_Re beside
 *   Re); formula kinds from differentiation ('formula-not-differentiable'), placed at the output.
 * @example planUncertainty(study, head, steps, outputs, names, PROPERTY_FUNCTIONS, null, sink)?.outputs[0].uncertainInputs // => ['Q', 'D']
 */
export function planUncertainty(
  study: Study,
  head: RigHead,
  steps: readonly PlannedOutput[],
  outputNames: readonly string[],
  names: ReadonlyMap<string, NameInfo>,
  functions: FunctionTable,
  monteCarlo: MonteCarloRequest | null,
  sink: WarningSink,
): UncertaintyPlan | null {
  if (monteCarlo !== null) checkSamples(monteCarlo, study.file);
  const stated = statedUncertainties(study, head, sink);
  if (stated.size === 0) {
    if (monteCarlo !== null) sink.warn({ code: 'monte-carlo-unused', message: reduceMessages.monteCarloUnused(head.file), where: { file: head.file } });
    return null;
  }
  for (const name of outputNames) {
    if (name.startsWith('u_') && outputNames.includes(name.slice(2))) {
      const step = steps.find((s) => s.name === name)!;
      throw new InputError(REDUCE_ERROR.nameClash, reduceMessages.uncertaintyColumnClash(name, name.slice(2)), step.definition.where);
    }
  }
  const definitions = new Map(steps.map((s) => [s.name, s.definition.formula]));
  const byName = new Map(steps.map((s) => [s.name, s]));
  const outputs = outputNames.map((output) => {
    const step = byName.get(output)!;
    const others = new Map([...definitions].filter(([n]) => n !== output));
    try {
      const expanded = expandDerived(step.definition.formula, others, functions);
      const used = [...namesIn(expanded)];
      const uncertainInputs = used.filter((n) => stated.has(n));
      const columns = used.filter((n) => names.get(n)?.kind === 'column');
      const constants = used.filter((n) => names.get(n)?.kind !== 'column');
      const propagator =
        uncertainInputs.length === 0 ? null : compileFirstOrder(expanded, { vectors: columns, scalars: constants, uncertain: uncertainInputs }, functions);
      return { output, expanded, uncertainInputs, columns, constants, propagator };
    } catch (e) {
      if (e instanceof InputError) throw placeInside(e, step.definition.where, false);
      throw e;
    }
  });
  return { stated: [...stated.values()], outputs, monteCarlo };
}

function checkSamples(request: MonteCarloRequest, file: string): void {
  const n = request.samples;
  if (!(Number.isInteger(n) && n >= MONTE_CARLO_MIN_SAMPLES)) {
    throw new InputError(REDUCE_ERROR.monteCarlo, reduceMessages.monteCarloSamples(n, MONTE_CARLO_MIN_SAMPLES), { file });
  }
  if (request.seed !== undefined && !Number.isInteger(request.seed)) {
    throw new InputError(REDUCE_ERROR.monteCarlo, reduceMessages.monteCarloSeed(request.seed), { file });
  }
}

/** The study's uncertainties, then the file's, a file line replacing a study entry of the same name. */
function statedUncertainties(study: Study, head: RigHead, sink: WarningSink): Map<string, StatedUncertainty> {
  const stated = new Map<string, StatedUncertainty>();
  for (const spec of study.uncertainty) stated.set(spec.name, { name: spec.name, spec, origin: 'study' });
  for (const spec of head.uncertainties) {
    const earlier = stated.get(spec.name);
    if (earlier !== undefined && !sameSpec(earlier.spec, spec)) {
      const w = earlier.spec.where;
      const studyWhere = w.line === undefined ? ` (${w.file ?? 'study'})` : ` (${w.file ?? 'study'} line ${w.line})`;
      sink.warn({ code: 'uncertainty-overridden', message: reduceMessages.uncertaintyOverridden(spec.name, spec.text, earlier.spec.text, studyWhere), where: spec.where });
    }
    stated.set(spec.name, { name: spec.name, spec, origin: 'file' });
  }
  return stated;
}

/** The same statement, written alike or in other units (0.02 kPa and 20 Pa). */
function sameSpec(a: UncertaintySpec, b: UncertaintySpec): boolean {
  const close = (x: number | null, y: number | null) => (x === null || y === null ? x === y : Math.abs(x - y) <= 1e-12 * Math.max(Math.abs(x), Math.abs(y)));
  return close(a.relative, b.relative) && close(a.absoluteSI, b.absoluteSI);
}
