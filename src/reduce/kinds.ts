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
} as const;
