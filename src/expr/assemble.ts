/**
 * Puts the pieces of generated code together into the body of a factory
 * `(V, S, F, n) => { evaluate(P, out), jacobian(P, out, J) }`:
 *
 *   slot locals (v0 = V[0], s0 = S[0], f0 = F[0])
 *   bind-time code: hoisted constants into C, hoisted columns into H (one loop over the rows)
 *   prepareJacobian(): columns only the Jacobian needs (ln of data bases), computed on first use
 *   evaluate(P, out):     parameter locals, per-call code, one loop over the rows
 *   jacobian(P, out, J):  the same with derivatives, J column-major (J[j*n + i])
 *   jacobianRows(P, from, to, out, at, J, ld): rows from..to-1 only, values at out[at + r] and
 *                         derivatives at J[j*ld + r] (r = i - from): a block of rows that a
 *                         caller consumes while it is in cache (the fit's row-block QR)
 *
 * Every function re-declares the slots it reads as locals, so that the row loops read locals only.
 */

export interface SourceParts {
  readonly vectors: number;
  readonly scalars: number;
  readonly params: number;
  readonly functions: number;
  readonly hoistedScalars: number;
  readonly hoistedVectors: number;
  readonly jacobianColumns: number;
  readonly bindScalarLines: readonly string[];
  readonly bindVectorLines: readonly string[];
  readonly jacobianPrepLines: readonly string[];
  readonly evaluatePre: readonly string[];
  readonly evaluateLoop: readonly string[];
  readonly evaluateRoot: string;
  readonly jacobianPre: readonly string[];
  readonly jacobianLoop: readonly string[];
  /** Root value and its derivative per parameter (undefined: identically zero); absent for a true/false formula. */
  readonly jacobianRoot: { readonly value: string; readonly tangents: readonly (string | undefined)[] } | undefined;
  readonly boolean: boolean;
}

const range = (k: number, f: (i: number) => string) => Array.from({ length: k }, (_, i) => f(i));
const decl = (items: string[]) => (items.length > 0 ? `const ${items.join(', ')};` : '');
const loop = (lines: readonly string[]) => ['for (let i = 0; i < n; i++) {', ...lines.map((l) => `  ${l}`), '}'];
const rowLoop = (lines: readonly string[]) => ['for (let i = from, r = 0; i < to; i++, r++) {', ...lines.map((l) => `  ${l}`), '}'];

/** The factory body as one string. */
export function assembleSource(p: SourceParts): string {
  const bound = [decl(range(p.hoistedScalars, (k) => `c${k} = C[${k}]`)), decl(range(p.hoistedVectors, (k) => `h${k} = H[${k}]`))];
  const params = decl(range(p.params, (k) => `p${k} = P[${k}]`));
  const store = (v: string) => (p.boolean ? `out[i] = ${v} ? 1 : 0;` : `out[i] = ${v};`);
  const zeroColumns: string[] = [];
  const jacobianStores: string[] = [];
  const rowZeroColumns: string[] = [];
  const rowStores: string[] = [];
  if (p.jacobianRoot !== undefined) {
    jacobianStores.push(store(p.jacobianRoot.value));
    rowStores.push(`out[at + r] = ${p.jacobianRoot.value};`);
    p.jacobianRoot.tangents.forEach((t, j) => {
      if (t === undefined) {
        zeroColumns.push(`J.fill(0, ${j} * n, ${j + 1} * n);`);
        rowZeroColumns.push(`J.fill(0, ${j} * ld, ${j} * ld + to - from);`);
      } else {
        jacobianStores.push(`J[${j} * n + i] = ${t};`);
        rowStores.push(`J[${j} * ld + r] = ${t};`);
      }
    });
  }
  const jacobianHead = [
    'if (!jacobianReady) prepareJacobian();',
    ...bound,
    decl(range(p.jacobianColumns, (k) => `g${k} = G[${k}]`)),
    params,
    ...p.jacobianPre,
  ];
  return [
    '"use strict";',
    decl(range(p.vectors, (k) => `v${k} = V[${k}]`)),
    decl(range(p.scalars, (k) => `s${k} = S[${k}]`)),
    decl(range(p.functions, (k) => `f${k} = F[${k}]`)),
    `const C = new Float64Array(${p.hoistedScalars});`,
    'const H = [];',
    'const G = [];',
    'let jacobianReady = false;',
    ...p.bindScalarLines,
    ...range(p.hoistedVectors, (k) => `const h${k} = new Float64Array(n); H.push(h${k});`),
    ...(p.hoistedVectors > 0 ? loop(p.bindVectorLines) : []),
    'function prepareJacobian() {',
    ...bound,
    ...range(p.jacobianColumns, (k) => `const g${k} = new Float64Array(n); G.push(g${k});`),
    ...(p.jacobianColumns > 0 ? loop(p.jacobianPrepLines) : []),
    'jacobianReady = true;',
    '}',
    'function evaluate(P, out) {',
    ...bound,
    params,
    ...p.evaluatePre,
    ...loop([...p.evaluateLoop, store(p.evaluateRoot)]),
    'return out;',
    '}',
    'function jacobian(P, out, J) {',
    ...jacobianHead,
    ...zeroColumns,
    ...(p.jacobianRoot === undefined ? [] : loop([...p.jacobianLoop, ...jacobianStores])),
    '}',
    'function jacobianRows(P, from, to, out, at, J, ld) {',
    ...jacobianHead,
    ...rowZeroColumns,
    ...(p.jacobianRoot === undefined ? [] : rowLoop([...p.jacobianLoop, ...rowStores])),
    '}',
    'return { evaluate, jacobian, jacobianRows };',
  ]
    .filter((l) => l !== '')
    .join('\n');
}
