import { isScalar, isSeq } from 'yaml';
import { InputError, IGNORE_WARNINGS, type SourceSpan, type WarningSink } from '../common/errors.js';
import { checkUserName, type FunctionTable } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import { parseQuantityText } from './quantity-text.js';
import { readFitSection } from './study-fit.js';
import type { Located, NamedFormula, Study, StudyConstant } from './study-types.js';
import {
  formulaValue,
  mapEntries,
  parseStudyYaml,
  placeInside,
  rawNode,
  resolved,
  textValue,
  type YamlSource,
} from './study-yaml.js';
import type { UncertaintySpec } from './table.js';
import { parseUncertainty } from './uncertainty.js';

/**
 * Study files: what to compute from rig files, in YAML.
 *
 *   title: Water loop, tube A
 *   data: [runs/*.csv]                    rig files, relative to the study file
 *   constants: { D: 0.5 in, L: 1.2 m }    value and unit, converted to SI
 *   derived:   { U: 4*Q/(pi*D^2) }        dimensional intermediates, in SI
 *   groups:    { Re: rho*U*D/mu, f: dp*D/(L*0.5*rho*U^2) }   each must be dimensionless
 *   fit:       { response, model, parameters, method, weights, where, regimes, robust }
 *   compare:   [...]                      kept as written, for the handbook comparison stage
 *   uncertainty: { dp: 0.5 % + 0.02 kPa } standard uncertainties, as in a rig file's # u(...) lines
 *
 * Loading parses every formula and converts every constant, so that errors are found before any
 * data is read; names are checked against the data later (src/reduce/plan.ts).
 */

/** The keys of a study file, in the order the documentation gives them. */
export const STUDY_KEYS = ['title', 'data', 'constants', 'derived', 'groups', 'fit', 'compare', 'uncertainty'] as const;

/**
 * Reads and validates a study file's text.
 * @param file the study file name as given (used in every message)
 * @param functions what formulas may call (default: the built-in functions and the fluid
 *   properties, water_density(T)...); no name of the study may be one of them
 * @throws {InputError} 'study-yaml', 'study-limits', 'study-unknown-key' (with the nearest key),
 *   'study-type', 'study-constant', 'study-duplicate-name', 'study-fit', 'study-uncertainty',
 *   formula and unit kinds, each at the line and column of the offending text.
 * @example loadStudy('groups:\n  Re: rho*U*D/mu\n', 'study.yaml').groups[0].name // => 'Re'
 */
export function loadStudy(text: string, file: string, sink: WarningSink = IGNORE_WARNINGS, functions: FunctionTable = PROPERTY_FUNCTIONS): Study {
  const source = parseStudyYaml(text, file);
  const root = resolved(source, source.doc.contents);
  if (root === null || root === undefined || (isScalar(root) && root.value === null)) {
    throw new InputError(DATA_ERROR.studyType, dataMessages.studyNotMapping('an empty file'), { file, line: 1 });
  }
  const entries = mapEntries(source, root, 'the study file', STUDY_KEYS);
  const section = (key: string) => entries.find((e) => e.key === key);
  const study: Study = {
    file,
    title: readTitle(source, section('title')?.value),
    data: readData(source, section('data')?.value),
    constants: readConstants(source, section('constants')?.value, sink, functions),
    derived: readFormulas(source, section('derived')?.value, 'derived', functions),
    groups: readFormulas(source, section('groups')?.value, 'groups', functions),
    fit: section('fit') === undefined ? null : readFitSection(source, section('fit')!.value, section('fit')!.keyWhere, functions),
    compare: section('compare') === undefined ? null : rawNode(source, section('compare')!.value),
    uncertainty: readUncertainty(source, section('uncertainty')?.value, sink, functions),
  };
  checkStudyNames(study);
  return study;
}

function readTitle(source: YamlSource, node: unknown): string | null {
  if (node === undefined) return null;
  return textValue(source, node, 'title').text;
}

function readData(source: YamlSource, node: unknown): Located<string>[] {
  if (node === undefined) return [];
  const n = resolved(source, node);
  if (isSeq(n)) {
    return n.items.map((item) => {
      const t = textValue(source, item, 'data');
      return { value: t.text, where: t.where };
    });
  }
  if (isScalar(n) && n.value === null) return [];
  const t = textValue(source, n, 'data');
  return [{ value: t.text, where: t.where }];
}

function readConstants(source: YamlSource, node: unknown, sink: WarningSink, functions: FunctionTable): StudyConstant[] {
  return mapEntries(source, node, 'constants', null).map(({ key, keyWhere, value }) => {
    checkUserName(key, keyWhere, functions);
    const t = textValue(source, value, `constants.${key}`);
    let q;
    try {
      q = parseQuantityText(t.text, DATA_ERROR.studyConstant, sink);
    } catch (e) {
      if (e instanceof InputError) throw placeInside(e, t.where, t.exact);
      throw e;
    }
    return { name: key, valueSI: q.valueSI, text: t.text.trim(), unit: q.unit, where: keyWhere, origin: 'study' as const };
  });
}

function readFormulas(source: YamlSource, node: unknown, section: 'derived' | 'groups', functions: FunctionTable): NamedFormula[] {
  return mapEntries(source, node, section, null).map(({ key, keyWhere, value }) => {
    checkUserName(key, keyWhere, functions);
    const { formula, where, columnsExact } = formulaValue(source, value, `${section}.${key}`, functions);
    return { name: key, formula, where, columnsExact, nameWhere: keyWhere, origin: 'study' as const };
  });
}

function readUncertainty(source: YamlSource, node: unknown, sink: WarningSink, functions: FunctionTable): UncertaintySpec[] {
  return mapEntries(source, node, 'uncertainty', null).map(({ key, keyWhere, value }) => {
    checkUserName(key, keyWhere, functions);
    const t = textValue(source, value, `uncertainty.${key}`);
    return parseUncertainty(key, t.text, t.where, DATA_ERROR.studyUncertainty, sink);
  });
}

/**
 * Refuses a name given twice across constants, derived quantities, groups and fit parameters
 * (also after command-line flags were added to a study).
 * @throws {InputError} 'study-duplicate-name' at the second definition, naming the first.
 * @example checkStudyNames(studyWithDTwice) // throws study-duplicate-name
 */
export function checkStudyNames(study: Study): void {
  const seen = new Map<string, string>();
  const add = (name: string, what: string, where: SourceSpan) => {
    const first = seen.get(name);
    if (first !== undefined) throw new InputError(DATA_ERROR.studyDuplicateName, dataMessages.duplicateStudyName(name, first, what), where);
    seen.set(name, `${what}${where.line === undefined ? '' : ` (line ${where.line})`}`);
  };
  for (const c of study.constants) add(c.name, 'a constant', c.where);
  for (const d of study.derived) add(d.name, 'a derived quantity', d.nameWhere);
  for (const g of study.groups) add(g.name, 'a group', g.nameWhere);
  for (const p of study.fit?.parameters ?? []) add(p.name, 'a fit parameter', p.where);
}
