import { InputError } from '../common/errors.js';
import type { Rational } from '../common/rational.js';
import { classifyVariable, type ClassifiedVariable, type VariableInput } from './classify.js';
import { relatedNamedGroups, type RelatedGroup } from './related.js';
import { absentVariables, type AbsentVariable } from './absent.js';
import { dimensionalMatrix, matrixRank, type DimensionalMatrix } from './matrix.js';
import { GROUPS_ERROR, groupsMessages } from './messages.js';
import { compareScores, groupsForRepeating, scoreOf, type RawGroup, type SetScore } from './pi-set.js';
import { formatProduct, relationText } from './product-format.js';
import type { Recognition } from './recognise.js';
import { candidateRepeatingSets, checkRepeating } from './repeating.js';

/**
 * Buckingham Pi analysis of a list of variables: the dimensional matrix, its rank, a set of
 * n - rank independent dimensionless groups with small integer exponents, each recognised
 * against the catalogue of named groups where it can be, and the named groups that the set can
 * form besides.
 *
 *   variables --classify--> kinds --dimensionalMatrix--> matrix, rank
 *     --checkRepeating (user) | candidateRepeatingSets + best score (automatic)--> repeating set
 *     --groupsForRepeating--> groups (null-space basis, integers, recognised, oriented)
 *     --relatedNamedGroups--> other named groups as products of these
 */

export interface GroupsOptions {
  /** The measured result: it stays out of the repeating set and appears in one group only. */
  readonly response?: string;
  /** The user's repeating variables; checked, and refused with a reason when invalid. */
  readonly repeating?: readonly string[];
}

export interface PiGroup {
  /** A formula-safe name, unique in the set: the named symbol ('Re', 'L_D') or 'Pi2'. */
  readonly key: string;
  /** The variable outside the repeating set that defines this group. */
  readonly defining: string;
  /** Small integer exponents, non-zero only, in display order. */
  readonly exponents: ReadonlyMap<string, Rational>;
  /** The group in formula syntax: 'rho*U*D/mu'. */
  readonly formula: string;
  readonly recognition: Recognition | null;
  /** How the group relates to the named one: '(pi/4)*Re', 'Fr^2'; null when not a named group. */
  readonly relation: string | null;
  /** The named group in usual form ('4*rho*Q/(pi*D*mu)'), else the formula: for a study file. */
  readonly studyFormula: string;
  readonly isResponse: boolean;
}

/** Another valid repeating set and what its groups are. */
export interface AlternativeSet {
  readonly repeating: readonly string[];
  /** One label per group: 'Fr^2', 'rho_p/rho', or the formula when unrecognised. */
  readonly groups: readonly string[];
}

export interface GroupAnalysis {
  readonly variables: readonly ClassifiedVariable[];
  readonly matrix: DimensionalMatrix;
  readonly rank: number;
  readonly response: string | null;
  readonly repeating: readonly string[];
  readonly chosenBy: 'user' | 'preference';
  readonly groups: readonly PiGroup[];
  /** Variables that no dimensionless group can contain, with the reason. */
  readonly absent: readonly AbsentVariable[];
  /** Named groups not in the set that are products of its groups (Darcy f = 2*Eu/L_D). */
  readonly related: readonly RelatedGroup[];
  /** Other repeating sets with differently recognised groups (at most three). */
  readonly alternatives: readonly AlternativeSet[];
}

/**
 * Finds the dimensionless groups of a problem (Buckingham Pi theorem; the count is n - rank of
 * the dimensional matrix, check-values.md 5.1), in exact rational arithmetic.
 * @throws {InputError} 'groups-no-variables', 'groups-duplicate-name', 'groups-unknown-name'
 *   (response), the kind errors of classifyVariable, the repeating-set errors of checkRepeating,
 *   'groups-response-alone'.
 * @example findGroups([dp Pa, rho kg/m^3, mu Pa*s, D m, L m, U m/s], { response: 'dp' }).groups.map((g) => g.formula)
 * // => ['dp/(rho*U^2)', 'rho*U*D/mu', 'L/D']
 */
export function findGroups(inputs: readonly VariableInput[], options: GroupsOptions = {}): GroupAnalysis {
  if (inputs.length === 0) throw new InputError(GROUPS_ERROR.noVariables, groupsMessages.noVariables());
  const seen = new Set<string>();
  for (const v of inputs) {
    if (seen.has(v.name)) throw new InputError(GROUPS_ERROR.duplicateName, groupsMessages.duplicateName(v.name));
    seen.add(v.name);
  }
  const response = options.response;
  if (response !== undefined && !seen.has(response)) {
    throw new InputError(GROUPS_ERROR.unknownName, groupsMessages.unknownName('the response', response, [...seen]));
  }
  const variables = inputs.map(classifyVariable);
  const kinds = new Map(variables.map((v) => [v.name, v.kind] as const));
  const matrix = dimensionalMatrix(variables);
  const rank = matrixRank(matrix);

  const cache = new Map<string, Recognition | null>();
  const evaluate = (set: readonly number[]): { set: readonly number[]; groups: RawGroup[]; score: SetScore } => {
    const groups = groupsForRepeating(matrix, variables, kinds, set, response, cache);
    return { set, groups, score: scoreOf(groups, set.map((j) => variables[j]!.kind)) };
  };
  const user = options.repeating === undefined ? undefined : checkRepeating(matrix, variables, options.repeating, response);
  const ranked = candidateRepeatingSets(matrix, variables, response)
    .map(evaluate)
    .map((c, i) => ({ ...c, i }))
    .sort((a, b) => compareScores(a.score, b.score) || a.i - b.i);
  const chosen = user === undefined ? ranked[0]! : evaluate(user);
  const groups = finishGroups(chosen.groups, variables, response);
  return {
    variables,
    matrix,
    rank,
    response: response ?? null,
    repeating: chosen.set.map((j) => variables[j]!.name),
    chosenBy: user === undefined ? 'preference' : 'user',
    groups,
    absent: absentVariables(matrix, variables),
    related: relatedNamedGroups(groups, variables, kinds),
    alternatives: alternativesTo(chosen, ranked, variables),
  };
}

/** Keys, formulas and relations for the groups of the chosen set. */
function finishGroups(raw: readonly RawGroup[], variables: readonly ClassifiedVariable[], response: string | undefined): PiGroup[] {
  const taken = new Set(variables.map((v) => v.name));
  return raw.map((g, i) => {
    const rec = g.recognition;
    const key = rec?.type === 'input' ? rec.symbol : uniqueKey(rec?.symbol ?? `Pi${i + 1}`, taken);
    const formula = formatProduct(g.exponents);
    return {
      key,
      defining: g.defining,
      exponents: g.exponents,
      formula,
      recognition: rec,
      relation: rec?.type === 'named' ? relationText(rec.symbol, rec.power, rec.factor) : null,
      studyFormula: rec === null ? formula : formatProduct(rec.named.exponents, rec.named.coefficient),
      isResponse: g.defining === response,
    };
  });
}

function uniqueKey(base: string, taken: Set<string>): string {
  let key = base;
  for (let k = 2; taken.has(key); k++) key = `${base}_${k}`;
  taken.add(key);
  return key;
}

/** Up to three other sets whose groups are recognised differently from the chosen set's. */
function alternativesTo(
  chosen: { set: readonly number[]; groups: readonly RawGroup[] },
  ranked: readonly { set: readonly number[]; groups: readonly RawGroup[] }[],
  variables: readonly ClassifiedVariable[],
): AlternativeSet[] {
  // A name that two groups of one set share (Re on D and Re on L) is followed by its formula.
  const labelsOf = (groups: readonly RawGroup[]): string[] => {
    const names = groups.map((g) => (g.recognition?.type === 'named' ? relationText(g.recognition.symbol, g.recognition.power, g.recognition.factor) : null));
    return groups.map((g, k) => {
      const name = names[k];
      if (name === null || name === undefined) return formatProduct(g.exponents);
      return names.filter((x) => x === name).length > 1 ? `${name} = ${formatProduct(g.exponents)}` : name;
    });
  };
  const signature = (labels: readonly string[]): string => [...labels].sort().join('|');
  const seen = new Set([signature(labelsOf(chosen.groups))]);
  const out: AlternativeSet[] = [];
  for (const c of ranked) {
    if (out.length >= 3) break;
    const labels = labelsOf(c.groups);
    const sig = signature(labels);
    if (seen.has(sig)) continue;
    seen.add(sig);
    out.push({ repeating: c.set.map((j) => variables[j]!.name), groups: labels });
  }
  return out;
}
