import { mkdtempSync, readdirSync, rmSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { memoryIo } from '../../src/cli/io.js';
import { runCli } from '../../src/cli/run.js';

/** A fresh temporary folder holding the given files (name -> text); removed by `remove()`. */
export function tmpFolder(files: Record<string, string | Uint8Array> = {}) {
  const root = mkdtempSync(join(tmpdir(), 'similis-test-'));
  for (const [name, content] of Object.entries(files)) {
    mkdirSync(dirname(join(root, name)), { recursive: true });
    writeFileSync(join(root, name), content);
  }
  return {
    root,
    path: (name: string) => join(root, name),
    /** Every file name in the folder (hidden temporary files included). */
    list: () => readdirSync(root).sort(),
    remove: () => rmSync(root, { recursive: true, force: true }),
    /** Runs `similis` in-process with this folder as the working folder. */
    run: async (...argv: string[]) => {
      const io = memoryIo(root);
      const code = await runCli(argv, io);
      return { code, out: io.out.join(''), err: io.err.join('') };
    },
  };
}
