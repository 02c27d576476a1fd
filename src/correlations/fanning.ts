import type { Correlation, ReturnedQuantity } from './types.js';

/**
 * Fanning variants of the Darcy friction forms, each under its own explicit id
 * ('colebrook-fanning'), so that a study or a comparison always says which factor it means.
 * Fanning f_F = tau_w/(rho*U^2/2) = f_D/4 (Fanning 1877; the factor 4 is the commonest slip in
 * friction work, check-values.md 6.3).
 */

const FANNING: ReturnedQuantity = { symbol: 'f_F', name: 'Fanning friction factor f_F = tau_w/(rho*U^2/2) = f_D/4' };

/** Replaces the name f_D (as a whole word) by (4*f_F) in one side of an equation. */
function inFanning(side: string): string {
  return side.replace(/(?<![\p{L}\p{Nd}_])f_D(?![\p{L}\p{Nd}_])/gu, '(4*f_F)');
}

/**
 * The Fanning variant of a Darcy correlation: same inputs, range and source; value f_D/4; the
 * equation rewritten with f_D = 4*f_F (explicit forms become f_F = (...)/4).
 * @throws {RangeError} when the correlation does not return the Darcy factor (a programming error).
 * @example fanningVariant(BLASIUS).equation // => { left: 'f_F', right: '(0.3164*Re^(-0.25))/4' }
 */
export function fanningVariant(darcy: Correlation): Correlation {
  if (darcy.returns.symbol !== 'f_D') throw new RangeError(`fanningVariant: ${darcy.id} does not return f_D`);
  const explicit = darcy.equation.left === 'f_D';
  const equation = explicit
    ? { left: 'f_F', right: `(${darcy.equation.right})/4` }
    : { left: inFanning(darcy.equation.left), right: inFanning(darcy.equation.right) };
  const darcyValue = darcy.value;
  return {
    ...darcy,
    id: `${darcy.id}-fanning`,
    title: `${darcy.title} (Fanning factor)`,
    returns: FANNING,
    equation,
    words: `one quarter of the Darcy factor of '${darcy.id}': ${darcy.words}`,
    ...(darcy.powerLaw === undefined ? {} : { powerLaw: darcy.powerLaw }),
    // Fanning (1877): f_F = f_D / 4.
    value: (x) => darcyValue(x) / 4,
  };
}
