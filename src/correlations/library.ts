import { InputError, type SourceSpan } from '../common/errors.js';
import { nearestNames } from '../expr/nearest.js';
import { DRAG_CORRELATIONS } from './drag.js';
import { fanningVariant } from './fanning.js';
import { DARCY_CORRELATIONS } from './friction.js';
import { HEAT_CORRELATIONS } from './heat.js';
import { MESSAGES } from './messages.js';
import type { Correlation, CorrelationFamily } from './types.js';

/**
 * The handbook library: every correlation by id. Darcy forms first, then their Fanning variants,
 * then sphere drag, then heat transfer. Adding an entry: see DEVELOPERS.md, "How to add a
 * handbook correlation".
 */
export const CORRELATIONS: readonly Correlation[] = [
  ...DARCY_CORRELATIONS,
  ...DARCY_CORRELATIONS.map(fanningVariant),
  ...DRAG_CORRELATIONS,
  ...HEAT_CORRELATIONS,
];

const BY_ID: ReadonlyMap<string, Correlation> = buildIndex(CORRELATIONS);

function buildIndex(list: readonly Correlation[]): Map<string, Correlation> {
  const m = new Map<string, Correlation>();
  for (const c of list) {
    if (!/^[a-z][a-z0-9]*(?:-[a-z0-9]+)*$/.test(c.id)) throw new RangeError(`correlation id '${c.id}' is not lower-case and dashed`);
    if (m.has(c.id)) throw new RangeError(`correlation id '${c.id}' is defined twice`);
    m.set(c.id, c);
  }
  return m;
}

/** The families in listing order, with a heading for each. */
export const FAMILIES: readonly { readonly family: CorrelationFamily; readonly heading: string }[] = [
  { family: 'pipe-friction', heading: 'Pipe friction' },
  { family: 'sphere-drag', heading: 'Sphere drag' },
  { family: 'heat-transfer', heading: 'Heat transfer in tubes' },
];

/**
 * The correlation with this id, or undefined.
 * @example correlationById('colebrook')?.returns.symbol // => 'f_D'
 */
export function correlationById(id: string): Correlation | undefined {
  return BY_ID.get(id);
}

/**
 * The correlation with this id (case and surrounding spaces ignored).
 * @throws {InputError} kind 'correlation-unknown' with the nearest ids as a hint, located at `where`.
 * @example findCorrelation('Swamee-Jain').id // => 'swamee-jain'
 */
export function findCorrelation(id: string, where: SourceSpan = {}): Correlation {
  const found = BY_ID.get(id.trim().toLowerCase());
  if (found !== undefined) return found;
  const near = nearestNames(id.trim(), BY_ID.keys(), 3);
  throw new InputError('correlation-unknown', MESSAGES.unknownCorrelation(id), where, {
    hint: `did you mean ${near.join(', ')}? 'similis handbook' lists them all`,
  });
}

/**
 * The correlations of one family (or all), in listing order.
 * @example listCorrelations('heat-transfer').map((c) => c.id) // => ['dittus-boelter', 'dittus-boelter-cooling', 'sieder-tate', 'gnielinski']
 */
export function listCorrelations(family?: CorrelationFamily): readonly Correlation[] {
  return family === undefined ? CORRELATIONS : CORRELATIONS.filter((c) => c.family === family);
}
