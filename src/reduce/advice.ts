import type { ExprNode, Formula } from '../expr/index.js';
import { namesIn } from '../expr/index.js';
import type { Dimension } from '../units/index.js';
import { dataMessages } from '../data/index.js';
import type { NameInfo } from './names.js';

/**
 * What to check when a group is not dimensionless. If the leftover dimension is exactly that of
 * one name the group uses (or its inverse), the unit of that name is the likely slip
 * ("check the unit of D"); otherwise the names and their units are listed.
 * @example groupAdvice(parseFormula('dp*D/(L*rho*U^2)'), L^-1, names) // => 'Check the unit of L (...)'
 */
export function groupAdvice(formula: Formula | ExprNode, leftover: Dimension, names: ReadonlyMap<string, NameInfo>): string {
  const used = [...namesIn(formula)].map((n) => names.get(n)).filter((n): n is NameInfo => n !== undefined);
  const suspects = used.filter((n) => {
    const d = n.dimension;
    return d !== null && !d.isDimensionless() && (d.equals(leftover) || d.pow(-1).equals(leftover));
  });
  if (suspects.length > 0) return dataMessages.groupCheckUnitOf(suspects.map(label).join(' or '));
  return dataMessages.groupCheckUnits(used.map(label).join(', '));
}

function label(n: NameInfo): string {
  return n.kind === 'derived' ? `${n.name} (derived, ${n.dimension?.toString() ?? '?'})` : n.label;
}
