import { compactNumber, correlationAt } from './evaluate.js';
import type { Correlation } from './types.js';

/**
 * The exponent check: does a fitted exponent of a group (Re in f = C Re^a) agree with the handbook
 * form, given the fit's confidence interval? For a pure power law (Blasius: -1/4) the handbook
 * exponent is exact; for any other form it is the local slope d ln y / d ln x at a point (the
 * middle of the data), which is what a power law fitted over a narrow range estimates.
 */

/** Relative step in ln x for the central difference; the truncation error is about h^2/6 times the third log-derivative, below 1e-8. */
const LOG_STEP = 1e-4;

/**
 * d ln y / d ln x of the correlation with respect to input `name` at `point` (all other inputs
 * held). Exact for the inputs of a pure power law; a central difference in ln x otherwise.
 * Returns NaN where the correlation is not positive and finite around the point.
 *
 * @throws {InputError} 'correlation-missing-input' when the point lacks a required input.
 * @example localExponent(BLASIUS, 'Re', { Re: 1e4 }) // => -0.25
 * @example localExponent(COLEBROOK, 'Re', { Re: 1e5, roughness: 0 }) // => about -0.19 (smooth pipe, from Prandtl-Karman)
 */
export function localExponent(c: Correlation, name: string, point: Readonly<Record<string, number>>): number {
  const exact = c.powerLaw?.[name];
  if (exact !== undefined) return exact;
  const x = point[name];
  if (x === undefined || !(x > 0)) return NaN;
  const up = correlationAt(c, { ...point, [name]: x * Math.exp(LOG_STEP) });
  const down = correlationAt(c, { ...point, [name]: x * Math.exp(-LOG_STEP) });
  if (!(up > 0 && down > 0 && Number.isFinite(up) && Number.isFinite(down))) return NaN;
  return (Math.log(up) - Math.log(down)) / (2 * LOG_STEP);
}

export interface ExponentFit {
  /** The group the exponent belongs to, as named in the correlation ('Re'). */
  readonly name: string;
  readonly estimate: number;
  /** Confidence interval of the estimate, [low, high]. */
  readonly interval: readonly [number, number];
  /** Confidence level of the interval in per cent (95). */
  readonly levelPercent: number;
}

export interface ExponentCheck {
  readonly name: string;
  readonly fitted: number;
  readonly interval: readonly [number, number];
  /** The handbook exponent (exact or local slope). */
  readonly handbook: number;
  /** Whether it was a local slope (true) or an exact power-law exponent (false). */
  readonly localSlope: boolean;
  /** True when the interval contains the handbook exponent. */
  readonly consistent: boolean;
  /** One sentence in words, for the report. */
  readonly sentence: string;
}

/**
 * Compares a fitted exponent with the handbook's: consistent when the confidence interval
 * contains it; otherwise a sentence saying how the data's trend differs.
 *
 * @throws {InputError} 'correlation-missing-input' when `point` lacks an input the correlation needs.
 * @example
 *   checkExponent({ name: 'Re', estimate: -0.21, interval: [-0.22, -0.2], levelPercent: 95 }, BLASIUS, { Re: 3e4 }).sentence
 *   // => "The fitted exponent of Re, -0.21 (95 % interval -0.22 to -0.2), differs from the -0.25 of 'blasius' by more than
 *   //     its interval allows: the data fall off more slowly with Re than the handbook form."
 */
export function checkExponent(fit: ExponentFit, c: Correlation, point: Readonly<Record<string, number>>): ExponentCheck {
  const local = c.powerLaw?.[fit.name] === undefined;
  const handbook = localExponent(c, fit.name, point);
  const [lo, hi] = fit.interval;
  const consistent = handbook >= Math.min(lo, hi) && handbook <= Math.max(lo, hi);
  const where = local ? ` (its local slope at ${describePoint(point)})` : '';
  const head = `The fitted exponent of ${fit.name}, ${num(fit.estimate)} (${fit.levelPercent} % interval ${num(lo)} to ${num(hi)}),`;
  const sentence = !Number.isFinite(handbook)
    ? `${head} cannot be compared with '${c.id}', which has no finite slope in ${fit.name} at ${describePoint(point)}.`
    : consistent
      ? `${head} is consistent with the ${num(handbook)} of '${c.id}'${where}.`
      : `${head} differs from the ${num(handbook)} of '${c.id}'${where} by more than its interval allows: the data ${trend(fit.estimate, handbook, fit.name)} than the handbook form.`;
  return { name: fit.name, fitted: fit.estimate, interval: fit.interval, handbook, localSlope: local, consistent, sentence };
}

function trend(fitted: number, handbook: number, name: string): string {
  const steeper = Math.abs(fitted) > Math.abs(handbook);
  if (handbook < 0) return fitted > 0 ? `rise with ${name} where it falls` : steeper ? `fall off faster with ${name}` : `fall off more slowly with ${name}`;
  if (handbook > 0) return fitted < 0 ? `fall with ${name} where it rises` : steeper ? `rise faster with ${name}` : `rise more slowly with ${name}`;
  return `change with ${name} more`;
}

/** 4 significant digits: enough to show a difference of a few parts in a thousand against an interval edge. */
function num(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(4))) : String(x);
}

function describePoint(point: Readonly<Record<string, number>>): string {
  return Object.entries(point)
    .map(([k, v]) => `${k} = ${compactNumber(Number(v.toPrecision(3)))}`)
    .join(', ');
}
