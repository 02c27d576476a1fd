import type { ExprNode } from './ast.js';
import { childrenOf } from './ast.js';
import { assembleSource } from './assemble.js';
import type { Entry } from './emit.js';
import { binaryCode, literal, NO_TANGENTS, Sink } from './emit.js';
import { evaluateNode } from './evaluate.js';
import type { FunctionTable } from './functions.js';
import type { NodeFacts, Slot } from './plan.js';
import type { TangentHost } from './tangents.js';
import { tangentRule } from './tangents.js';

/**
 * JavaScript source for a compiled formula, generated from the validated tree. The source never
 * contains user text: names become array slots (v0 = first data column, s0 = first constant,
 * p0 = first parameter), functions become slots of a function array (f0 ...), and numbers are
 * printed by `literal`, which checks Number.isFinite first.
 *
 * Values are computed in SSA style (one `const` per node) in the place plan.ts gives each node;
 * with tangents, each node that depends on parameter j also gets its derivative `tK_j` right
 * after its value (forward-mode automatic differentiation, see tangents.ts), so the Jacobian
 * shares every intermediate value with the function itself.
 */

/** One generated function body (evaluate, or evaluate with tangents). */
interface Body {
  readonly pre: Sink;
  readonly loop: Sink;
  readonly tangents: boolean;
}

export interface GeneratedSource {
  /** Body of a factory `(V, S, F, n) => { evaluate(P, out), jacobian(P, out, J) }`. */
  readonly source: string;
  /** The functions referenced as F[k]. */
  readonly functions: readonly ((...args: number[]) => number)[];
  readonly counts: { readonly hoistedVectors: number; readonly hoistedScalars: number; readonly jacobianLogs: number };
}

/** Generates the factory source for a formula whose every name has a slot. */
export class CodeGenerator implements TangentHost {
  private temps = 0;
  private readonly bindScalar = new Sink('bindScalar');
  private readonly bindVector = new Sink('bindVector');
  private readonly jacobianPrep: string[] = [];
  private readonly hoisted = new Map<ExprNode, string>();
  private readonly logs = new Map<ExprNode, string>();
  private nC = 0;
  private nH = 0;
  private nG = 0;
  private readonly fnSlots = new Map<string, number>();
  private readonly fnList: ((...args: number[]) => number)[] = [];

  constructor(
    private readonly facts: ReadonlyMap<ExprNode, NodeFacts>,
    private readonly slotOf: (name: string) => Slot,
    readonly fns: FunctionTable,
    private readonly hoist: boolean,
  ) {}

  generate(root: ExprNode, counts: { vectors: number; scalars: number; params: number }): GeneratedSource {
    const boolean = this.facts.get(root)!.kind === 'boolean';
    const evalBody: Body = { pre: new Sink('call'), loop: new Sink('loop'), tangents: false };
    const rootValue = this.entry(root, evalBody.loop, evalBody);
    const jacBody: Body = { pre: new Sink('call'), loop: new Sink('loop'), tangents: true };
    const rootJac = boolean ? undefined : this.entry(root, jacBody.loop, jacBody);
    const source = assembleSource({
      ...counts,
      functions: this.fnList.length,
      hoistedScalars: this.nC,
      hoistedVectors: this.nH,
      jacobianColumns: this.nG,
      bindScalarLines: this.bindScalar.lines,
      bindVectorLines: this.bindVector.lines,
      jacobianPrepLines: this.jacobianPrep,
      evaluatePre: evalBody.pre.lines,
      evaluateLoop: evalBody.loop.lines,
      evaluateRoot: rootValue.value,
      jacobianPre: jacBody.pre.lines,
      jacobianLoop: jacBody.loop.lines,
      jacobianRoot:
        rootJac === undefined
          ? undefined
          : { value: rootJac.value, tangents: Array.from({ length: counts.params }, (_, j) => rootJac.tangents.get(j)) },
      boolean,
    });
    return { source, functions: this.fnList, counts: { hoistedVectors: this.nH, hoistedScalars: this.nC, jacobianLogs: this.nG } };
  }

  params(node: ExprNode): readonly number[] {
    return this.facts.get(node)!.params;
  }

  temp(): string {
    return `t${this.temps++}`;
  }

  fnRef(name: string): string {
    let k = this.fnSlots.get(name);
    if (k === undefined) {
      const spec = this.fns.get(name);
      if (spec === undefined) throw new RangeError(`codegen: unknown function ${name}`);
      k = this.fnList.length;
      this.fnList.push(spec.evaluate);
      this.fnSlots.set(name, k);
    }
    return `f${k}`;
  }

  /** ln of a power's base: folded, hoisted (once per bind, or once per row on first Jacobian), or inline. */
  logOf(base: ExprNode, u: Entry, ctx: Sink): string {
    const known = this.logs.get(base);
    if (known !== undefined) return known;
    const home = this.facts.get(base)!.home;
    const role = base.type === 'name' ? this.slotOf(base.name).role : undefined;
    let ref: string;
    if (u.constant !== undefined) {
      ref = literal(Math.log(u.constant));
    } else if (this.hoist && (home === 'bindScalar' || role === 'scalar')) {
      ref = `c${this.nC}`;
      this.bindScalar.lines.push(`const ${ref} = Math.log(${u.value}); C[${this.nC++}] = ${ref};`);
    } else if (this.hoist && (home === 'bindVector' || role === 'vector')) {
      const k = this.nG++;
      this.jacobianPrep.push(`g${k}[i] = Math.log(${u.value});`);
      ref = `g${k}[i]`;
    } else {
      ref = this.temp();
      ctx.lines.push(`const ${ref} = Math.log(${u.value});`);
      return ref; // an inline logarithm belongs to one body: not shared
    }
    this.logs.set(base, ref);
    return ref;
  }

  /** The entry of a node as seen from `ctx`, computing it (or its hoisted copy) where it belongs. */
  private entry(node: ExprNode, ctx: Sink, body: Body | undefined): Entry {
    const f = this.facts.get(node)!;
    switch (f.home) {
      case 'leaf':
        return this.leaf(node);
      case 'const': {
        const v = evaluateNode(node, () => undefined, this.fns);
        return { value: literal(v), tangents: NO_TANGENTS, constant: v };
      }
      case 'bindScalar':
        return ctx.kind === 'bindScalar' ? this.compute(node, ctx, body) : this.hoistScalar(node);
      case 'bindVector':
        return ctx.kind === 'bindVector' ? this.compute(node, ctx, body) : this.hoistVector(node);
      case 'call':
        return this.compute(node, ctx.kind === 'call' ? ctx : body!.pre, body);
      case 'inline':
        return this.compute(node, ctx, body);
    }
  }

  private leaf(node: ExprNode): Entry {
    if (node.type === 'num' || node.type === 'const') return { value: literal(node.value), tangents: NO_TANGENTS, constant: node.value };
    if (node.type !== 'name') throw new RangeError('codegen: not a leaf');
    const slot = this.slotOf(node.name);
    if (slot.role === 'vector') return { value: `v${slot.index}[i]`, tangents: NO_TANGENTS };
    if (slot.role === 'scalar') return { value: `s${slot.index}`, tangents: NO_TANGENTS };
    return { value: `p${slot.index}`, tangents: new Map([[slot.index, '1']]) };
  }

  private hoistScalar(node: ExprNode): Entry {
    let name = this.hoisted.get(node);
    if (name === undefined) {
      const e = this.compute(node, this.bindScalar, undefined);
      name = `c${this.nC}`;
      this.bindScalar.lines.push(`const ${name} = ${e.value}; C[${this.nC++}] = ${name};`);
      this.hoisted.set(node, name);
    }
    return { value: name, tangents: NO_TANGENTS };
  }

  private hoistVector(node: ExprNode): Entry {
    let ref = this.hoisted.get(node);
    if (ref === undefined) {
      const e = this.compute(node, this.bindVector, undefined);
      const k = this.nH++;
      this.bindVector.lines.push(`h${k}[i] = ${e.value};`);
      ref = `h${k}[i]`;
      this.hoisted.set(node, ref);
    }
    return { value: ref, tangents: NO_TANGENTS };
  }

  /** Computes a node in `ctx`: its value, then (in a body with tangents) its derivatives. */
  private compute(node: ExprNode, ctx: Sink, body: Body | undefined): Entry {
    const memo = ctx.memo.get(node);
    if (memo !== undefined) return memo;
    const kids = childrenOf(node).map((c) => this.entry(c, ctx, body));
    const t = this.temp();
    ctx.lines.push(`const ${t} = ${this.valueCode(node, kids)};`);
    const params = this.params(node);
    const tangents = new Map<number, string>();
    if (body?.tangents === true && params.length > 0) {
      const rule = tangentRule(node, kids, t, ctx, this);
      for (const j of params) {
        const name = `${t}_${j}`;
        ctx.lines.push(`const ${name} = ${rule(j) ?? '0'};`);
        tangents.set(j, name);
      }
    }
    const e: Entry = { value: t, tangents };
    ctx.memo.set(node, e);
    return e;
  }

  private valueCode(node: ExprNode, kids: readonly Entry[]): string {
    const a = kids[0]?.value ?? '';
    const b = kids[1]?.value ?? '';
    switch (node.type) {
      case 'unary':
        return node.op === 'neg' ? `-${a}` : `!${a}`;
      case 'call':
        return `${this.fnRef(node.fn)}(${kids.map((k) => k.value).join(', ')})`;
      case 'binary':
        return binaryCode(node, a, b);
      default:
        throw new RangeError('codegen: a leaf has no value code');
    }
  }
}
