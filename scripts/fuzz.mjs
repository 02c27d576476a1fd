// npm run fuzz: the fuzz tests of test/fuzz with 20 times the cases of `npm test` (about 250,000),
// or SIMILIS_FUZZ_RUNS=<n> times; SIMILIS_SEED=<integer> explores another seed.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const vitest = fileURLToPath(new URL('../node_modules/vitest/vitest.mjs', import.meta.url));
const env = { ...process.env, SIMILIS_FUZZ_RUNS: process.env.SIMILIS_FUZZ_RUNS ?? '20' };
process.stderr.write(`fuzz: SIMILIS_FUZZ_RUNS=${env.SIMILIS_FUZZ_RUNS}, SIMILIS_SEED=${env.SIMILIS_SEED ?? '(test/seed.ts)'}\n`);
const r = spawnSync(process.execPath, [vitest, 'run', 'test/fuzz', '--testTimeout=0'], { cwd: root, env, stdio: 'inherit' });
process.exitCode = r.status ?? 1;
