import type { Correlation } from './types.js';

/**
 * Every message of the handbook stage, in one place, so that the same situation is always
 * described the same way (errors, warnings, and the sentences of the exponent check).
 */

export type SlipKey = '4' | '1/4' | '8' | '1/8' | '2' | '1/2' | '4/pi' | 'pi/4' | '16/pi^2' | 'pi^2/16';

const SLIP_VALUE: Record<SlipKey, string> = {
  '4': '4',
  '1/4': '1/4',
  '8': '8',
  '1/8': '1/8',
  '2': '2',
  '1/2': '1/2',
  '4/pi': '4/pi (1.273)',
  'pi/4': 'pi/4 (0.785)',
  '16/pi^2': '16/pi^2 (1.621)',
  'pi^2/16': 'pi^2/16 (0.617)',
};

const VELOCITY_SLIP =
  'a volume flow over D^2 (or a square section D^2) used where the mean velocity 4Q/(pi*D^2) was meant';

/** Which slip a factor points to, by the quantity the correlation returns. */
function slipCause(key: SlipKey, c: Correlation | undefined): string {
  const symbol = c?.returns.symbol;
  const family = c?.family;
  if (symbol === 'f_D' || symbol === 'f_F') {
    const other = symbol === 'f_D' ? 'Fanning' : 'Darcy';
    const own = symbol === 'f_D' ? 'Darcy' : 'Fanning';
    const sibling = symbol === 'f_D' ? `${c?.id}-fanning` : (c?.id ?? '').replace(/-fanning$/, '');
    switch (key) {
      case '1/4':
        if (symbol === 'f_D') return `the data look like Fanning factors (f_F = f_D/4) compared with a Darcy form: compare with '${sibling}' or reduce to f_D = dp*D/(L*rho*U^2/2)`;
        return `a Darcy/Fanning mix-up (f_D = 4*f_F): the data are a quarter of a Fanning form; check the definition used in the reduction`;
      case '4':
        if (symbol === 'f_F') return `the data look like Darcy factors (f_D = 4*f_F) compared with a Fanning form: compare with '${sibling}'`;
        return `a Darcy/Fanning mix-up (f_D = 4*f_F): the data are 4 times a ${own} form; check the friction-factor definition used in the reduction`;
      case '1/8':
      case '8':
        return `the data look like a wall-shear coefficient tau_w/(rho*U^2) (= f_D/8, the coefficient tabulated by Stanton & Pannell 1914) rather than a ${own} factor, or the reverse; ${other} factors differ by 4, not 8`;
      case '2':
      case '1/2':
        return 'a radius used where the diameter was meant (f is linear in D for a given velocity), or the 1/2 of the dynamic pressure rho*U^2/2 dropped or doubled';
      case '4/pi':
      case 'pi/4':
        return `${VELOCITY_SLIP}: in laminar flow (f = 64/Re) that slip shows as pi/4 when only Re carries it and as 4/pi when f carries it too`;
      case '16/pi^2':
      case 'pi^2/16':
        return `${VELOCITY_SLIP} in the friction factor, which goes as 1/U^2`;
    }
  }
  if (family === 'sphere-drag') {
    switch (key) {
      case '4/pi':
      case 'pi/4':
        return 'the projected area taken as d^2 instead of pi*d^2/4 (or the reverse), or a Reynolds number built with the wrong velocity in the Stokes regime';
      case '4':
      case '1/4':
        return 'the diameter used as a radius in the projected area (pi*d^2 instead of pi*d^2/4), or the reverse';
      case '2':
      case '1/2':
        return 'the 1/2 of the dynamic pressure rho*U^2/2 dropped or doubled, or a radius used for the diameter in Re';
      case '16/pi^2':
      case 'pi^2/16':
        return `${VELOCITY_SLIP} in the drag coefficient, which goes as 1/U^2`;
      default:
        return 'a conversion factor of that size in the reduction of the drag coefficient';
    }
  }
  if (family === 'heat-transfer' && (key === '2' || key === '1/2')) {
    return 'a radius used where the diameter was meant in Nu = h*D/k';
  }
  return `a conversion factor of ${SLIP_VALUE[key]} somewhere in the reduction (a radius for a diameter, a Darcy/Fanning or area convention)`;
}

export const MESSAGES = {
  unknownCorrelation: (id: string) => `'${id}' is not a handbook correlation`,
  missingInput: (c: Correlation, name: string) => {
    const input = c.inputs.find((i) => i.name === name);
    return `'${c.id}' needs ${name} (${input?.meaning ?? 'an input'}), which was not given`;
  },
  unknownInput: (c: Correlation, name: string) =>
    `'${c.id}' has no input named '${name}'; its inputs are ${c.inputs.map((i) => i.name).join(', ')}`,
  outsideRange: (c: Correlation, input: string, value: string, bound: string, source: string) =>
    `${input} = ${value} is outside the range of '${c.id}' (${bound}; ${source}): the value is an extrapolation`,
  nothingCounted: (c: Correlation, outOfRange: number, notEvaluable: number) =>
    `no data point lies inside the stated range of '${c.id}' (${outOfRange} outside, ${notEvaluable} not evaluable): its deviation figures are empty`,
  factorSlip: (key: SlipKey, stats: { n: number; medianRatio: number; logSpread: number }, c: Correlation | undefined) =>
    `the data sit at a near-constant ${SLIP_VALUE[key]} times ${c === undefined ? 'the correlation' : `'${c.id}'`} ` +
    `(median ratio ${stats.medianRatio.toPrecision(4)} over ${stats.n} points, scatter ${(100 * stats.logSpread).toFixed(1)} %): ` +
    `likely ${slipCause(key, c)}`,
} as const;
