import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * The script text an interactive report inlines: vega's own browser build (build/vega.min.js of
 * the pinned vega package) and vega's expression interpreter (the vega-interpreter package), so
 * that the page runs with a Content-Security-Policy that forbids eval: vega then evaluates its
 * expressions by walking their syntax tree instead of compiling them with `new Function`.
 *
 * The interpreter ships only as an ES module importing three names from vega-util; the browser
 * build of vega exposes the same names on the global `vega`, so the import line is replaced by a
 * read from that global and the export by a global of our own (`similisExprInterpreter`).
 *
 * @throws {Error} when either package no longer has the expected shape (an internal fault).
 */
export async function vegaRuntime(): Promise<string> {
  const vegaDir = dirname(fileURLToPath(import.meta.resolve('vega')));
  const vega = await readFile(join(vegaDir, 'vega.min.js'), 'utf8');
  const interpreterFile = fileURLToPath(import.meta.resolve('vega-interpreter'));
  const source = await readFile(interpreterFile, 'utf8');
  const importLine = /^import \{([\w\s,]+)\} from 'vega-util';$/m;
  const exportLine = /^export \{ expression as expressionInterpreter \};$/m;
  if (!importLine.test(source) || !exportLine.test(source)) {
    throw new Error(`vega-runtime: ${interpreterFile} does not have the expected import/export lines`);
  }
  const interpreter = source.replace(importLine, 'var {$1} = vega;').replace(exportLine, 'globalThis.similisExprInterpreter = expression;');
  return `${vega}\n;(function () {\n${interpreter}\n})();`;
}
