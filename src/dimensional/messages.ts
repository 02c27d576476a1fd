/**
 * Every message of the dimensional-analysis engine, in one place so that the same situation is
 * always described the same way. Messages never carry positions (those travel in SourceSpans).
 */

/** Stable error kinds (InputError.kind) and warning codes of this stage. */
export const GROUPS_ERROR = {
  duplicateName: 'groups-duplicate-name',
  unknownName: 'groups-unknown-name',
  noVariables: 'groups-no-variables',
  kindUnknown: 'groups-kind-unknown',
  kindDimension: 'groups-kind-dimension',
  repeatCount: 'groups-repeat-count',
  repeatDependent: 'groups-repeat-dependent',
  repeatResponse: 'groups-repeat-response',
  repeatDimensionless: 'groups-repeat-dimensionless',
  responseAlone: 'groups-response-alone',
} as const;

export const GROUPS_WARNING = {
  incomplete: 'groups-incomplete',
  dependent: 'groups-dependent',
} as const;

const list = (names: readonly string[]): string =>
  names.length <= 1 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;

export const groupsMessages = {
  list,
  duplicateName: (name: string): string => `the variable ${name} is given twice; each variable needs one name`,
  unknownName: (what: string, name: string, known: readonly string[]): string =>
    `${what} ${name} is not one of the variables (${list(known)})`,
  noVariables: (): string => 'no variables: give at least two, e.g. --var dp=Pa --var rho=kg/m^3',
  kindUnknown: (kind: string, choices: readonly string[]): string =>
    `unknown kind '${kind}'` + (choices.length > 0 ? `; for this dimension the kinds are ${list(choices)}` : ''),
  kindDimension: (name: string, kind: string, kindDim: string, dim: string): string =>
    `${name} cannot be of kind '${kind}' (dimension ${kindDim}): ${name} is ${dim}`,
  repeatCount: (given: number, rank: number, problem: string): string =>
    `${given} repeating variable${given === 1 ? '' : 's'} given, but the dimensional matrix has rank ${rank}: ` +
    `exactly ${rank} are needed (one per independent dimension). ${problem}`,
  repeatTooFew: (missing: readonly string[]): string =>
    `They cannot make the dimension of ${missing.join(', ')}: add a repeating variable that carries it.`,
  repeatTooMany: (): string => 'With more, they cannot be independent: drop one.',
  repeatDependent: (names: readonly string[], product: string): string =>
    `the repeating variables ${list(names)} are not dimensionally independent: ${product} is dimensionless, ` +
    `so together they cannot fix every dimension; replace one of them`,
  repeatResponse: (name: string): string =>
    `the response ${name} cannot be a repeating variable: it would appear in every group; ` +
    'choose the repeating variables among the others',
  repeatDimensionless: (name: string): string =>
    `${name} is dimensionless: it is a group by itself and cannot be a repeating variable`,
  responseAlone: (name: string, others: string): string =>
    `no dimensionless group can contain the response ${name}: ${others}. ` +
    'Add the variable that carries that dimension, or check the units',
  incomplete: (name: string): string =>
    `${name} is varied in the data but appears in no group, so its effect cannot show in the correlation: ` +
    `add a group that contains ${name}, or hold it constant`,
  dependent: (group: string, relation: string): string =>
    `group ${group} is a product of powers of the other groups (${relation}, up to a constant factor): ` +
    'its exponent in a fit cannot be told apart from theirs; drop it or replace it',
  constantGroup: (group: string): string =>
    `group ${group} is a constant (its variables cancel): it carries no information for a fit`,
};
