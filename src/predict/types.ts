/**
 * The contract between a fit and a later prediction: what a fit report's JSON keeps (its
 * `predict` section) so that the correlation can be used at a new design point with honest
 * intervals, and what a prediction gives back. Plain data only (it is read back from JSON).
 */

/** The estimates in the space the fit was made in, with their covariance. */
export interface FitSpace {
  /** 'log': the fit was made on ln y (a power product); 'linear': on y. */
  readonly space: 'log' | 'linear';
  /** The parameters in the report's order ('C', 'a', 'b'). */
  readonly parameters: readonly string[];
  /**
   * The fit-space name of each parameter: 'ln C' for the coefficient of a log-space fit (its
   * estimate and covariance are those of ln C), else the parameter's own name.
   */
  readonly names: readonly string[];
  /** Estimates in fit space (ln C, a, b). */
  readonly theta: readonly number[];
  /** Covariance of theta, rows in `names` order: s^2 (J^T W J)^-1. */
  readonly covariance: readonly (readonly number[])[];
  /** The parameter fitted as its logarithm, or null. */
  readonly logCoefficient: string | null;
}

/** A derived quantity or group as the study computes it. */
export interface RecipeStep {
  readonly name: string;
  readonly role: 'derived' | 'group';
  readonly formula: string;
  /** Its coherent SI unit ('m s^-1'; '1' for a group), when known. */
  readonly siUnit?: string;
}

/** A measured quantity the groups are computed from (a column or a file constant). */
export interface RecipeInput {
  readonly name: string;
  readonly kind: 'column' | 'file-constant';
  /** The coherent SI unit of what the data measured ('m^3 s^-1', 'K', '1'). */
  readonly siUnit: string;
  /** A file constant's value (SI) in each file of the fit. */
  readonly values?: readonly { readonly file: string; readonly valueSI: number }[];
}

/**
 * How the fit weighted its points, so that a new measurement gets its own weight w0: the
 * prediction interval is m +- t sqrt(g^T C g + s^2/w0), and the leverage w0 g^T C g / s^2.
 * 'formula': the study's weights formula, evaluated at the point (with the response at its
 * predicted value); 'relative': 1/y^2; 'uncertainty' (weights from propagated uncertainties, unknown
 * for a measurement not yet made): the median weight of the fit's points.
 */
export interface RecipeWeights {
  readonly kind: 'none' | 'formula' | 'relative' | 'uncertainty';
  readonly formula?: string;
  /** Median weight of the fitted points (user weights; robust weights are not in it). */
  readonly medianWeight: number;
}

/** Everything `similis predict` needs, as the fit report's JSON keeps it. */
export interface PredictionRecipe {
  readonly response: string;
  /** The model as fitted (a per-file fit holds some exponents at fixed values). */
  readonly model: string;
  readonly fit: FitSpace;
  /** s^2, the residual variance in fit space (of ln y for a log-space fit). */
  readonly residualVariance: number;
  readonly dof: number;
  /** Confidence level of the intervals (0.95). */
  readonly level: number;
  readonly n: number;
  /** Largest leverage h_i of any point of the fit. */
  readonly maxLeverage: number;
  /** How the points were weighted (absent in reports of unweighted fits written before weights existed). */
  readonly weights?: RecipeWeights;
  /** The data names the model uses, besides parameters and constants. */
  readonly predictors: readonly string[];
  /** Range of each predictor (or power-law base, as a formula) in the fitted data. */
  readonly ranges: readonly { readonly name: string; readonly min: number; readonly max: number }[];
  /** Study constants (SI) the formulas may use. */
  readonly constants: readonly { readonly name: string; readonly valueSI: number }[];
  /** Derived quantities and groups in evaluation order. */
  readonly steps: readonly RecipeStep[];
  readonly inputs: readonly RecipeInput[];
  readonly cautions: readonly string[];
}

/** Why a point is an extrapolation. */
export type ExtrapolationReason =
  | { readonly kind: 'outside-range'; readonly name: string; readonly value: number; readonly min: number; readonly max: number }
  | { readonly kind: 'far-from-data'; readonly leverage: number; readonly maxLeverage: number };

/** The correlation at one design point. */
export interface Prediction {
  /** The group values used (given or computed). */
  readonly groups: ReadonlyMap<string, number>;
  readonly value: number;
  /** Interval for the mean response at this point, at `level`. */
  readonly confidence: readonly [number, number];
  /** Interval for one new measurement at this point (weight 1), at `level`. */
  readonly prediction: readonly [number, number];
  /** Standard error of the fitted value in fit space (of ln y for a log-space fit). */
  readonly stdErrorFitSpace: number;
  /** h0 = w0 g^T (J^T W J)^-1 g = w0 g^T C g / s^2. */
  readonly leverage: number;
  /** The weight w0 of a new measurement at this point (1 for an unweighted fit). */
  readonly weight: number;
  /** How w0 was found, when the fit was weighted. */
  readonly weightNote: string | null;
  readonly tCritical: number;
  readonly level: number;
  readonly space: 'log' | 'linear';
  readonly extrapolation: readonly ExtrapolationReason[];
}
