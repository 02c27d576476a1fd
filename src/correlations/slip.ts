import type { Warning } from '../common/errors.js';
import { MESSAGES, type SlipKey } from './messages.js';
import type { Correlation } from './types.js';

/**
 * Detection of the classic conversion slips from the ratio data/correlation: when the data sit at
 * a near-constant ratio of 4 or 1/4 (Darcy against Fanning), 8 or 1/8 (a wall-shear coefficient
 * tau_w/(rho U^2) = f_D/8 read as a friction factor), 2 or 1/2 (a radius for a diameter, the 1/2
 * of the dynamic pressure), 4/pi or pi/4 (a flow rate over D^2 for the mean velocity 4Q/(pi D^2),
 * or d^2 for the projected area pi d^2/4), 16/pi^2 or pi^2/16 (that velocity slip squared, in f or
 * C_D, which go as 1/U^2).
 *
 * "Near-constant", stated as a test on r = ln(data/correlation) over the counted points:
 *  - at least SLIP_TEST.minPoints points (5: fewer cannot show that a ratio is constant);
 *  - the median of r within ln(1.06) of ln(factor): the median ratio within 6 % of the factor.
 *    Six per cent covers a rig's systematic error and the spread between handbook forms
 *    (Haaland 1.4 % from Colebrook, the two Clift-Gauvin printings 3 % apart) while keeping the
 *    windows of neighbouring factors apart (the closest pair, 16/pi^2 = 1.62 and 2, are 23 % apart);
 *  - the robust standard deviation of r (1.4826 x median absolute deviation) at most 0.15, about
 *    twice the scatter of the noisiest open data set used here (Roos & Willmarth 1971 sphere drag
 *    about Clift-Gauvin: rms 7.1 %, check-values.md 2.5). A ratio that drifts with Re (a different
 *    law, not a slip) has a larger spread and is not flagged.
 * The median and MAD are used instead of mean and s.d. so that a few outliers cannot hide a slip
 * or make one.
 */

export const SLIP_TEST = {
  minPoints: 5,
  /** Largest |ln(median ratio / factor)|. */
  window: Math.log(1.06),
  /** Largest robust standard deviation of ln(ratio). */
  maxSpread: 0.15,
} as const;

interface Candidate {
  readonly key: SlipKey;
  readonly factor: number;
}

const PI = Math.PI;
/** Candidate factors data/correlation, with the key of their explanation. */
export const SLIP_FACTORS: readonly Candidate[] = [
  { key: '4', factor: 4 },
  { key: '1/4', factor: 1 / 4 },
  { key: '8', factor: 8 },
  { key: '1/8', factor: 1 / 8 },
  { key: '2', factor: 2 },
  { key: '1/2', factor: 1 / 2 },
  { key: '4/pi', factor: 4 / PI },
  { key: 'pi/4', factor: PI / 4 },
  { key: '16/pi^2', factor: 16 / (PI * PI) },
  { key: 'pi^2/16', factor: (PI * PI) / 16 },
];

/** The statistics the test uses: count, median ratio, robust s.d. of ln(ratio). */
export interface RatioStatistics {
  readonly n: number;
  readonly medianRatio: number;
  readonly logSpread: number;
}

/**
 * Count, median and robust spread of the finite positive ratios (others are ignored).
 * @example ratioStatistics(new Float64Array([0.25, 0.26, 0.24])).medianRatio // => 0.25
 */
export function ratioStatistics(ratios: Float64Array): RatioStatistics {
  const logs = new Float64Array(ratios.length);
  let n = 0;
  for (const r of ratios) if (r > 0 && Number.isFinite(r)) logs[n++] = Math.log(r);
  if (n === 0) return { n: 0, medianRatio: NaN, logSpread: NaN };
  const used = logs.subarray(0, n);
  const m = sortedMedian(used.sort());
  const deviations = used.map((l) => Math.abs(l - m));
  const mad = sortedMedian(deviations.sort());
  // 1.4826 = 1/Phi^-1(3/4): the MAD of a normal sample estimates 0.6745 sigma (Hampel 1974, JASA 69:383-393).
  return { n, medianRatio: Math.exp(m), logSpread: 1.4826 * mad };
}

/** Median of an ascending array (Float64Array.prototype.sort is numeric). */
function sortedMedian(s: Float64Array): number {
  const k = s.length >> 1;
  return s.length % 2 === 1 ? s[k]! : (s[k - 1]! + s[k]!) / 2;
}

/**
 * A 'factor-mismatch' warning when the ratios data/correlation sit near-constant at one of the
 * slip factors (test above), saying which slip is likely for the correlation's quantity; null
 * otherwise. The correlation only shapes the wording (Darcy/Fanning for friction, projected area
 * for drag).
 *
 * @example detectFactorSlip(new Float64Array([0.251, 0.249, 0.25, 0.252, 0.248]), COLEBROOK)?.code // => 'factor-mismatch'
 */
export function detectFactorSlip(ratios: Float64Array, correlation?: Correlation): Warning | null {
  return slipFromStatistics(ratioStatistics(ratios), correlation);
}

/**
 * The test of detectFactorSlip on statistics already computed (see ratioStatistics).
 * @example slipFromStatistics({ n: 12, medianRatio: 0.785, logSpread: 0.03 })?.message // => 'the data sit at a near-constant pi/4 (0.785) times the correlation ...'
 */
export function slipFromStatistics(stats: RatioStatistics, correlation?: Correlation): Warning | null {
  if (stats.n < SLIP_TEST.minPoints || !(stats.logSpread <= SLIP_TEST.maxSpread)) return null;
  const lm = Math.log(stats.medianRatio);
  for (const c of SLIP_FACTORS) {
    if (Math.abs(lm - Math.log(c.factor)) <= SLIP_TEST.window) {
      return { code: 'factor-mismatch', message: MESSAGES.factorSlip(c.key, stats, correlation) };
    }
  }
  return null;
}
