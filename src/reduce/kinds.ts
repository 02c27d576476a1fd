/** The stable error kinds of the reduce stage (InputError.kind); wording in messages.ts. */
export const REDUCE_ERROR = {
  /** A derived quantity or group named like a column or constant of a file. */
  nameClash: 'reduce-name-clash',
  /** A formula that uses a text column (labels). */
  textColumn: 'reduce-text-column',
  /** A derived quantity whose dimension differs between files (the units of a column differ in kind). */
  dimensionDiffers: 'reduce-dimension-differs',
  /** Nothing to compute: no derived quantity and no group. */
  nothing: 'reduce-nothing',
  /** A derived quantity or group that is a condition, not a number. */
  notANumber: 'reduce-not-a-number',
  /** A temperature difference (delta_degC, or T_out - T_in) given to a fluid property, which needs an absolute temperature. */
  temperatureDifference: 'reduce-temperature-difference',
  /** A Monte Carlo check asked with fewer than 100 draws per row, or a seed that is not an integer. */
  monteCarlo: 'reduce-monte-carlo',
} as const;
