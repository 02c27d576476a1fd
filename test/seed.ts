/**
 * One seed for every property test, so that a failure can be replayed. Override with
 * SIMILIS_SEED=<integer> to explore other seeds; the seed in use is printed by fast-check on failure.
 */
export const SEED: number = Number(process.env['SIMILIS_SEED'] ?? 20261202);
