import { InputError } from '../common/errors.js';
import { DATA_ERROR, dataMessages, type NamedFormula } from '../data/index.js';
import { namesIn } from '../expr/index.js';

/**
 * The order in which derived quantities and groups are computed: each after the definitions it
 * uses (depth-first topological sort, Tarjan 1976, "Edge-disjoint spanning trees and depth-first
 * search", Acta Informatica 6:171-185; ties keep study order). Names that are not defined by a
 * formula (columns, constants) impose no order.
 */

/**
 * The definitions in an order where every formula comes after the definitions it uses.
 * @throws {InputError} 'study-cycle' naming the circle (`U -> Re -> U`), at the first of its
 *   definitions in the study.
 * @example evaluationOrder([Re = rho*U*D/mu, U = 4*Q/(pi*D^2)]).map((d) => d.name) // => ['U', 'Re']
 */
export function evaluationOrder(items: readonly NamedFormula[]): NamedFormula[] {
  const byName = new Map(items.map((d) => [d.name, d]));
  const state = new Map<string, 'visiting' | 'done'>();
  const order: NamedFormula[] = [];
  const stack: string[] = [];
  const visit = (item: NamedFormula): void => {
    const s = state.get(item.name);
    if (s === 'done') return;
    if (s === 'visiting') {
      const path = [...stack.slice(stack.indexOf(item.name)), item.name];
      const first = items.find((d) => path.includes(d.name)) ?? item;
      throw new InputError(DATA_ERROR.studyCycle, dataMessages.cycle(path), first.nameWhere);
    }
    state.set(item.name, 'visiting');
    stack.push(item.name);
    for (const used of namesIn(item.formula)) {
      const dep = byName.get(used);
      if (dep !== undefined) visit(dep);
    }
    stack.pop();
    state.set(item.name, 'done');
    order.push(item);
  };
  for (const item of items) visit(item);
  return order;
}
