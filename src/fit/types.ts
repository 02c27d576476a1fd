/**
 * The contract of the fitting engine: what a caller gives (columns, a model formula, start
 * values) and what it gets back (a FitResult: every number a report or a reviewer needs).
 * Everything here is plain data except `FitResult.band` (a function, which JSON.stringify skips)
 * and the per-point arrays (typed arrays; `fitResultToJson` turns them into rows).
 */
import type { FunctionTable, Formula } from '../expr/index.js';
import type { LmOptions } from './lm-types.js';

export type FitMethodRequest = 'auto' | 'log-linear' | 'nonlinear';
export type FitMethod = 'log-linear' | 'nonlinear';
export type RobustMethod = 'huber' | 'bisquare';

/** Where each row came from, for messages and flagged points ("loop-a.csv:14"). */
export interface RowSource {
  /** File names, indexed by fileIndex. */
  readonly file: readonly string[];
  readonly fileIndex: Uint32Array;
  /** 1-based line numbers in those files. */
  readonly line: Uint32Array;
}

export interface FitOptions extends LmOptions {
  /** Extra starting points for nonlinear fits (0: only the given start). Default 0. */
  readonly multiStart?: number;
  /**
   * Power products fitted in linear space: start from the log-space fit (when every value is
   * positive and its design has full rank; else from the given values), or from the given values.
   * Default 'log-fit'. Other models always start from the given values.
   */
  readonly powerLawStart?: 'given' | 'log-fit';
  /** Most robust reweighting passes. Default 50. */
  readonly robustMaxIterations?: number;
  /** Confidence level of the intervals ci95 and of the bands. Default 0.95. */
  readonly level?: number;
}

export interface FitInput {
  /** Number of rows. */
  readonly n: number;
  /** Data columns in SI (groups, and anything else the model uses), each of length n. */
  readonly columns: ReadonlyMap<string, Float64Array>;
  /** Study constants the model may use (one value each). */
  readonly constants?: ReadonlyMap<string, number>;
  readonly rowSource?: RowSource;
  /** Name of the response column. */
  readonly response: string;
  /** The model, e.g. parseFormula('C*Re^a*LD^b'). */
  readonly model: Formula;
  /** Parameters with their start values, in the order the report lists them. */
  readonly parameters: ReadonlyMap<string, number>;
  readonly method: FitMethodRequest;
  /** Row weights (positive, finite). */
  readonly weights?: Float64Array;
  readonly robust?: RobustMethod;
  readonly options?: FitOptions;
  /** Functions the model may call (default: the built-in table). */
  readonly functions?: FunctionTable;
}

export interface FitStatus {
  readonly converged: boolean;
  /** Stable code: 'relative-offset', 'step-size', ... 'direct' (linear solution), 'iteration-limit', ... */
  readonly code: string;
  readonly message: string;
}

export interface ParameterEstimate {
  readonly name: string;
  readonly estimate: number;
  readonly stdError: number;
  /** Confidence interval at `level` (named ci95 as the JSON contract says; level 0.95 by default). */
  readonly ci95: readonly [number, number];
  /** estimate / stdError (for a log-space coefficient: of ln C), null when not meaningful. */
  readonly tValue: number | null;
  /** Two-sided p-value of the parameter being zero, null when not meaningful. */
  readonly pValue: number | null;
  /** 'coefficient' (C of a power law), 'exponent' (of a group), or 'parameter'. */
  readonly role: 'coefficient' | 'exponent' | 'parameter';
  /** For an exponent: the group it raises (text of the base, e.g. 'Re' or 'L/D'). */
  readonly group?: string;
  /** How the interval or the test was obtained when it is not the plain estimate +- t*se. */
  readonly note?: string;
}

export interface DeviationSummary {
  /** Relative deviations (fitted - y)/y in linear space; rows with y = 0 are left out. */
  readonly meanAbsRelative: number;
  readonly maxAbsRelative: number;
  readonly rmsRelative: number;
  /** Share of points (0..1) with |relative deviation| <= 5 %, 10 %, 20 %. */
  readonly within5: number;
  readonly within10: number;
  readonly within20: number;
}

export interface GroupRange {
  readonly name: string;
  readonly min: number;
  readonly max: number;
}

export interface DesignDiagnostics {
  /** 'log' when every group is positive (the groups enter power laws as logarithms), else 'linear'. */
  readonly space: 'log' | 'linear';
  readonly groups: readonly string[];
  /** Variance inflation factor of each group (1: independent of the others). */
  readonly vif: readonly number[];
  /** Correlation matrix of the groups (in `space`). */
  readonly correlation: readonly (readonly number[])[];
  /** Condition number of the centred, equilibrated group matrix. */
  readonly conditionNumber: number;
}

export interface GroupTest {
  readonly parameter: string;
  readonly group: string;
  /** t statistic of the exponent being zero (t^2 is the F statistic of dropping the group). */
  readonly t: number;
  readonly pValue: number;
  readonly dof: number;
  /** 'matters' when p < 1 - level, else 'not shown'. */
  readonly verdict: 'matters' | 'not shown';
}

export interface LackOfFit {
  /** Distinct settings of the groups. */
  readonly distinctSettings: number;
  readonly pureErrorSS: number;
  readonly pureErrorDof: number;
  readonly lackOfFitSS: number;
  readonly lackOfFitDof: number;
  readonly f: number;
  readonly pValue: number;
}

/** Per-row results, as typed arrays (index = row of the input). */
export interface PointDiagnostics {
  readonly y: Float64Array;
  readonly fitted: Float64Array;
  /** y - fitted in the fit space (log space for a log-linear fit). */
  readonly residual: Float64Array;
  /** (fitted - y) / y in linear space. */
  readonly relativeDeviation: Float64Array;
  /** Externally studentized residuals (deleted-residual t). */
  readonly studentized: Float64Array;
  readonly leverage: Float64Array;
  readonly cooksDistance: Float64Array;
  /** Final weight of each row (user weight times robust weight). */
  readonly weight: Float64Array;
  /** Bit set of POINT_FLAG values. */
  readonly flags: Uint8Array;
}

export interface FlaggedPoint {
  readonly row: number;
  /** "file:line" or "row N". */
  readonly label: string;
  readonly reasons: readonly string[];
}

export interface RobustSummary {
  readonly method: RobustMethod;
  /** Tuning constant (Huber 1.345, bisquare 4.685: 95 % efficiency at the normal). */
  readonly tuning: number;
  /** Robust scale (normalised MAD of the residuals). */
  readonly scale: number;
  readonly iterations: number;
  readonly converged: boolean;
  /** How many rows got a robust weight below 1. */
  readonly downWeightedCount: number;
  /** The rows with the lowest robust weights (up to 100), lowest first. */
  readonly downWeighted: readonly { readonly row: number; readonly label: string; readonly weight: number }[];
}

export interface MultiStartSummary {
  readonly starts: number;
  /** Starts that ended within 1e-8 (relative) of the lowest sum of squares. */
  readonly reachedBest: number;
  /** Index of the start the result comes from (0: the given start). */
  readonly bestStart: number;
}

/** Confidence and prediction bands at new points (delta method), at the fit's level. */
export interface BandValues {
  readonly fitted: Float64Array;
  readonly confidenceLow: Float64Array;
  readonly confidenceHigh: Float64Array;
  readonly predictionLow: Float64Array;
  readonly predictionHigh: Float64Array;
}

export type BandFunction = (columns: ReadonlyMap<string, Float64Array>, n: number) => BandValues;

export interface FitResult {
  readonly model: string;
  readonly response: string;
  readonly method: FitMethod;
  /** Why this method was used (stated in the report). */
  readonly methodReason: string;
  readonly status: FitStatus;
  readonly iterations: number;
  readonly evaluations: number;
  readonly level: number;
  readonly parameters: readonly ParameterEstimate[];
  readonly n: number;
  readonly dof: number;
  /** Weighted residual sum of squares in the fit space. */
  readonly rss: number;
  readonly residualStdDev: number;
  readonly rmsResidual: number;
  readonly r2: number;
  readonly adjustedR2: number;
  /** The space of residuals, rss and r2: 'log' (ln y) or 'linear' (y). */
  readonly space: 'log' | 'linear';
  readonly deviation: DeviationSummary;
  /** Gaussian log-likelihood of y (a log-space fit includes the Jacobian -sum ln y, so both methods compare). */
  readonly logLikelihood: number;
  readonly aic: number;
  readonly bic: number;
  readonly covariance: readonly (readonly number[])[];
  readonly correlation: readonly (readonly number[])[];
  /** Condition number of the equilibrated Jacobian (design) at the solution. */
  readonly conditionNumber: number;
  readonly design: DesignDiagnostics | null;
  readonly groupTests: readonly GroupTest[];
  readonly ranges: readonly GroupRange[];
  readonly points: PointDiagnostics;
  readonly flagged: readonly FlaggedPoint[];
  readonly lackOfFit: LackOfFit | null;
  readonly robust: RobustSummary | null;
  readonly multiStart: MultiStartSummary | null;
  /** Bands at new points (a function: not part of the JSON). */
  readonly band: BandFunction;
}
