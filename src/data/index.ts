/**
 * Rig data in: rig CSV files (a `name [unit]` header, `#` constants and uncertainties) read into
 * SI columns with every row's file line kept, and study files (YAML) validated into typed
 * studies with every formula parsed and every position kept.
 *
 *   bytes --readRigTable / readRigHead / parseRigText--> RigTable / RigHead
 *   YAML  --loadStudy (+ applyStudyFlags for --const/--derive/--group)--> Study
 *
 * The core never opens files: callers hand in chunks (a Node read stream) or text. Errors are
 * InputError with kinds from DATA_ERROR (csv-*, study-*), located by file, line and column.
 */
export { DATA_ERROR, type DataErrorKind } from './kinds.js';
export { dataMessages } from './messages.js';
export { detectDelimiter, delimiterName, positionedCells, type PositionedCell } from './cells.js';
export { explainBadNumber, isMissingMarker, MISSING_MARKERS, parseDecimal, strictDecimal } from './number-cell.js';
export { asciiText, scanDecimalBytes } from './byte-scan.js';
export { parseQuantityText, type QuantityText } from './quantity-text.js';
export { checkRelativeTemperature, checkUncertaintyDimension, parseUncertainty } from './uncertainty.js';
export { parseHeader, type ParsedHeader } from './header.js';
export { looksLikeConstant, parseMetaLine, type MetaLine, type UncertaintyLine } from './metadata.js';
export { RigReader, type ReadOptions } from './reader.js';
export { parseRigText, readRigHead, readRigTable, type Chunks } from './read.js';
export {
  columnOf,
  type ColumnHead,
  type Delimiter,
  type FileComment,
  type FileConstant,
  type MissingCell,
  type NumericColumn,
  type RigColumn,
  type RigHead,
  type RigTable,
  type TextColumn,
  type UncertaintySpec,
} from './table.js';
export { checkStudyNames, loadStudy, STUDY_KEYS } from './study.js';
export { FIT_KEYS } from './study-fit.js';
export { applyStudyFlags, emptyStudy, whereFlag, type StudyFlags } from './study-flags.js';
export { placeInside, STUDY_MAX_BYTES } from './study-yaml.js';
export type {
  FitMethod,
  FitParameter,
  FitSpec,
  Located,
  LocatedFormula,
  NamedFormula,
  Origin,
  RawNode,
  Study,
  StudyConstant,
  WeightsSpec,
} from './study-types.js';
