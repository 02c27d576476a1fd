import { InputError, type WarningSink } from '../common/errors.js';
import type { FunctionTable } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { detectDelimiter } from './cells.js';
import { parseHeader, type ParsedHeader } from './header.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import { parseMetaLine, type UncertaintyLine } from './metadata.js';
import type { Delimiter, FileComment, FileConstant, RigHead } from './table.js';
import { checkRelativeTemperature, checkUncertaintyDimension, parseUncertainty } from './uncertainty.js';
import { HASH } from './char-codes.js';

/**
 * The lines of a rig file before its first data row: `#` lines (constants, uncertainties,
 * comments), blank lines, and the header, which completes the head. Uncertainties are checked
 * once the header says which columns exist.
 */
export class HeadBuilder {
  private readonly constants: FileConstant[] = [];
  private readonly uncertaintyLines: UncertaintyLine[] = [];
  private readonly comments: FileComment[] = [];
  /** The head and the parsed header, once the header line has come. */
  result: { head: RigHead; header: ParsedHeader } | undefined;

  constructor(
    private readonly file: string,
    private readonly delimiter: Delimiter | undefined,
    private readonly sink: WarningSink,
    private readonly functions: FunctionTable = PROPERTY_FUNCTIONS,
  ) {}

  /**
   * One line before the first data row.
   * @throws {InputError} 'csv-encoding' (not text), metadata and header kinds (see parseMetaLine,
   *   parseHeader), 'csv-duplicate-name', 'csv-uncertainty-name', 'csv-uncertainty-dimension',
   *   'csv-uncertainty-relative-temperature'.
   */
  line(text: string, lineNo: number): void {
    if (text.trim() === '') return;
    if (text.includes('\uFFFD') || text.includes('\u0000')) {
      const column = Math.max(text.indexOf('\uFFFD'), text.indexOf('\u0000')) + 1;
      throw new InputError(DATA_ERROR.encoding, dataMessages.notText(), { file: this.file, line: lineNo, column });
    }
    if (text.charCodeAt(0) !== HASH) {
      this.result = this.header(text, lineNo);
      return;
    }
    const meta = parseMetaLine(text, lineNo, this.file, this.sink, this.functions);
    if (meta.kind === 'uncertainty') this.uncertaintyLines.push(meta.uncertainty);
    else if (meta.kind === 'comment') this.comments.push(meta.comment);
    else {
      const c = meta.constant;
      const earlier = this.constants.find((k) => k.name === c.name);
      if (earlier !== undefined) throw new InputError(DATA_ERROR.duplicateName, dataMessages.duplicateConstant(c.name, earlier.line), c.where);
      this.constants.push(c);
    }
  }

  private header(text: string, lineNo: number): { head: RigHead; header: ParsedHeader } {
    const delimiter = this.delimiter ?? detectDelimiter(text);
    const header = parseHeader(text, delimiter, lineNo, this.file, this.sink, this.functions);
    for (const c of this.constants) {
      const col = header.columns.find((h) => h.name === c.name);
      if (col !== undefined) {
        throw new InputError(DATA_ERROR.duplicateName, dataMessages.constantIsColumn(c.name, lineNo, col.index + 1), c.where);
      }
    }
    const uncertainties = this.uncertaintyLines.map((u) => {
      const spec = parseUncertainty(u.name, u.text, u.where, DATA_ERROR.uncertainty, this.sink);
      const unit = header.columns.find((h) => h.name === u.name)?.unit ?? this.constants.find((k) => k.name === u.name)?.unit;
      if (unit === undefined) {
        const known = [...header.columns.map((h) => h.name), ...this.constants.map((k) => k.name)];
        throw new InputError(DATA_ERROR.uncertaintyName, dataMessages.uncertaintyUnknownName(u.name, known), u.where);
      }
      checkUncertaintyDimension(spec, unit.dimension, DATA_ERROR.uncertaintyDimension);
      checkRelativeTemperature(spec, unit, DATA_ERROR.uncertaintyRelativeTemperature);
      return spec;
    });
    const head: RigHead = {
      file: this.file,
      delimiter,
      delimiterDetected: this.delimiter === undefined,
      headerLine: lineNo,
      columns: header.columns,
      constants: this.constants,
      uncertainties,
      comments: [...this.comments],
    };
    return { head, header };
  }
}
