/**
 * Values of a parameter-free piece of a model (a group such as L/D, a known factor such as 64)
 * over the rows, through the formula engine.
 */
import type { ExprNode, FunctionTable } from '../expr/index.js';
import { BUILTIN_FUNCTIONS, compileFormula, formatFormula, namesIn } from '../expr/index.js';

export interface DataContext {
  readonly n: number;
  readonly columns: ReadonlyMap<string, Float64Array>;
  readonly constants: ReadonlyMap<string, number>;
  readonly functions: FunctionTable;
}

/**
 * Evaluates a parameter-free node on every row. A bare column name returns the column itself
 * (no copy: the caller must not write to it).
 * @throws {InputError} 'formula-unknown-name' when a name is neither a column nor a constant.
 * @example evaluateFree(parseFormula('L/D').root, ctx) // => Float64Array of L/D per row
 */
export function evaluateFree(node: ExprNode, ctx: DataContext): Float64Array {
  if (node.type === 'name') {
    const column = ctx.columns.get(node.name);
    if (column !== undefined) return column;
  }
  const names = [...namesIn(node)];
  const vectors = names.filter((name) => ctx.columns.has(name));
  const scalars = names.filter((name) => !ctx.columns.has(name));
  const compiled = compileFormula({ text: formatFormula(node), root: node }, { vectors, scalars, params: [] }, ctx.functions ?? BUILTIN_FUNCTIONS);
  return compiled.bind({ n: ctx.n, vectors: ctx.columns, scalars: ctx.constants }).evaluate([]);
}
