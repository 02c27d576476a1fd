/**
 * The report model: every number and string the HTML page shows, and nothing else. The page is a
 * pure function of this model (page.ts), so tests check the model as JSON and the page for
 * structure. `buildReportModel` (build-model.ts) fills it from a fit result.
 */

/** One data point as the report shows it. */
export interface ReportPoint {
  /** Where the row came from: 'loop-a.csv:17'. */
  readonly source: string;
  readonly measured: number;
  readonly fitted: number;
  /** (measured - fitted) / fitted. */
  readonly relDeviation: number;
  /** Externally studentized residual, or null when it could not be computed. */
  readonly studentized: number | null;
  readonly leverage: number | null;
  readonly cooksDistance: number | null;
  /** 'outlier', 'high-leverage', 'influential', 'down-weighted', ... */
  readonly flags: readonly string[];
  /** The value of every group at this point. */
  readonly groups: Readonly<Record<string, number>>;
  /** Standard uncertainty of the measured response, when known. */
  readonly uncertainty?: number;
}

/** A group (predictor) of the correlation and its range in the data: the correlation's domain. */
export interface ReportGroup {
  readonly name: string;
  readonly min: number;
  readonly max: number;
  readonly median: number;
  /** Number of distinct values (a group with few values gets one fitted curve per value). */
  readonly distinct: number;
}

/** A curve drawn on the main plot: the fit at one setting of the other groups, or a handbook form. */
export interface ReportCurve {
  readonly label: string;
  readonly kind: 'fit' | 'handbook';
  readonly x: readonly number[];
  readonly y: readonly number[];
  /** 95 % confidence band of the mean (fit curves only). */
  readonly lower?: readonly number[];
  readonly upper?: readonly number[];
}

export interface ReportParameter {
  readonly name: string;
  readonly estimate: number;
  readonly stdError: number | null;
  readonly ci95: readonly [number, number] | null;
  readonly pValue: number | null;
  readonly note?: string;
}

export interface ReportComparison {
  readonly id: string;
  readonly label: string;
  readonly source: string;
  readonly meanDeviation: number;
  readonly meanAbsDeviation: number;
  readonly rmsDeviation: number;
  readonly maxAbsDeviation: number;
  readonly within10: number;
  readonly outOfRange: number;
  readonly note?: string;
}

export interface ReportFile {
  readonly name: string;
  readonly sha256: string;
  readonly rows: number;
  readonly used: number;
}

export interface ReportModel {
  readonly title: string;
  /** One line a reviewer reads first. */
  readonly verdict: { readonly level: 'sound' | 'caution' | 'doubtful'; readonly text: string };
  readonly response: string;
  /** The group plotted on the horizontal axis of the main plot. */
  readonly mainGroup: string;
  readonly groups: readonly ReportGroup[];
  readonly correlation: {
    /** The model as the study wrote it: 'C*Re^a*LD^b'. */
    readonly model: string;
    /** The model with the estimates put in, for reading: 'f = 0.3164 Re^-0.2501 LD^0.0012'. */
    readonly fitted: string;
    readonly method: string;
    readonly methodNote: string;
  };
  readonly parameters: readonly ReportParameter[];
  readonly parameterCorrelation: { readonly names: readonly string[]; readonly values: readonly (readonly number[])[] };
  readonly goodness: readonly { readonly label: string; readonly value: string; readonly note?: string }[];
  readonly curves: readonly ReportCurve[];
  readonly points: readonly ReportPoint[];
  /** Normal quantile plot of the residuals: theoretical normal quantile and sample value, in order. */
  readonly normalQuantiles: readonly { readonly theoretical: number; readonly sample: number; readonly source: string }[];
  readonly excluded: readonly { readonly source: string; readonly reason: string }[];
  readonly warnings: readonly { readonly code: string; readonly message: string }[];
  readonly comparisons: readonly ReportComparison[];
  /** Half-width of the parity plot's band, as a fraction (0.1 draws +/-10 % lines). */
  readonly parityBand: number;
  readonly provenance: {
    readonly files: readonly ReportFile[];
    readonly study: { readonly name: string; readonly text: string } | null;
    readonly tool: string;
    readonly date: string;
    readonly platform: string;
    readonly command: string;
  };
  readonly cautions: readonly string[];
}

/** The cautions every fit report carries (DESIGN.md, "Cautions"). */
export const STANDARD_CAUTIONS: readonly string[] = [
  'A fitted correlation holds only inside the range of the data it came from (see "Where it holds"). ' +
    'Outside that range it is an extrapolation, however good the fit looks.',
  'Sizing of piping, pressure equipment or anything whose failure can hurt someone follows the applicable ' +
    'codes and standards and a qualified engineer\u2019s judgement, not this report alone.',
  'The intervals are statistical: they assume the model form is right and the residuals are independent. ' +
    'They do not include systematic errors of the rig.',
];
