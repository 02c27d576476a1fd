/**
 * Exponents that one file cannot determine. In a campaign each file is one rig configuration,
 * so a group such as L/D is often constant inside a file; in a power product C*Re^a*LD^b its
 * exponent b is then confounded with C (LD^b is one more constant factor) and the file's own fit
 * is rank deficient. Such an exponent is held at a fixed value in that file's fit, and C absorbs
 * LD^b; the campaign compares the file's C after moving it to the pooled b (adjustHeld in
 * agreement.ts), which for a power product is an exact change of parameters.
 */
import { evaluateNode, formatFormula, numNode, parseFormula, unaryNode, type ExprNode, type Formula } from '../expr/index.js';
import { detectPowerProduct } from '../fit/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';

/** An exponent held fixed in one file's fit. */
export interface HeldParameter {
  readonly param: string;
  /** The base it raises, as a formula ('LD', 'L/D'). */
  readonly group: string;
  /** The base's value in every row of the file. */
  readonly groupValue: number;
  /** +1 for G^b in a numerator, -1 for G^-b or a denominator. */
  readonly sign: 1 | -1;
  /** The value it is held at in the file's fit. */
  readonly fixedAt: number;
}

/** Relative spread below which a group counts as constant in a file (rounding of one value). */
const CONSTANT_SPREAD = 1e-12;

/**
 * The exponents of a power product whose base is constant over the rows (only when the model has
 * a free coefficient to absorb them; otherwise each such factor is itself determined by the level).
 * @param starts parameter start values (the value a held exponent is fixed at)
 * @example heldParameters(parseFormula('C*Re^a*LD^b'), starts, columns, n) // => [{ param: 'b', group: 'LD', groupValue: 25, sign: 1, fixedAt: 0 }] when LD is 25 in every row
 */
export function heldParameters(
  model: Formula,
  starts: ReadonlyMap<string, number>,
  columns: ReadonlyMap<string, Float64Array>,
  n: number,
  constants: ReadonlyMap<string, number> = new Map(),
): HeldParameter[] {
  const pp = detectPowerProduct(model, new Set(starts.keys()));
  if (pp === undefined || pp.coefficient === undefined || n === 0) return [];
  const held: HeldParameter[] = [];
  for (const f of pp.powers) {
    const valueAt = (row: number): number => evaluateNode(f.base, (name) => columns.get(name)?.[row] ?? constants.get(name), PROPERTY_FUNCTIONS);
    const first = valueAt(0);
    let constant = Number.isFinite(first);
    for (let i = 1; i < n && constant; i++) constant = Math.abs(valueAt(i) - first) <= CONSTANT_SPREAD * Math.abs(first);
    if (constant) held.push({ param: f.param, group: f.group, groupValue: first, sign: f.sign, fixedAt: starts.get(f.param)! });
  }
  return held;
}

/**
 * The model with held parameters replaced by their fixed values.
 * @example formatFormula(holdParameters(parseFormula('C*Re^a*LD^b'), [{ param: 'b', fixedAt: -0.05, ... }]).root) // => 'C*Re^a*LD^(-0.05)'
 */
export function holdParameters(model: Formula, held: readonly Pick<HeldParameter, 'param' | 'fixedAt'>[]): Formula {
  const values = new Map(held.map((h) => [h.param, h.fixedAt]));
  const replace = (node: ExprNode): ExprNode => {
    switch (node.type) {
      case 'name': {
        const v = values.get(node.name);
        if (v === undefined) return node;
        return v < 0 ? unaryNode('neg', numNode(-v)) : numNode(v === 0 ? 0 : v);
      }
      case 'unary':
        return { ...node, arg: replace(node.arg) };
      case 'binary':
        return { ...node, left: replace(node.left), right: replace(node.right) };
      case 'call':
        return { ...node, args: node.args.map(replace) };
      default:
        return node;
    }
  };
  return parseFormula(formatFormula(replace(model.root)), { functions: PROPERTY_FUNCTIONS });
}
