import { InputError } from '../common/errors.js';
import { describeDimension } from '../units/index.js';
import type { ClassifiedVariable } from './classify.js';
import { primitiveIntegerVector } from './integers.js';
import { combinationOf, nullSpace } from './linear.js';
import { columnOf, matrixRank, type DimensionalMatrix } from './matrix.js';
import { GROUPS_ERROR, groupsMessages } from './messages.js';
import { formatProduct } from './product-format.js';
import { recogniseGroup } from './recognise.js';

/**
 * Repeating variables (the "method of repeating variables", Buckingham 1914): r variables that
 * are dimensionally independent and span the problem's dimensions, r the rank. Each other
 * variable forms one group with them, so a variable outside the set appears in exactly one group.
 *
 * A user's choice is checked and refused with the reason. The automatic choice considers every
 * valid set without the response (in the order of the kinds' `preference`: a density, then a
 * velocity or flow rate, a rotational speed, a diameter, other lengths, a viscosity, ...) and
 * the caller keeps the one whose groups it recognises best (see groups.ts).
 */

/** At most this many valid sets are considered by the automatic choice. */
export const MAX_CANDIDATE_SETS = 400;

/**
 * Checks a user's repeating variables and returns their column indices.
 * @throws {InputError} 'groups-unknown-name' (not a variable), 'groups-duplicate-name' (listed
 *   twice), 'groups-repeat-response' (the response among them), 'groups-repeat-dimensionless',
 *   'groups-repeat-dependent' (a product of them is dimensionless; the message shows it),
 *   'groups-repeat-count' (not as many as the rank; the message says which dimension is missing).
 * @example checkRepeating(m, vars, ['rho', 'U', 'D'], 'dp') // => [1, 5, 3]
 */
export function checkRepeating(
  m: DimensionalMatrix,
  variables: readonly ClassifiedVariable[],
  names: readonly string[],
  response: string | undefined,
): number[] {
  const indices: number[] = [];
  for (const name of names) {
    const i = m.variables.indexOf(name);
    if (i < 0) {
      throw new InputError(GROUPS_ERROR.unknownName, groupsMessages.unknownName('the repeating variable', name, m.variables));
    }
    if (indices.includes(i)) {
      throw new InputError(GROUPS_ERROR.duplicateName, `the repeating variable ${name} is listed twice`);
    }
    if (name === response) throw new InputError(GROUPS_ERROR.repeatResponse, groupsMessages.repeatResponse(name));
    if (variables[i]!.dimension.isDimensionless()) {
      throw new InputError(GROUPS_ERROR.repeatDimensionless, groupsMessages.repeatDimensionless(name));
    }
    indices.push(i);
  }
  const rank = matrixRank(m);
  if (matrixRank(m, indices) < indices.length) {
    const sub = m.entries.map((row) => indices.map((j) => row[j]!));
    const raw = primitiveIntegerVector(nullSpace(sub, indices.length)[0]!);
    const first = raw.find((e) => !e.isZero())!;
    const v = first.sign() < 0 ? raw.map((e) => e.neg()) : raw;
    const exponents = new Map(indices.map((j, k) => [names[k]!, v[k]!] as const).filter(([, e]) => !e.isZero()));
    const kinds = new Map(indices.map((j) => [variables[j]!.name, variables[j]!.kind] as const));
    const named = recogniseGroup(exponents, kinds);
    const product = formatProduct(exponents) + (named?.type === 'named' ? ` (a ${named.name})` : '');
    throw new InputError(GROUPS_ERROR.repeatDependent, groupsMessages.repeatDependent(names, product));
  }
  if (indices.length !== rank) {
    const problem =
      indices.length > rank ? groupsMessages.repeatTooMany() : tooFewReason(m, variables, indices);
    throw new InputError(GROUPS_ERROR.repeatCount, groupsMessages.repeatCount(indices.length, rank, problem));
  }
  return indices;
}

/** Which variables the chosen ones cannot make the dimension of (for the message). */
function tooFewReason(m: DimensionalMatrix, variables: readonly ClassifiedVariable[], chosen: readonly number[]): string {
  const columns = chosen.map((j) => columnOf(m, j));
  const unreachable = variables
    .map((v, j) => ({ v, j }))
    .filter(({ j }) => !chosen.includes(j) && combinationOf(columns, columnOf(m, j)) === undefined)
    .slice(0, 3);
  return groupsMessages.repeatTooFew(unreachable.map(({ v }) => `${v.name} (${describeDimension(v.dimension)})`));
}

/**
 * Every valid repeating set (rank-many independent columns, response and dimensionless variables
 * excluded), most preferred kinds first, at most MAX_CANDIDATE_SETS.
 * @throws {InputError} 'groups-response-alone' when no valid set leaves the response out (it
 *   alone carries some dimension, so no group can contain it).
 * @example candidateRepeatingSets(pipe, vars, 'dp')[0] // => indices of rho, U, D
 */
export function candidateRepeatingSets(
  m: DimensionalMatrix,
  variables: readonly ClassifiedVariable[],
  response: string | undefined,
): number[][] {
  const rank = matrixRank(m);
  const eligible = variables
    .map((v, j) => ({ v, j }))
    .filter(({ v }) => v.name !== response && !v.dimension.isDimensionless())
    .sort((a, b) => a.v.kind.preference - b.v.kind.preference || a.j - b.j)
    .map(({ j }) => j);
  const found: number[][] = [];
  const pick: number[] = [];
  const walk = (start: number): void => {
    if (found.length >= MAX_CANDIDATE_SETS) return;
    if (pick.length === rank) {
      if (matrixRank(m, pick) === rank) found.push([...pick]);
      return;
    }
    for (let k = start; k <= eligible.length - (rank - pick.length); k++) {
      pick.push(eligible[k]!);
      if (matrixRank(m, pick) === pick.length) walk(k + 1);
      pick.pop();
    }
  };
  walk(0);
  if (found.length === 0 && response !== undefined && rank > 0) {
    const r = variables.find((v) => v.name === response)!;
    const others = `the other variables together cannot make its dimension, ${describeDimension(r.dimension)}`;
    throw new InputError(GROUPS_ERROR.responseAlone, groupsMessages.responseAlone(response, others));
  }
  return found;
}
