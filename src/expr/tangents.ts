import type { BinaryNode, CallNode, ExprNode } from './ast.js';
import { nameNode } from './ast.js';
import type { Entry, Sink } from './emit.js';
import { detachedCode, literal, product } from './emit.js';
import type { FunctionTable } from './functions.js';

/**
 * Forward-mode automatic differentiation rules for the generated code (Griewank & Walther,
 * Evaluating Derivatives, 2nd ed., SIAM 2008, ch. 3, the tangent propagation rules): the
 * derivative of each node with respect to parameter j from its children's values and
 * derivatives. A rule returns undefined when the derivative is zero.
 */

/** What the rules need from the code generator. */
export interface TangentHost {
  readonly fns: FunctionTable;
  params(node: ExprNode): readonly number[];
  temp(): string;
  fnRef(name: string): string;
  /** ln of a power's base, hoisted where possible. */
  logOf(base: ExprNode, u: Entry, ctx: Sink): string;
}

export type TangentRule = (j: number) => string | undefined;

/** The rule for one node whose value is the temp `t`; shared factors are emitted into `ctx` once. */
export function tangentRule(node: ExprNode, kids: readonly Entry[], t: string, ctx: Sink, host: TangentHost): TangentRule {
  const [ka, kb] = kids;
  const da = (j: number) => ka?.tangents.get(j);
  const db = (j: number) => kb?.tangents.get(j);
  if (node.type === 'unary') return (j) => (da(j) === undefined ? undefined : `-${da(j)}`);
  if (node.type === 'call') return callRule(node, kids, t, ctx, host);
  if (node.type !== 'binary' || ka === undefined || kb === undefined) return () => undefined;
  const sum = (terms: (string | undefined)[]) => terms.filter((x) => x !== undefined).join(' + ') || undefined;
  switch (node.op) {
    case '+':
      return (j) => sum([da(j), db(j)]);
    case '-':
      return (j) => {
        const x = da(j);
        const y = db(j);
        return y === undefined ? x : x === undefined ? `-${y}` : `${x} - ${y}`;
      };
    case '*':
      return (j) => {
        const x = da(j);
        const y = db(j);
        return sum([x === undefined ? undefined : product(x, kb.value), y === undefined ? undefined : product(ka.value, y)]);
      };
    case '/':
      // d(a/b) = (da - (a/b)*db)/b
      return (j) => {
        const x = da(j);
        const y = db(j);
        if (y === undefined) return x === undefined ? undefined : `${x}/${kb.value}`;
        return x === undefined ? `-${product(t, y)}/${kb.value}` : `(${x} - ${product(t, y)})/${kb.value}`;
      };
    case '^':
      return powerRule(node, ka, kb, t, ctx, host);
    default:
      return () => undefined;
  }
}

/** d(u^v) = v*u^(v-1)*du + u^v*ln(u)*dv; both factors computed once per node, shared by all j. */
function powerRule(node: BinaryNode, u: Entry, v: Entry, t: string, ctx: Sink, host: TangentHost): TangentRule {
  const params = host.params(node);
  let dU: string | undefined;
  let dV: string | undefined;
  if (params.some((j) => u.tangents.has(j))) {
    let code: string;
    if (v.constant !== undefined) {
      const k = v.constant;
      code = k === 1 ? '1' : k === 2 ? `2*${u.value}` : `${literal(k)}*Math.pow(${u.value}, ${literal(k - 1)})`;
    } else {
      code = `${v.value}*Math.pow(${u.value}, ${v.value} - 1)`;
    }
    dU = host.temp();
    ctx.lines.push(`const ${dU} = ${code};`);
  }
  if (params.some((j) => v.tangents.has(j))) {
    dV = host.temp();
    ctx.lines.push(`const ${dV} = ${t}*${host.logOf(node.left, u, ctx)};`);
  }
  return (j) => {
    const terms: string[] = [];
    const du = u.tangents.get(j);
    const dv = v.tangents.get(j);
    if (du !== undefined) terms.push(product(dU!, du));
    if (dv !== undefined) terms.push(product(dV!, dv));
    return terms.length > 0 ? terms.join(' + ') : undefined;
  };
}

/** Chain rule through a table function, with the partial derivatives from the table's rules. */
function callRule(node: CallNode, kids: readonly Entry[], t: string, ctx: Sink, host: TangentHost): TangentRule {
  const spec = host.fns.get(node.fn);
  if (spec === undefined) throw new RangeError(`codegen: unknown function ${node.fn}`);
  const params = host.params(node);
  const holders = kids.map((_, k) => nameNode(`#${k}`));
  const bindings = new Map<string, string>(kids.map((e, k) => [`#${k}`, e.value]));
  bindings.set('#self', t);
  const partials = kids.map((e, k) => {
    if (!params.some((j) => e.tangents.has(j))) return undefined;
    const q = host.temp();
    const rule = spec.partial(holders, k, nameNode('#self'));
    ctx.lines.push(`const ${q} = ${detachedCode(rule, bindings, (name) => host.fnRef(name))};`);
    return q;
  });
  return (j) => {
    const terms: string[] = [];
    kids.forEach((e, k) => {
      const d = e.tangents.get(j);
      if (d !== undefined) terms.push(product(partials[k]!, d));
    });
    return terms.length > 0 ? terms.join(' + ') : undefined;
  };
}
