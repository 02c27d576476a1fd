import type { ExprNode } from './ast.js';
import { childrenOf } from './ast.js';
import type { FormulaKind } from './kinds.js';

/**
 * Where each node of a formula is computed when it is compiled over whole columns:
 *
 *   'leaf'        a number, pi or a name: referenced directly
 *   'const'       no free names: folded once at compile time into a literal
 *   'bindScalar'  study constants only (4/(pi*D^2) with D a constant): once, when data is bound
 *   'bindVector'  data only, under a node that depends on parameters (ln(Re), L/D in a fit
 *                 model): once per row when data is bound, kept in a typed array, so that a fit
 *                 calling evaluate thousands of times never recomputes it
 *   'call'        parameters (and constants) only, no column: once per evaluate call, before the loop
 *   'inline'      everything else: in the row loop (or inside the hoisted computation it belongs to)
 *
 * A data-only node whose parent does not depend on parameters is not hoisted on its own: it is
 * part of a larger hoisted node, or the formula has no parameters and is evaluated once anyway.
 */
export type Home = 'leaf' | 'const' | 'bindScalar' | 'bindVector' | 'call' | 'inline';

export interface NodeFacts {
  readonly kind: FormulaKind;
  readonly usesVector: boolean;
  readonly usesScalar: boolean;
  /** Indices (into layout.params) of the parameters the node depends on, ascending. */
  readonly params: readonly number[];
  readonly home: Home;
}

export type Slot = { readonly role: 'vector' | 'scalar' | 'param'; readonly index: number };

/**
 * Facts about every node: kind, what it depends on, and where it is computed.
 * @param slotOf the layout slot of each free name (names were checked beforehand).
 * @param hoist false computes every node in the row loop (no folding, no hoisting): used to test
 *   that hoisting changes nothing in the results.
 */
export function planNodes(root: ExprNode, slotOf: (name: string) => Slot, hoist: boolean): ReadonlyMap<ExprNode, NodeFacts> {
  const facts = new Map<ExprNode, NodeFacts>();
  const basic = new Map<ExprNode, Omit<NodeFacts, 'home'>>();

  // Bottom-up: dependencies and kinds.
  const visit = (node: ExprNode): Omit<NodeFacts, 'home'> => {
    const kids = childrenOf(node).map(visit);
    let usesVector = false;
    let usesScalar = false;
    const params = new Set<number>();
    if (node.type === 'name') {
      const slot = slotOf(node.name);
      usesVector = slot.role === 'vector';
      usesScalar = slot.role === 'scalar';
      if (slot.role === 'param') params.add(slot.index);
    }
    for (const k of kids) {
      usesVector ||= k.usesVector;
      usesScalar ||= k.usesScalar;
      k.params.forEach((p) => params.add(p));
    }
    const kind: FormulaKind =
      (node.type === 'binary' && ['<', '<=', '>', '>=', '==', '!=', 'and', 'or'].includes(node.op)) ||
      (node.type === 'unary' && node.op === 'not')
        ? 'boolean'
        : 'number';
    const f = { kind, usesVector, usesScalar, params: [...params].sort((a, b) => a - b) };
    basic.set(node, f);
    return f;
  };
  visit(root);

  // Top-down: homes (hoisting needs to know whether the parent depends on parameters).
  const place = (node: ExprNode, parentHasParams: boolean): void => {
    const f = basic.get(node)!;
    facts.set(node, { ...f, home: homeOf(node, f, parentHasParams, hoist) });
    for (const c of childrenOf(node)) place(c, f.params.length > 0);
  };
  place(root, false);
  return facts;
}

function homeOf(node: ExprNode, f: Omit<NodeFacts, 'home'>, parentHasParams: boolean, hoist: boolean): Home {
  if (node.type === 'num' || node.type === 'const' || node.type === 'name') return 'leaf';
  if (!hoist || f.kind !== 'number') return 'inline';
  const hasParams = f.params.length > 0;
  if (!hasParams && !f.usesVector) return f.usesScalar ? 'bindScalar' : 'const';
  if (hasParams && !f.usesVector) return 'call';
  if (!hasParams && f.usesVector && parentHasParams) return 'bindVector';
  return 'inline';
}
