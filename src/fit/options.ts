/**
 * Fit options resolved once, with every default in one place, before any numerical loop.
 */
import { InputError } from '../common/errors.js';
import type { ResolvedLmOptions } from './lm-types.js';
import { resolveLmOptions } from './lm-types.js';
import { FIT_ERROR, msg } from './messages.js';
import type { FitOptions } from './types.js';

export interface ResolvedFitOptions {
  readonly lm: ResolvedLmOptions;
  readonly multiStart: number;
  readonly powerLawStart: 'given' | 'log-fit';
  readonly robustMaxIterations: number;
  readonly level: number;
}

/**
 * Defaults: the solver's (lm-types.ts LM_DEFAULTS), no multi-start, a power product fitted in
 * linear space starts from its log-space fit (log-start.ts; other models from the given values),
 * 50 robust passes, 95 % intervals.
 * @throws {InputError} 'fit-option' for a value out of range.
 * @example resolveFitOptions({}).level // => 0.95
 */
export function resolveFitOptions(options: FitOptions = {}): ResolvedFitOptions {
  let lm: ResolvedLmOptions;
  try {
    lm = resolveLmOptions(options);
  } catch (e) {
    throw new InputError(FIT_ERROR.option, (e as Error).message);
  }
  const level = options.level ?? 0.95;
  if (!(level > 0 && level < 1)) throw new InputError(FIT_ERROR.option, msg.level(level));
  const multiStart = options.multiStart ?? 0;
  if (!(Number.isInteger(multiStart) && multiStart >= 0 && multiStart <= 1000)) {
    throw new InputError(FIT_ERROR.option, `multiStart must be an integer from 0 to 1000, got ${multiStart}`);
  }
  const robustMaxIterations = options.robustMaxIterations ?? 50;
  if (!(Number.isInteger(robustMaxIterations) && robustMaxIterations >= 1)) {
    throw new InputError(FIT_ERROR.option, `robustMaxIterations must be an integer >= 1, got ${robustMaxIterations}`);
  }
  return Object.freeze({ lm, multiStart, powerLawStart: options.powerLawStart ?? 'log-fit', robustMaxIterations, level });
}
