import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/**
 * Builds dist/ once before the tests, so that the end-to-end tests run the real `similis`
 * binary as a user would, from a fresh clone, with `npm test` alone. Type errors do not stop the
 * build here (tsc still emits); `npm test` reports them in its type-check step.
 */
export default function setup(): void {
  const root = fileURLToPath(new URL('..', import.meta.url));
  const tsc = fileURLToPath(new URL('../node_modules/typescript/bin/tsc', import.meta.url));
  const r = spawnSync(process.execPath, [tsc, '-p', 'tsconfig.build.json'], { cwd: root, encoding: 'utf8' });
  if (r.status !== 0) {
    process.stderr.write(`global-setup: the build reported errors (end-to-end tests may fail):\n${r.stdout}${r.stderr}\n`);
  }
  // The second build step (as in `npm run build`): the help text printed by `similis --help`.
  const h = spawnSync(process.execPath, ['scripts/write-help.mjs'], { cwd: root, encoding: 'utf8' });
  if (h.status !== 0) process.stderr.write(`global-setup: scripts/write-help.mjs failed:\n${h.stderr}\n`);
}
