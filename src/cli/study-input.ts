import { stat } from 'node:fs/promises';
import { resolve } from 'node:path';
import { InputError } from '../common/errors.js';
import { applyStudyFlags, DATA_ERROR, emptyStudy, loadStudy, STUDY_MAX_BYTES, type Delimiter, type Study } from '../data/index.js';
import { REDUCE_ERROR, reduceMessages } from '../reduce/index.js';
import type { CommandContext } from './context.js';
import { readInputText } from './reduce-inputs.js';

/**
 * The study side of the commands that read rig files (reduce, fit): the study file named by
 * --study (size-limited, validated) with the --const/--derive/--group flags applied, and the
 * --delimiter option.
 */

/** The options every study-reading command shares. */
export interface StudyOptions {
  readonly study?: string;
  readonly const?: readonly string[];
  readonly derive?: readonly string[];
  readonly group?: readonly string[];
  readonly delimiter?: string;
}

export async function studyFor(ctx: CommandContext, opts: StudyOptions): Promise<{ study: Study; studyPath: string | null }> {
  let study = emptyStudy();
  let studyPath: string | null = null;
  if (opts.study !== undefined) {
    studyPath = resolve(ctx.io.cwd, opts.study);
    const s = await stat(studyPath).catch(() => undefined);
    if (s === undefined || !s.isFile()) throw new InputError('file-not-found', `no such study file: ${opts.study}; give the path of an existing study file (YAML)`, { file: opts.study });
    if (s.size > STUDY_MAX_BYTES) {
      throw new InputError(DATA_ERROR.studyLimits, `the study file is ${s.size} bytes long; the limit is ${STUDY_MAX_BYTES}`, { file: opts.study });
    }
    study = loadStudy(await readInputText(studyPath, opts.study), opts.study, ctx.warnings);
  }
  study = applyStudyFlags(study, { constants: opts.const ?? [], derive: opts.derive ?? [], group: opts.group ?? [] }, ctx.warnings);
  if (study.derived.length === 0 && study.groups.length === 0) {
    throw new InputError(REDUCE_ERROR.nothing, reduceMessages.nothing(), { file: opts.study ?? 'command line' });
  }
  return { study, studyPath };
}

export function delimiterOption(text: string | undefined): Delimiter | undefined {
  if (text === undefined) return undefined;
  const d = { ',': ',', comma: ',', ';': ';', semicolon: ';', tab: '\t', '\t': '\t', '\\t': '\t' }[text.toLowerCase()];
  if (d === undefined) {
    throw new InputError(DATA_ERROR.delimiter, `--delimiter ${text}: expected , (comma), ; (semicolon) or tab`, { file: 'command line' });
  }
  return d as Delimiter;
}
