/**
 * The words of the prediction stage, in one place: error kinds (InputError.kind), warning codes,
 * and the messages, so that the same situation is always described the same way.
 */

/** Stable error kinds of `similis predict` and the campaign comparison. */
export const PREDICT_ERROR = {
  /** The JSON is not a similis fit report, or lacks the `predict` section. */
  json: 'predict-json',
  /** An --at text that is not NAME=VALUE[,NAME=VALUE...]. */
  at: 'predict-at',
  /** A name in --at that the correlation cannot use, or a group left without a value. */
  name: 'predict-name',
  /** A quantity whose unit does not measure what the data measured. */
  unit: 'predict-unit',
  /** A group or the correlation that has no finite value at the point. */
  notFinite: 'predict-not-finite',
} as const;

/** Stable warning codes. */
export const PREDICT_WARNING = {
  /** The point is outside the range of a group, or far from the data (leverage). */
  extrapolation: 'extrapolation',
  /** A file's parameters disagree with the pooled fit beyond their intervals. */
  fileDisagrees: 'file-disagrees',
} as const;

/** The cautions every prediction carries (DESIGN.md, "Cautions"). */
export const PREDICTION_CAUTIONS: readonly string[] = [
  'A fitted correlation holds only inside the range of the data it came from; outside it the value is an extrapolation, however good the fit looked.',
  'Sizing of piping or pressure equipment follows the applicable codes and a qualified engineer\u2019s judgement, not this prediction alone.',
  'The intervals are statistical: they assume the model form is right and the residuals independent; they do not include systematic errors of the rig.',
];

const list = (names: readonly string[]): string => names.join(', ');

export const predictMessages = {
  notAReport: (what: string) => `this is not a similis fit report with a predict section (${what}); write one with similis fit --out or similis batch`,
  atSyntax: (text: string) => `--at ${text}: expected NAME=VALUE pairs separated by commas, e.g. --at Re=5e4,LD=120 or --at Q="30 L/min",T="40 degC"`,
  atTwice: (name: string) => `--at gives ${name} twice: give each name once`,
  groupHasUnit: (name: string, text: string) => `${name} is a dimensionless group of the correlation; '${text}' has a unit: give the number alone`,
  unknownName: (name: string, groups: readonly string[], inputs: readonly string[]) =>
    `${name} is neither a group of the correlation nor a quantity its groups are computed from: expected one of the groups ${list(groups)}${inputs.length === 0 ? '' : ` or the quantities ${list(inputs)}`}`,
  missingGroups: (missing: readonly string[]) => `no value for ${list(missing)}: give ${missing.length === 1 ? 'it' : 'them'} in --at (a group as a number, or the quantities it is computed from)`,
  missingInputs: (missing: readonly string[], needed: string) => `to compute ${needed} from quantities, also give ${list(missing)} in --at (with units)`,
  constantDiffers: (name: string, values: string) => `${name} differs between the files of the fit (${values}): give it in --at`,
  wrongUnit: (name: string, text: string, given: string, expected: string, siUnit: string) =>
    `${name} = ${text} is ${given}, but the data's ${name} was ${expected} (SI unit ${siUnit}): give ${name} in a unit of that kind`,
  notFinite: (what: string, why: string) => `${what} has no finite value at this point: ${why}`,
  outsideRange: (name: string, value: string, min: string, max: string) => `${name} = ${value} is outside the range of the data (${min} to ${max})`,
  farFromData: (h0: string, hMax: string) =>
    `the point is inside every group's range but far from the data: its leverage ${h0} is above the largest leverage of any point of the fit (${hMax})`,
  extrapolation: (point: string, why: string) => `${point}: ${why}. ${PREDICTION_CAUTIONS[0]} ${PREDICTION_CAUTIONS[1]}`,
  fileDisagrees: (file: string, params: string, statistic: string, p: string) =>
    `the parameters of ${file} (${params}) disagree with the pooled fit beyond their intervals (F = ${statistic}, p = ${p}): look at this file's rig, instruments and conditions`,
};
